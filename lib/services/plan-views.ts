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
  planned.patterns.forEach((p, i) => {
    const valid = ProgramInputSchema.safeParse({
      reference: `plan/${p.key}`,
      shear: order.shear,
      grade: order.grade,
      thickness: order.thickness,
      units: order.units,
      sheet: { ...p.sheet, count: p.repeats },
      cuts: p.cuts,
    });
    if (!valid.success) {
      findings.push({
        code: "pattern_not_releasable",
        severity: "warning",
        pointer: `/patterns/${i}`,
        actual: null,
        message: `Pattern ${p.key}'s program is outside what a cut program may hold (${valid.error.issues[0].path.join(".")}: ${valid.error.issues[0].message}); it cannot be written.`,
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
  bounds: { areaSheets: 0, lpSheets: null },
  method: "greedy" as const,
  methodNote: "Planned before plans reported their lower bounds.",
};

/** Results stored before strips and pieces were kept as runs read as runs of one; before bounds, as proving nothing. */
function normalised(result: Record<string, unknown> | null | undefined): PlanResultT | null {
  if (!result) return null;
  const r = result as unknown as PlanResultT;
  return {
    ...r,
    summary: { ...NO_BOUNDS, ...r.summary },
    patterns: r.patterns.map((p) => ({
      ...p,
      strips: p.strips.map((s) => ({
        ...s,
        repeat: s.repeat ?? 1,
        pieces: s.pieces.map((piece) => ({ ...piece, count: piece.count ?? 1 })),
      })),
    })),
  };
}

function common(p: PlanEntity) {
  const input = p.input;
  return {
    id: p.id,
    status: p.status as PlanT["status"],
    reference: p.reference ?? null,
    title: p.title ?? null,
    shear: p.shear.id,
    routing: p.routing ?? null,
    grade: input.grade,
    thickness: input.thickness,
    units: input.units,
    progress: p.progress ?? null,
    failure: (p.failure as PlanT["failure"]) ?? null,
    attempts: p.attempts,
    programs: p.programs ?? [],
    createdAt: p.createdAt.toISOString(),
    startedAt: iso(p.startedAt),
    finishedAt: iso(p.finishedAt),
  };
}

export function viewPlan(p: PlanEntity): PlanT {
  return { ...common(p), result: normalised(p.result) };
}

/** A plan without its patterns, for lists and events. */
export function viewPlanSummary(p: PlanEntity): PlanSummaryT {
  const result = p.result as { coverage?: PlanResultT["coverage"]; summary?: PlanResultT["summary"] } | null;
  return { ...common(p), coverage: result?.coverage ?? null, summary: result?.summary ?? null };
}
