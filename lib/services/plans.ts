/**
 * Plans: run the planner on order lines and the stock on hand for one shear, grade and
 * thickness; check every sheet pattern's cut program with the shear core; store the plan;
 * and, once, write its draft programs through the same path as any other program (checked,
 * stored, with their events), all or nothing.
 */
import { LockMode, type EntityManager } from "@mikro-orm/postgresql";
import { Plan, Shop, type PlanEntity, type ShearEntity } from "../../entities";
import { conflict, invalidRequest, notFound } from "../api/errors";
import { decodeCursor, page } from "../api/pagination";
import { planBlanks, type Plan as PlannerResult } from "../planner/plan";
import type { PlanInputT, PlanT, WriteProgramsInputT } from "../schemas/plan";
import { ProgramInput, type ProgramInputT, type ProgramT } from "../schemas/program";
import { checkProgram, type LengthUnit } from "../shear";
import { gradeByCode, gradeProfile, shearProfile } from "./catalog";
import { activeShear, createProgram } from "./programs";

const MM_PER_UNIT: Record<LengthUnit, number> = { mm: 1, in: 25.4 };
/** Grid steps tried, finest last: whole units, halves … 1/64 in, tenths, hundredths, thousandths. */
const GRIDS: Record<LengthUnit, number[]> = { mm: [1, 2, 10, 100], in: [1, 2, 4, 8, 16, 32, 64, 10, 100, 1000] };
/** The planner's knapsack runs along the sheet in grid steps; this many steps bounds its time and memory. */
export const MAX_GRID_STEPS = 60_000;

const round = (v: number, d = 4) => Math.round(v * 10 ** d) / 10 ** d;
const pct = (v: number) => round(v * 100, 2);

/** The coarsest grid on which every length of the request lies exactly. */
function gridFor(input: PlanInputT): number {
  const lengths: { v: number; pointer: string }[] = [];
  input.stock.forEach((s, i) => lengths.push({ v: s.length, pointer: `/stock/${i}/length` }, { v: s.width, pointer: `/stock/${i}/width` }));
  input.blanks.forEach((b, i) => lengths.push({ v: b.length, pointer: `/blanks/${i}/length` }, { v: b.width, pointer: `/blanks/${i}/width` }));
  if (input.options?.trim) lengths.push({ v: input.options.trim, pointer: "/options/trim" });
  const longest = Math.max(...input.stock.map((s) => Math.max(s.length, s.width)));
  const onGrid = (v: number, g: number) => Math.abs(v * g - Math.round(v * g)) < 1e-6;
  for (const g of GRIDS[input.units]) {
    if (longest * g > MAX_GRID_STEPS) break;
    if (lengths.every((l) => onGrid(l.v, g))) return g;
  }
  const finest = GRIDS[input.units].filter((g) => longest * g <= MAX_GRID_STEPS).pop() ?? 1;
  const off = lengths.find((l) => !onGrid(l.v, finest)) ?? lengths[0];
  const step = input.units === "mm" ? `${1 / finest} mm` : finest === 64 ? "1/64 in" : `${1 / finest} in`;
  throw invalidRequest(`The planner works on a ${step} grid for sheets this size; ${off.v} is not a multiple of it.`, [
    { location: "body", pointer: off.pointer, message: `must be a multiple of ${step}` },
  ]);
}

const patternKey = (i: number): string => (i < 26 ? String.fromCharCode(65 + i) : `${patternKey(Math.floor(i / 26) - 1)}${String.fromCharCode(65 + (i % 26))}`);

