/**
 * Plans: an order's blanks laid out on the stock on hand for one shear, grade and thickness.
 * The web process only checks an order (its schema, the shear, the planner's limits), stores
 * it as `queued` and queues it; a worker computes it (lib/worker/plan-jobs.ts). Previews are
 * computed by a worker too, while the caller waits, and stored nowhere. Once complete, a
 * plan's draft programs are written through the same path as any other program (checked,
 * stored, with their events), all or nothing, once.
 */
import { LockMode, UniqueConstraintViolationException, type EntityManager } from "@mikro-orm/postgresql";
import { Plan, Shop, type PlanEntity } from "../../entities";
import { ApiError, conflict, notFound } from "../errors";
import { containing, findPage } from "../db/paging";
import { waitForNotification } from "../db/notify";
import { checkOrderLimits, OrderRefused } from "../planner/order-limits";
import type { PlanContext, PlannedOrder } from "../planner/planned";
import { dequeuePlan, enqueuePlan, previewOnWorker, PreviewTimeout } from "../queue/plan-queue";
import type { PlanInputT, PlanOrderT, PlanPreviewT, PlanT, WriteProgramsInputT } from "../schemas/plan";

import { ProgramInputSchema, type ProgramInputT, type ProgramT } from "../schemas/program";
import { checkPrograms, storePrograms, type Checked } from "./program-create";
import { gradeByCode, gradeProfile, shearProfile } from "./catalog";
import { recordEvent } from "./events";
import { activeShear, routePlan } from "./routing";
import { drawStock, reservePattern } from "./plan-stock";
import type { RoutingT } from "../schemas/settings";
import { refusal, planResultOf, viewPlan, viewPlanSummary } from "./plan-views";

/** How long a request waits for Redis to take a plan's job before leaving it to the sweeper. */
const ENQUEUE_WAIT_MS = 2_000;

/** Notified with a plan's id when it ends (complete, failed, cancelled): `Prefer: wait` listens. */
export const PLAN_DONE_CHANNEL = "shearwire_plan_done";
/** Notified with a plan's id when it is cancelled: the worker computing it stops. */
export const PLAN_CANCEL_CHANNEL = "shearwire_plan_cancel";
/** The longest `Prefer: wait` honoured, in seconds. */
export const MAX_WAIT_SECONDS = 10;

const FINAL = new Set(["complete", "failed", "cancelled"]);
/** The shear and grade of an order, checked, and the order's limits (cheap: runs on the web process). */
async function checkedOrder(
  em: EntityManager,
  shopId: string,
  input: PlanInputT,
): Promise<{ order: PlanOrderT; shearId: string; context: PlanContext; routing: RoutingT | null }> {
  const grade = await gradeByCode(em, shopId, input.grade);
  const order = await drawStock(em, shopId, input, grade);
  const routed = order.shear === undefined ? await routePlan(em, shopId, order) : null;
  const shear = routed?.shear ?? (await activeShear(em, shopId, order.shear ?? "", "plan"));
  const context = { shear: shearProfile(shear), grade: grade ? gradeProfile(grade) : null };
  order.shear = shear.id; // stored by id, however it was named
  try {
    checkOrderLimits(order, context.shear);
  } catch (err) {
    if (err instanceof OrderRefused) throw refusal(err);
    throw err;
  }
  return { order, shearId: shear.id, context, routing: routed?.routing ?? null };
}

/**
 * Store an order as a queued plan and queue it for a worker; answers at once. `queue: false`
 * stores it only (the demo seed plans it itself; the worker's sweeper queues any left behind).
 */
export async function createPlan(
  em: EntityManager,
  shopId: string,
  input: PlanInputT,
  opts: { queue?: boolean } = {},
): Promise<PlanT> {
  const { order, shearId, routing } = await checkedOrder(em, shopId, input);
  const plan = em.create(Plan, {
    shop: em.getReference(Shop, shopId),
    shear: shearId,
    routing,
    reference: input.reference ?? null,
    title: input.title ?? null,
    status: "queued",
    input: order,
    result: null,
    progress: null,
    failure: null,
  });
  await em.flush();
  // Queued after the row is stored; if Redis is away or slow, the worker's sweeper queues it later.
  if (opts.queue !== false) {
    await enqueuePlan(plan.id, ENQUEUE_WAIT_MS).catch((err) =>
      console.error(`[plans] queueing ${plan.id} failed; the sweeper will:`, err.message),
    );
  }
  return viewPlan(plan);
}

export async function findPlan(em: EntityManager, shopId: string, id: string): Promise<PlanEntity> {
  const plan = await em.findOne(Plan, { id, shop: shopId }, { refresh: true });
  if (!plan) throw notFound("plan");
  return plan;
}

export async function getPlan(em: EntityManager, shopId: string, id: string): Promise<PlanT> {
  return viewPlan(await findPlan(em, shopId, id));
}

/** The plan once it has ended, or as it is after `seconds` (whichever comes first). */
export async function waitForPlan(em: EntityManager, shopId: string, id: string, seconds: number): Promise<PlanT> {
  const deadline = Date.now() + Math.min(seconds, MAX_WAIT_SECONDS) * 1000;
  for (;;) {
    // Listen first, then look, so an ending in between still wakes this wait.
    const left = deadline - Date.now();
    const stop = new AbortController();
    const heard = left > 0 ? waitForNotification(PLAN_DONE_CHANNEL, id, Math.min(left, 1_000), stop.signal) : null;
    const plan = await findPlan(em.fork(), shopId, id);
    if (FINAL.has(plan.status) || !heard) {
      stop.abort();
      return viewPlan(plan);
    }
    await heard;
  }
}

