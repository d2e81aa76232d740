/** How a stored plan reads: its answer with the findings that decide its release, and its summary for lists and events. */
import { type PlanEntity } from "../../entities";
import { invalidRequest } from "../errors";
import { OrderRefused } from "../planner/order-limits";
import type { PlannedOrder } from "../planner/planned";
import type { PlanOrderT, PlanSummaryT, PlanT } from "../schemas/plan";
import type { PlanResultT } from "../schemas/plan-result";
import { ProgramInputSchema } from "../schemas/program";

const iso = (d: Date | null | undefined) => d?.toISOString() ?? null;

/** The order's limits as a 422 naming the limit, the value and where. */
export function refusal(err: OrderRefused) {
  return invalidRequest(err.message, [{ location: "body", pointer: err.pointer, message: err.message }], {
    limit: err.limit,
    value: err.value,
    max: err.max,
  });
}

/** A pattern whose program a cut program may not hold (too many groups, say) cannot be written: say so. */
function releasabilityFindings(order: PlanOrderT, planned: PlannedOrder): PlanResultT["findings"] {
  const findings: PlanResultT["findings"] = [];
  planned.patterns.forEach((pattern, index) => {
    const valid = ProgramInputSchema.safeParse({
      reference: `plan/${pattern.key}`,
      shear: order.shear,
      grade: order.grade,
      thickness: order.thickness,
      units: order.units,
      sheet: { ...pattern.sheet, count: pattern.repeats },
      cuts: pattern.cuts,
    });
    if (!valid.success) {
      findings.push({
        code: "pattern_not_releasable",
        severity: "warning",
        pointer: `/patterns/${index}`,
        actual: null,
        message: `Pattern ${pattern.key}'s program is outside what a cut program may hold (${valid.error.issues[0].path.join(".")}: ${valid.error.issues[0].message}); it cannot be written.`,
      });
    }
  });
  return findings;
}

/** The planner's answer as the API shows it (with the cut-program schema's findings added). */
export function planResultOf(order: PlanOrderT, planned: PlannedOrder): PlanResultT {
  return { ...planned, findings: [...releasabilityFindings(order, planned), ...planned.findings] };
}

/** Plans stored before bounds were reported: nothing proved, said so. */
const NO_BOUNDS = {
  lowerBoundSheets: 0,
  provenFewest: false,
  bounds: { areaSheets: 0, apartSheets: null, lpSheets: null },
  method: "greedy" as const,
  methodNote: "Planned before plans reported their lower bounds.",
};

/** Results stored before strips and pieces were kept as runs read as runs of one; before bounds, as proving nothing. */
function normalised(stored: PlanResultT | null | undefined): PlanResultT | null {
  if (!stored) return null;
  return {
    ...stored,
    // plans stored before `apartSheets` was reported: not computed
    summary: {
      ...NO_BOUNDS,
      ...stored.summary,
      bounds: { ...NO_BOUNDS.bounds, ...stored.summary.bounds },
    },
    patterns: stored.patterns.map((pattern) => ({
      ...pattern,
      strips: pattern.strips.map((strip) => ({
        ...strip,
        repeat: strip.repeat ?? 1,
        pieces: strip.pieces.map((piece) => ({ ...piece, count: piece.count ?? 1 })),
      })),
    })),
  };
}

function common(plan: PlanEntity) {
  const input = plan.input;
  return {
    id: plan.id,
    status: plan.status,
    reference: plan.reference ?? null,
    title: plan.title ?? null,
    shear: plan.shear.id,
    routing: plan.routing ?? null,
    grade: input.grade,
    thickness: input.thickness,
    units: input.units,
    progress: plan.progress ?? null,
    failure: plan.failure ?? null,
    attempts: plan.attempts,
    programs: plan.programs ?? [],
    createdAt: plan.createdAt.toISOString(),
    startedAt: iso(plan.startedAt),
    finishedAt: iso(plan.finishedAt),
  };
}

export function viewPlan(plan: PlanEntity): PlanT {
  return { ...common(plan), result: normalised(plan.result) };
}

/** A plan without its patterns, for lists and events. */
export function viewPlanSummary(plan: PlanEntity): PlanSummaryT {
  const result = plan.result as { coverage?: PlanResultT["coverage"]; summary?: PlanResultT["summary"] } | null;
  return { ...common(plan), coverage: result?.coverage ?? null, summary: result?.summary ?? null };
}