/** Plan without storing: the planner's answer in the caller's units, each pattern checked by the shear core. */
export async function computePlan(em: EntityManager, shopId: string, input: PlanInputT): Promise<{ shear: ShearEntity; result: Omit<PlanT, "id" | "programs" | "createdAt"> }> {
  const [shear, grade] = await Promise.all([activeShear(em, shopId, input.shear, "plan"), gradeByCode(em, shopId, input.grade)]);
  const profile = shearProfile(shear);
  const gradeP = grade ? gradeProfile(grade) : null;
  const g = gridFor(input);
  const unitMm = MM_PER_UNIT[input.units];
  const toGrid = (v: number) => Math.round(v * g);
  const fromGrid = (v: number) => round(v / g, 9); // exact on every grid (1/64 in = 0.015625); 9 places only drop float noise
  const o = input.options ?? {};
  const canTurn = (b: PlanInputT["blanks"][number]) => b.canTurn ?? true;
  const reusable = o.reusableOffcut ? { length: Math.ceil(o.reusableOffcut.length * g - 1e-9), width: Math.ceil(o.reusableOffcut.width * g - 1e-9) } : null;
  const planned: PlannerResult = planBlanks(
    input.stock.map((s) => ({ length: toGrid(s.length), width: toGrid(s.width), count: s.count ?? null })),
    input.blanks.map((b) => ({ label: b.label, length: toGrid(b.length), width: toGrid(b.width), quantity: b.quantity, canTurn: canTurn(b) })),
    {
      objective: o.objective ?? "fewest_sheets",
      trim: toGrid(o.trim ?? 0),
      overProductionPct: o.overProductionPct ?? 0,
      reusable,
      offcutsAsStock: o.offcutsAsStock ?? false,
      limits: {
        bladeLength: Math.floor((profile.bladeLengthMm / unitMm) * g + 1e-9),
        backgaugeMin: Math.ceil((profile.backgaugeMinMm / unitMm) * g - 1e-9),
        backgaugeMax: Math.floor((profile.backgaugeMaxMm / unitMm) * g + 1e-9),
      },
      mmPerUnit: unitMm / g,
      show: (v) => `${fromGrid(v)} ${input.units}`,
    },
  );

  let estimateSeconds = 0;
  const findings: PlanT["findings"] = [];
  const patterns: PlanT["patterns"] = planned.patterns.map((p, i) => {
    const key = patternKey(i);
    const cuts = p.cuts.map((c) => ({ ...c, backgauge: fromGrid(c.backgauge) }));
    const program = {
      reference: key, shear: input.shear, grade: input.grade, thickness: input.thickness, units: input.units,
      sheet: { length: fromGrid(p.length), width: fromGrid(p.width), count: p.repeats }, cuts,
    };
    const check = checkProgram(program, { shear: profile, grade: gradeP });
    const valid = ProgramInput.safeParse({ ...program, reference: `plan/${key}` });
    if (!valid.success) {
      findings.push({
        code: "pattern_not_releasable", severity: "warning", pointer: `/patterns/${i}`, actual: null,
        message: `Pattern ${key}'s program is outside what a cut program may hold (${valid.error.issues[0].path.join(".")}: ${valid.error.issues[0].message}); it cannot be written.`,
      });
    }
    estimateSeconds += check.estimate?.seconds.total ?? 0;
    if (check.validation === "fail") {
      findings.push({
        code: "pattern_not_releasable", severity: "warning", pointer: `/patterns/${i}`, actual: null,
        message: `Pattern ${key}'s program has errors the shear core will not release (${[...new Set(check.findings.filter((f) => f.severity === "error").map((f) => f.code))].join(", ")}).`,
      });
    }
    return {
      key,
      stock: p.stock,
      sheet: { length: fromGrid(p.length), width: fromGrid(p.width) },
      rotated: p.rotated,
      repeats: p.repeats,
      utilisationPct: pct(p.utilisation),
      strips: p.strips.map((st) => ({
        y: fromGrid(st.y),
        height: fromGrid(st.height),
        pieces: st.pieces.map((pc) => ({
          blank: pc.blank, label: input.blanks[pc.blank].label, x: fromGrid(pc.x), y: fromGrid(pc.y), length: fromGrid(pc.length), width: fromGrid(pc.width), turned: pc.turned,
        })),
      })),
      offcuts: p.offcuts.map((x) => ({ x: fromGrid(x.x), y: fromGrid(x.y), length: fromGrid(x.length), width: fromGrid(x.width), kind: x.kind, reusable: x.reusable })),
      strokes: p.strokes,
      turns: p.turns,
      cuts,
      check: { validation: check.validation, findings: check.findings, estimate: check.estimate },
    };
  });

  const short = input.blanks.map(() => 0);
  for (const u of planned.unplaced) {
    short[u.blank] += u.quantity;
    findings.push({
      code: u.kind === "unplaceable" ? "blank_unplaceable" : "stock_short",
      severity: "error",
      pointer: `/blanks/${u.blank}`,
      actual: u.quantity,
      message: u.kind === "unplaceable"
        ? `"${input.blanks[u.blank].label}": ${u.quantity} not planned. ${u.reason}.`
        : `"${input.blanks[u.blank].label}": ${u.quantity} not planned: not enough stock on hand.`,
    });
  }
  planned.extra.forEach((n, i) => {
    if (n > 0) findings.push({ code: "over_production", severity: "warning", pointer: `/blanks/${i}`, actual: n, message: `"${input.blanks[i].label}": ${n} more than the ${input.blanks[i].quantity} asked (within the ${o.overProductionPct ?? 0} % allowance).` });
  });
  const trim = o.trim ?? 0;
  const travel = { min: profile.backgaugeMinMm / unitMm, max: profile.backgaugeMaxMm / unitMm };
  if (trim > 0 && (trim < travel.min - 1e-9 || trim > travel.max + 1e-9)) {
    findings.push({
      code: "trim_out_of_travel", severity: "error", pointer: "/options/trim", actual: trim,
      message: `A trim of ${trim} ${input.units} is outside this shear's backgauge travel (${round(travel.min, 4)} to ${round(travel.max, 4)} ${input.units}): the trim cut cannot be gauged, and the programs will not release.`,
    });
  }
  for (const s of planned.unusableStock) {
    const st = input.stock[s];
    const why = Math.max(st.length, st.width) <= trim ? `is no wider than the ${trim} ${input.units} trim` : `is longer than this shear's blade both ways round`;
    findings.push({ code: "stock_unusable", severity: "warning", pointer: `/stock/${s}`, actual: null, message: `Stock ${st.length} × ${st.width} ${input.units} ${why}; it was not used.` });
  }

  const used = input.stock.map(() => 0);
  for (const p of planned.patterns) used[p.stock] += p.repeats;
  const asked = input.blanks.reduce((s, b) => s + b.quantity, 0);
  const producedTotal = planned.produced.reduce((s, n) => s + n, 0);
  const extraTotal = planned.extra.reduce((s, n) => s + n, 0);
  const shortTotal = short.reduce((s, n) => s + n, 0);
  return {
    shear,
    result: {
      status: shortTotal > 0 ? "partial" : "complete",
      reference: input.reference ?? null,
      title: input.title ?? null,
      shear: input.shear,
      grade: input.grade,
      thickness: input.thickness,
      units: input.units,
      stock: input.stock.map((s, i) => ({ ...s, count: s.count ?? null, used: used[i] })),
      blanks: input.blanks.map((b, i) => ({ ...b, canTurn: canTurn(b), planned: planned.produced[i], extra: planned.extra[i], short: short[i] })),
      options: {
        objective: o.objective ?? "fewest_sheets",
        trim: o.trim ?? 0,
        overProductionPct: o.overProductionPct ?? 0,
        reusableOffcut: o.reusableOffcut ?? null,
        offcutsAsStock: o.offcutsAsStock ?? false,
      },
      summary: {
        sheets: planned.sheetsUsed,
        patterns: planned.patterns.length,
        blanksAsked: asked,
        blanksPlanned: producedTotal,
        extra: extraTotal,
        short: shortTotal,
        utilisationPct: pct(planned.utilisation),
        netUtilisationPct: pct(planned.netUtilisation),
        strokes: planned.strokes,
        turns: planned.turns,
        estimateSeconds: round(estimateSeconds, 1),
      },
      patterns,
      reusableOffcuts: planned.reusable.map((r) => ({ length: fromGrid(r.length), width: fromGrid(r.width), count: r.count })),
      findings,
    },
  };
}

