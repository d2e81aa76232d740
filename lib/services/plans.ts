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
import { OrderRefused, planOrder, type PlannedOrder } from "../planner/order";
import type { PlanInputT, PlanT, WriteProgramsInputT } from "../schemas/plan";
import { ProgramInput, type ProgramInputT, type ProgramT } from "../schemas/program";
import { gradeByCode, gradeProfile, shearProfile } from "./catalog";
import { activeShear, createProgram } from "./programs";

/** The order's limits as a 422 naming the limit, the value and where. */
export function refusal(err: OrderRefused) {
  return invalidRequest(err.message, [{ location: "body", pointer: err.pointer, message: err.message }], {
    limit: err.limit, value: err.value, max: err.max,
  });
}

/** A pattern whose program a cut program may not hold (too many groups, say) cannot be written: say so. */
function releasabilityFindings(order: PlanInputT, planned: PlannedOrder): PlanT["findings"] {
  const findings: PlanT["findings"] = [];
  planned.patterns.forEach((p, i) => {
    const valid = ProgramInput.safeParse({
      reference: `plan/${p.key}`, shear: order.shear, grade: order.grade, thickness: order.thickness, units: order.units,
      sheet: { ...p.sheet, count: p.repeats }, cuts: p.cuts,
    });
    if (!valid.success) {
      findings.push({
        code: "pattern_not_releasable", severity: "warning", pointer: `/patterns/${i}`, actual: null,
        message: `Pattern ${p.key}'s program is outside what a cut program may hold (${valid.error.issues[0].path.join(".")}: ${valid.error.issues[0].message}); it cannot be written.`,
      });
    }
  });
  return findings;
}

/** Plan without storing: the planner's answer in the caller's units, each pattern checked by the shear core. */
export async function computePlan(em: EntityManager, shopId: string, input: PlanInputT): Promise<{ shear: ShearEntity; result: Omit<PlanT, "id" | "programs" | "createdAt"> }> {
  const [shear, grade] = await Promise.all([activeShear(em, shopId, input.shear, "plan"), gradeByCode(em, shopId, input.grade)]);
  let planned: PlannedOrder;
  try {
    planned = await planOrder(input, { shear: shearProfile(shear), grade: grade ? gradeProfile(grade) : null });
  } catch (err) {
    if (err instanceof OrderRefused) throw refusal(err);
    throw err;
  }
  const result: Omit<PlanT, "id" | "programs" | "createdAt"> = {
    ...planned,
    reference: input.reference ?? null,
    title: input.title ?? null,
    shear: input.shear,
    grade: input.grade,
    thickness: input.thickness,
    units: input.units,
    findings: [...releasabilityFindings(input, planned), ...planned.findings],
  };
  return { shear, result };
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
