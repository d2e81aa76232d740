/**
 * Routing: a program or plan that names no shear is checked against every active shear of the
 * shop, and given the one that can cut it by the shop's rule (least capacity used, or fewest
 * released programs waiting). The answer keeps every shear's figures and the reason each other
 * shear was not chosen; when none can cut it, 422 `no-shear-can-cut` lists them.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { Shear, Shop, type ShearEntity } from "../../entities";
import { ApiError, invalidRequest } from "../errors";
import { checkOrderLimits, OrderRefused } from "../planner/order-limits";
import type { RoutingRule } from "../schemas/enums";
import type { PlanOrderT } from "../schemas/plan";
import type { ProgramInputT } from "../schemas/program";
import type { RoutingT } from "../schemas/settings";
import { checkProgram, lengthToMm, roundTo, type CheckResult, type LengthUnit } from "../shear";
import { gradeByCode, gradeProfile, shearProfile } from "./catalog";
import { readsOf } from "../db/reads";

/** The reasons shown for a shear that cannot cut: its first few errors. */
const REASONS_SHOWN = 3;

/**
 * The shear a program or plan names (by id, or by name as the catalog has it, any case), if
 * it is this shop's and not archived; else 422 pointing at `/shear`.
 */
export async function activeShear(
  em: EntityManager,
  shopId: string,
  idOrName: string,
  what = "program",
): Promise<ShearEntity> {
  const key = idOrName.trim();
  const shear = /^shr_[0-9A-Z]{26}$/.test(key)
    ? await em.findOne(Shear, { id: key, shop: shopId })
    : await em.findOne(Shear, {
        shop: shopId,
        name: { $ilike: key.replace(/[\\%_]/g, (c) => `\\${c}`) },
        archivedAt: null,
      });
  if (!shear || shear.archivedAt) {
    const message = shear ? "that shear is archived" : "no shear in this shop has that id or name";
    throw invalidRequest(`The ${what}'s shear cannot be used: ${message}.`, [
      { location: "body", pointer: "/shear", message },
    ]);
  }
  return shear;
}

/**
 * The share of the shear's capacity a check uses, in percent: the largest of the force against its
 * rating, the thickness against its most for the grade, and the longest cut against its blade.
 * Null when the check could not work out the force (no grade, no thickness).
 */
export function capacityUsedPct(check: CheckResult, bladeLengthMm: number): number | null {
  if (!check.force || !check.thickness) return null;
  const unit = check.thickness.unit as LengthUnit;
  const thicknessMm = lengthToMm(check.thickness.value, unit);
  const most = check.force.maxThicknessForGrade;
  const mostMm = lengthToMm(most.value, most.unit as LengthUnit);
  const longestMm = Math.max(0, ...check.force.byGroup.map((g) => lengthToMm(g.cutLength, unit)));
  const shares = [check.force.capacityUsedPct, mostMm > 0 ? (100 * thicknessMm) / mostMm : Infinity];
  shares.push((100 * longestMm) / bladeLengthMm);
  return roundTo(Math.max(...shares), 1);
}

interface Candidate {
  shear: ShearEntity;
  check: CheckResult;
  /** why it cannot cut; null when it can */
  refusal: string | null;
  capacity: number | null;
  released: number;
}

async function activeShears(em: EntityManager, shopId: string): Promise<ShearEntity[]> {
  return em.find(Shear, { shop: shopId, archivedAt: null }, { orderBy: { name: "asc", id: "asc" } });
}

async function releasedCounts(em: EntityManager, shearIds: string[]): Promise<Map<string, number>> {
  const rows: { shear_id: string; n: string }[] = shearIds.length
    ? await em
        .getConnection()
        .execute(
          `select shear_id, count(*) as n from programs where status = 'released' and shear_id in (${shearIds.map(() => "?").join(",")}) group by shear_id`,
          shearIds,
        )
    : [];
  return new Map(rows.map((r) => [r.shear_id, Number(r.n)]));
}

function refusalOf(check: CheckResult): string | null {
  const errors = check.findings.filter((f) => f.severity === "error");
  if (!errors.length) return null;
  const shown = errors.slice(0, REASONS_SHOWN).map((f) => f.message);
  return errors.length > REASONS_SHOWN
    ? `${shown.join(" ")} (and ${errors.length - REASONS_SHOWN} more)`
    : shown.join(" ");
}

const byCapacity = (a: Candidate, b: Candidate) => (a.capacity ?? Infinity) - (b.capacity ?? Infinity);
const byQueue = (a: Candidate, b: Candidate) => a.released - b.released;

/** The candidates in the order the rule prefers them (ties: capacity, then queue, then name as listed). */
function rank(candidates: Candidate[], rule: RoutingRule): Candidate[] {
  const order = rule === "shortest_queue" ? [byQueue, byCapacity] : [byCapacity, byQueue];
  return candidates
    .map((c, i) => ({ c, i }))
    .sort((x, y) => {
      if ((x.c.refusal === null) !== (y.c.refusal === null)) return x.c.refusal === null ? -1 : 1;
      for (const cmp of order) {
        const difference = cmp(x.c, y.c);
        if (difference !== 0) return difference;
      }
      return x.i - y.i;
    })
    .map(({ c: candidate }) => candidate);
}