export function viewPlan(p: PlanEntity): PlanT {
  return { id: p.id, ...(p.result as Omit<PlanT, "id" | "programs" | "createdAt">), programs: p.programs ?? [], createdAt: p.createdAt.toISOString() };
}

export async function createPlan(em: EntityManager, shopId: string, input: PlanInputT): Promise<PlanT> {
  const { shear, result } = await computePlan(em, shopId, input);
  const plan = em.create(Plan, {
    shop: em.getReference(Shop, shopId), shear, reference: input.reference ?? null, title: input.title ?? null,
    status: result.status, input: input as unknown as Record<string, unknown>, result: result as unknown as Record<string, unknown>,
  });
  await em.flush();
  return viewPlan(plan);
}

export async function getPlan(em: EntityManager, shopId: string, id: string): Promise<PlanEntity> {
  const plan = await em.findOne(Plan, { id, shop: shopId });
  if (!plan) throw notFound("plan");
  return plan;
}

export async function listPlans(em: EntityManager, shopId: string, f: { limit: number; cursor?: string }) {
  const before = decodeCursor(f.cursor);
  const rows = await em.find(Plan, { shop: shopId, ...(before ? { id: { $lt: before } } : {}) }, { orderBy: { id: "desc" }, limit: f.limit + 1 });
  const p = page(rows, f.limit);
  return { data: p.data.map(viewPlan), next_cursor: p.next_cursor };
}