export async function listPlans(
  em: EntityManager,
  shopId: string,
  filter: { limit: number; cursor?: string; search?: string },
) {
  const like = filter.search ? containing(filter.search) : null;
  const where = {
    shop: shopId,
    ...(like ? { $or: [{ reference: { $ilike: like } }, { title: { $ilike: like } }] } : {}),
  };
  return findPage(em, Plan, where, filter, viewPlanSummary);
}

/** Stop a queued or running plan; a worker computing it stops at once. */
export async function cancelPlan(em: EntityManager, shopId: string, id: string): Promise<PlanT> {
  const plan = await findPlan(em, shopId, id);
  const cancelled = await em.transactional(async (tx) => {
    const row = await tx.findOneOrFail(Plan, { id: plan.id }, { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });
    if (FINAL.has(row.status)) {
      throw conflict(`A ${row.status} plan cannot be cancelled.`, { currentStatus: row.status });
    }
    row.status = "cancelled";
    row.finishedAt = new Date();
    await tx.flush();
    await recordEvent(tx, shopId, "plan.cancelled", row.id, { plan: viewPlanSummary(row) });
    await tx.execute(`select pg_notify('${PLAN_CANCEL_CHANNEL}', ?), pg_notify('${PLAN_DONE_CHANNEL}', ?)`, [
      row.id,
      row.id,
    ]);
    return row;
  });
  await dequeuePlan(plan.id).catch(() => undefined);
  return viewPlan(cancelled);
}

/** Plan without storing anything: a worker computes it while the caller waits (under the same limits). */
export async function previewPlan(em: EntityManager, shopId: string, input: PlanInputT): Promise<PlanPreviewT> {
  const { order, shearId, context, routing } = await checkedOrder(em, shopId, input);
  let planned: PlannedOrder;
  try {
    planned = await previewOnWorker(order, context);
  } catch (err) {
    if (err instanceof PreviewTimeout) {
      throw new ApiError(
        503,
        "planning-unavailable",
        "No planner answered in time",
        `${err.message} Store the plan instead (POST /plans) and read it when it is done.`,
        {},
        { "Retry-After": "30" },
      );
    }
    // The worker's refusals and failures (a time limit, say) come back as messages of ours.
    throw new ApiError(422, "plan-failed", "The plan could not be computed", (err as Error).message);
  }
  return {
    ...planResultOf(order, planned),
    reference: input.reference ?? null,
    title: input.title ?? null,
    shear: shearId,
    routing,
    grade: input.grade,
    thickness: input.thickness,
    units: input.units,
  };
}

/** Write one draft program per sheet pattern (its repeats are the program's `sheet.count`), all or nothing, once. */
export async function writePrograms(
  em: EntityManager,
  shopId: string,
  id: string,
  opts: WriteProgramsInputT = {},
): Promise<{ plan: string; data: ProgramT[] }> {
  const plan = await findPlan(em, shopId, id);
  if (plan.programs?.length) {
    throw conflict("This plan's programs are already written.", { programs: plan.programs });
  }
  const view = viewPlan(plan);
  if (view.status !== "complete" || !view.result) {
    throw conflict(`This plan is ${view.status}: programs are written from a complete plan.`, {
      currentStatus: view.status,
    });
  }
  const result = view.result;
  if (!result.patterns.length)
    throw conflict("This plan has no sheet patterns to write: nothing could be placed.", { findings: result.findings });
  const prefix = opts.referencePrefix ?? plan.reference ?? plan.id;
  return em.transactional(async (tx) => {
    // One writer at a time per plan: a second request waits here, then finds the programs written.
    const row = await tx.findOneOrFail(Plan, { id: plan.id }, { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });
    if (row.programs?.length) throw conflict("This plan's programs are already written.", { programs: row.programs });
    const inputs = result.patterns.map((pattern): ProgramInputT => {
      const input: ProgramInputT = {
        reference: `${prefix}/${pattern.key}`,
        title:
          `${view.title ?? view.reference ?? "Plan"}: pattern ${pattern.key}, ${pattern.repeats} sheet${pattern.repeats > 1 ? "s" : ""}`.slice(
            0,
            200,
          ),
        shear: view.shear,
        grade: view.grade,
        thickness: view.thickness,
        units: view.units,
        sheet: { length: pattern.sheet.length, width: pattern.sheet.width, count: pattern.repeats },
        cuts: pattern.cuts,
        ...(opts.priority !== undefined ? { priority: opts.priority } : {}),
        ...(opts.dueAt ? { dueAt: opts.dueAt } : {}),
        metadata: { ...(opts.metadata ?? {}), plan: plan.id, pattern: pattern.key },
      };
      const valid = ProgramInputSchema.safeParse(input);
      if (!valid.success)
        throw conflict(
          `Pattern ${pattern.key} cannot be written as a cut program: ${valid.error.issues[0].path.join(".")}: ${valid.error.issues[0].message}.`,
          { pattern: pattern.key },
        );
      return valid.data;
    });
    const checked = await checkPrograms(tx, shopId, inputs);
    const refused = checked.find((c) => c instanceof ApiError);
    if (refused) throw refused;
    const written = await storePrograms(tx, shopId, checked as Checked[]).catch((err) => {
      if (err instanceof UniqueConstraintViolationException)
        throw conflict("A program with one of these references was created meanwhile; nothing was written.");
      throw err;
    });
    // Each pattern's sheets are held for its program, in the same transaction: all or nothing.
    for (const [index, program] of written.entries())
      await reservePattern(tx, shopId, row.input, result.patterns[index], program.id);
    row.programs = written.map((w, i) => ({ pattern: result.patterns[i].key, id: w.id }));
    await tx.flush();
    return { plan: plan.id, data: written };
  });
}