function reasonNotChosen(candidate: Candidate, chosen: Candidate | null, rule: RoutingRule): string {
  if (candidate.refusal !== null) return candidate.refusal;
  if (!chosen) return "";
  const pct = (x: number | null) => (x === null ? "an unknown share" : `${x} %`);
  if (rule === "shortest_queue" && candidate.released !== chosen.released) {
    return `${candidate.released} released programs are waiting for it; ${chosen.shear.name} has ${chosen.released}.`;
  }
  if (candidate.capacity !== chosen.capacity) {
    return `It would use ${pct(candidate.capacity)} of its capacity; ${chosen.shear.name} uses ${pct(chosen.capacity)}.`;
  }
  if (candidate.released !== chosen.released) {
    return `Both use ${pct(candidate.capacity)} of their capacity, and ${candidate.released} released programs are waiting for it against ${chosen.released}.`;
  }
  return `It ties with ${chosen.shear.name}, which comes first by name.`;
}

function routingOf(ranked: Candidate[], rule: RoutingRule): RoutingT {
  const chosen = ranked[0]?.refusal === null ? ranked[0] : null;
  return {
    rule,
    chosen: chosen?.shear.id ?? null,
    shears: ranked.map((candidate) => ({
      shear: candidate.shear.id,
      name: candidate.shear.name,
      canCut: candidate.refusal === null,
      capacityUsedPct: candidate.capacity,
      releasedPrograms: candidate.released,
      reason: candidate === chosen ? null : reasonNotChosen(candidate, chosen, rule),
    })),
  };
}

export function noShearCanCut(routing: RoutingT, what: string): ApiError {
  return new ApiError(
    422,
    "no-shear-can-cut",
    "No shear of the shop can cut this",
    routing.shears.length
      ? `None of the shop's ${routing.shears.length} active shears can cut this ${what}; \`shears\` gives each one's reason.`
      : `The shop has no active shear to cut this ${what} on.`,
    { shears: routing.shears.map(({ shear, name, reason }) => ({ shear, name, reason })) },
  );
}

async function rankShears(
  em: EntityManager,
  shopId: string,
  gradeCode: string,
  judge: (shear: ShearEntity, grade: ReturnType<typeof gradeProfile> | null) => Omit<Candidate, "shear" | "released">,
) {
  const [shears, grade, shop] = await readsOf(
    em,
    () => activeShears(em, shopId),
    () => gradeByCode(em, shopId, gradeCode),
    () => em.findOneOrFail(Shop, { id: shopId }, { fields: ["routingRule"] }),
  );
  const released = await releasedCounts(
    em,
    shears.map((s) => s.id),
  );
  const candidates = shears.map((shear) => ({
    shear,
    released: released.get(shear.id) ?? 0,
    ...judge(shear, grade ? gradeProfile(grade) : null),
  }));
  const rule = shop.routingRule as RoutingRule;
  const ranked = rank(candidates, rule);
  return { ranked, routing: routingOf(ranked, rule) };
}

/**
 * Check a program that names no shear on every active shear and choose one. `allowNone` (the dry
 * run) answers with the first shear's check when none can cut it; otherwise that is a 422.
 */
export async function routeProgram(
  em: EntityManager,
  shopId: string,
  input: ProgramInputT,
  opts: { allowNone?: boolean } = {},
): Promise<{ shear: ShearEntity; check: CheckResult; routing: RoutingT }> {
  const { ranked, routing } = await rankShears(em, shopId, input.grade, (shear, grade) => {
    const check = checkProgram({ ...input, shear: shear.id }, { shear: shearProfile(shear), grade });
    return { check, refusal: refusalOf(check), capacity: capacityUsedPct(check, shear.bladeLengthMm) };
  });
  const best = ranked[0];
  if (!best || (routing.chosen === null && !opts.allowNone)) throw noShearCanCut(routing, "program");
  return { shear: best.shear, check: best.check, routing };
}

/**
 * The program a plan's sheets start with on a shear: its largest sheet ripped once at the plan's
 * narrowest blank side, which checks the force, thickness and length of cut and the backgauge's reach.
 */
function planProbe(input: PlanOrderT): ProgramInputT {
  const sheet = input.stock.reduce((a, b) => (b.length * b.width > a.length * a.width ? b : a));
  const narrowest = Math.min(...input.blanks.map((b) => Math.min(b.length, b.width)));
  return {
    reference: "routing",
    grade: input.grade,
    thickness: input.thickness,
    units: input.units,
    sheet: { length: Math.max(sheet.length, sheet.width), width: Math.min(sheet.length, sheet.width), count: 1 },
    cuts: [{ backgauge: narrowest, count: 1 }],
  };
}

/** Choose the shear for a plan that names none (422 when none can cut it); the planner's limits count too. */
export async function routePlan(
  em: EntityManager,
  shopId: string,
  input: PlanOrderT,
): Promise<{ shear: ShearEntity; routing: RoutingT }> {
  const probe = planProbe(input);
  const { ranked, routing } = await rankShears(em, shopId, input.grade, (shear, grade) => {
    const profile = shearProfile(shear);
    const check = checkProgram({ ...probe, shear: shear.id }, { shear: profile, grade });
    let refusal = refusalOf(check);
    try {
      checkOrderLimits(input, profile);
    } catch (err) {
      if (!(err instanceof OrderRefused)) throw err;
      refusal = refusal ? `${err.message} ${refusal}` : err.message;
    }
    return { check, refusal, capacity: capacityUsedPct(check, shear.bladeLengthMm) };
  });
  if (routing.chosen === null) throw noShearCanCut(routing, "plan");
  return { shear: ranked[0].shear, routing };
}