/** Write one draft program per sheet pattern (its repeats are the program's `sheet.count`), all or nothing, once. */
export async function writePrograms(em: EntityManager, shopId: string, id: string, opts: WriteProgramsInputT = {}): Promise<{ plan: string; data: ProgramT[] }> {
  const plan = await getPlan(em, shopId, id);
  if (plan.programs?.length) {
    throw conflict("This plan's programs are already written.", { programs: plan.programs });
  }
  const view = viewPlan(plan);
  if (!view.patterns.length) throw conflict("This plan has no sheet patterns to write: nothing could be placed.", { findings: view.findings });
  const prefix = opts.referencePrefix ?? plan.reference ?? plan.id;
  return em.transactional(async (tx) => {
    // One writer at a time per plan: a second request waits here, then finds the programs written.
    const row = await tx.findOneOrFail(Plan, { id: plan.id }, { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });
    if (row.programs?.length) throw conflict("This plan's programs are already written.", { programs: row.programs });
    const written: ProgramT[] = [];
    for (const p of view.patterns) {
      const input: ProgramInputT = {
        reference: `${prefix}/${p.key}`,
        title: `${view.title ?? view.reference ?? "Plan"}: pattern ${p.key}, ${p.repeats} sheet${p.repeats > 1 ? "s" : ""}`.slice(0, 200),
        shear: view.shear,
        grade: view.grade,
        thickness: view.thickness,
        units: view.units,
        sheet: { length: p.sheet.length, width: p.sheet.width, count: p.repeats },
        cuts: p.cuts,
        ...(opts.priority !== undefined ? { priority: opts.priority } : {}),
        ...(opts.dueAt ? { dueAt: opts.dueAt } : {}),
        metadata: { ...(opts.metadata ?? {}), plan: plan.id, pattern: p.key },
      };
      const valid = ProgramInput.safeParse(input);
      if (!valid.success) throw conflict(`Pattern ${p.key} cannot be written as a cut program: ${valid.error.issues[0].path.join(".")}: ${valid.error.issues[0].message}.`, { pattern: p.key });
      written.push(await createProgram(tx, shopId, valid.data));
    }
    row.programs = written.map((w, i) => ({ pattern: view.patterns[i].key, id: w.id }));
    await tx.flush();
    return { plan: plan.id, data: written };
  });
}
