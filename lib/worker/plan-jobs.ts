/**
 * Planning in the worker: a stored plan is taken (`queued` or a lost `running` → `running`,
 * one more attempt), computed in a worker thread under a wall-clock limit, and finished
 * (`complete` with its answer, or `failed` with a reason) with its event in one transaction,
 * unless it was cancelled meanwhile. Progress is written as the planner reports it. A worker
 * killed mid-plan loses the job's lock; BullMQ hands the job to another worker (or to this
 * one after a restart), which plans it again from the start: the planner is deterministic,
 * so the answer is the same.
 */
import { Worker as Thread } from "node:worker_threads";
import type { EntityManager } from "@mikro-orm/postgresql";
import { Plan, Shear } from "../../entities";
import { waitForNotification } from "../db/notify";
import type { Order } from "../planner/order";
import type { PlanContext, PlannedOrder } from "../planner/planned";
import type { PlanOrderT } from "../schemas/plan";
import { gradeByCode, gradeProfile, shearProfile } from "../services/catalog";
import { recordEvent } from "../services/events";
import { PLAN_CANCEL_CHANNEL, PLAN_DONE_CHANNEL } from "../services/plans";
import { planResultOf, viewPlanSummary } from "../services/plan-views";
import { enqueuePlan } from "../queue/plan-queue";

export type PlanOutcome =
  | { kind: "complete"; result: PlannedOrder }
  | { kind: "failed"; reason: "time_limit" | "out_of_memory" | "worker_lost" | "error"; message: string }
  | { kind: "cancelled" };

type Progress = { patterns: number; piecesPlaced: number; piecesWanted: number };

/** Memory one plan may use, in MiB (a runaway plan ends alone, not with the worker). */
const THREAD_HEAP_MB = Number(process.env.SHEARWIRE_PLAN_HEAP_MB ?? 1536);

/** Plan an order in a worker thread; ends it at the time limit or when `signal` aborts. */
export function planInThread(
  order: Order,
  context: PlanContext,
  opts: { timeLimitMs: number; onProgress?: (progress: Progress) => void; signal?: AbortSignal },
): Promise<PlanOutcome> {
  return new Promise((resolve) => {
    // plan-thread-boot.mjs registers tsx's loader in the new thread, then loads plan-thread.ts.
    const thread = new Thread(new URL("./plan-thread-boot.mjs", import.meta.url), {
      workerData: { order, context },
      resourceLimits: { maxOldGenerationSizeMb: THREAD_HEAP_MB },
    });
    let settled = false;
    const finish = (outcome: PlanOutcome) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      opts.signal?.removeEventListener("abort", onAbort);
      void thread.terminate();
      resolve(outcome);
    };
    const seconds = Math.round(opts.timeLimitMs / 1000);
    const timer = setTimeout(
      () =>
        finish({
          kind: "failed",
          reason: "time_limit",
          message: `The plan took longer than this install's limit of ${seconds} s and was stopped. Plan fewer blank types or pieces at once, or coarser sizes.`,
        }),
      opts.timeLimitMs,
    );
    const onAbort = () => finish({ kind: "cancelled" });
    if (opts.signal?.aborted) return onAbort();
    opts.signal?.addEventListener("abort", onAbort, { once: true });
    thread.on("message", (message: { kind: string; progress?: Progress; result?: PlannedOrder; message?: string }) => {
      if (message.kind === "progress" && message.progress) opts.onProgress?.(message.progress);
      else if (message.kind === "result") finish({ kind: "complete", result: message.result! });
      else if (message.kind === "error")
        finish({ kind: "failed", reason: "error", message: `The planner stopped: ${message.message}` });
    });
    thread.on("error", (err: Error & { code?: string }) => {
      const memory = err.code === "ERR_WORKER_OUT_OF_MEMORY";
      finish(
        memory
          ? {
              kind: "failed",
              reason: "out_of_memory",
              message: `The plan needed more than ${THREAD_HEAP_MB} MiB of memory and was stopped. Plan fewer blank types or pieces at once.`,
            }
          : { kind: "failed", reason: "error", message: `The planner stopped: ${err.message}` },
      );
    });
    thread.on("exit", (code) =>
      finish({ kind: "failed", reason: "error", message: `The planner ended without an answer (exit ${code}).` }),
    );
  });
}

/** The order and the catalog as the plan's shear and grade are now. */
async function contextOf(
  em: EntityManager,
  plan: { shop: { id: string }; shear: { id: string }; input: PlanOrderT },
): Promise<{ order: Order; context: PlanContext }> {
  const order = plan.input;
  const shear = await em.findOneOrFail(Shear, { id: plan.shear.id });
  const grade = await gradeByCode(em, plan.shop.id, order.grade);
  return { order, context: { shear: shearProfile(shear), grade: grade ? gradeProfile(grade) : null } };
}

/** Take a plan for computing: only a queued one, or a running one whose worker was lost. */
async function take(em: EntityManager, planId: string): Promise<boolean> {
  const rows = await em.getConnection().execute<{ id: string }[]>(
    `update plans set status = 'running', attempts = attempts + 1, started_at = coalesce(started_at, now()), updated_at = now()
     where id = ? and status in ('queued', 'running') returning id`,
    [planId],
  );
  return rows.length === 1;
}

const PROGRESS_EVERY_MS = 500;

/** Compute a stored plan and store the outcome (the worker's job; `npm run up`'s seed calls it too). */
export async function processStoredPlan(
  fork: () => EntityManager,
  planId: string,
  timeLimitMs: number,
): Promise<PlanOutcome["kind"] | "skipped"> {
  if (!(await take(fork(), planId))) return "skipped";
  const em = fork();
  const plan = await em.findOneOrFail(Plan, { id: planId });
  const { order, context } = await contextOf(em, plan);

  // Cancelled while running: PostgreSQL tells us (NOTIFY on commit); progress writes notice too.
  const cancelled = new AbortController();
  const stopListening = new AbortController();
  void waitForNotification(PLAN_CANCEL_CHANNEL, planId, timeLimitMs + 5_000, stopListening.signal).then(
    (heard) => heard && cancelled.abort(),
  );
  let lastWrite = 0;
  let writing: Promise<unknown> = Promise.resolve();
  const onProgress = (progress: Progress) => {
    const now = Date.now();
    if (now - lastWrite < PROGRESS_EVERY_MS) return;
    lastWrite = now;
    writing = writing.then(async () => {
      const rows = await fork()
        .getConnection()
        .execute<{ id: string }[]>(
          "update plans set progress = ?, updated_at = now() where id = ? and status = 'running' returning id",
          [JSON.stringify(progress), planId],
        )
        .catch(() => [{ id: planId }]);
      if (!rows.length) cancelled.abort(); // no longer running: cancelled
    });
  };

  const outcome = await planInThread(order, context, { timeLimitMs, onProgress, signal: cancelled.signal });
  stopListening.abort();
  await writing;
  if (outcome.kind === "cancelled") return "cancelled";
  await finishPlan(fork(), planId, outcome);
  return outcome.kind;
}

/** Store a finished plan and its event, in one transaction, unless it was cancelled meanwhile. */
export async function finishPlan(
  em: EntityManager,
  planId: string,
  outcome: Exclude<PlanOutcome, { kind: "cancelled" }>,
) {
  await em.transactional(async (tx) => {
    const plan = await tx.findOne(Plan, { id: planId, status: "running" }, { populate: ["shop"] });
    if (!plan) return; // cancelled (or finished by another worker) meanwhile
    plan.finishedAt = new Date();
    if (outcome.kind === "complete") {
      const result = planResultOf(plan.input, outcome.result);
      plan.status = "complete";
      plan.result = result;
      plan.progress = {
        patterns: result.summary.patterns,
        piecesPlaced: result.summary.blanksPlanned - result.summary.extra,
        piecesWanted: result.summary.blanksAsked,
      };
      plan.failure = null;
    } else {
      plan.status = "failed";
      plan.failure = { reason: outcome.reason, message: outcome.message };
    }
    await tx.flush();
    await recordEvent(tx, plan.shop.id, outcome.kind === "complete" ? "plan.completed" : "plan.failed", plan.id, {
      plan: viewPlanSummary(plan),
    });
    await tx.execute(`select pg_notify('${PLAN_DONE_CHANNEL}', ?)`, [plan.id]);
  });
}

/** A plan whose job stalled too often (its workers kept dying): failed, with the reason. */
export async function failLostPlan(em: EntityManager, planId: string, message: string) {
  await finishPlan(em, planId, { kind: "failed", reason: "worker_lost", message });
}

/**
 * Plans whose job is gone (Redis lost it, or the web process could not queue it): queued for
 * a while, or running with no progress written for a long time. Queuing them again is safe:
 * a plan's job id is the plan's id.
 */
export async function requeueOrphanPlans(em: EntityManager, staleMs: number): Promise<string[]> {
  const rows = await em
    .getConnection()
    .execute<{ id: string }[]>(
      `select id from plans where (status = 'queued' and created_at < ?) or (status = 'running' and updated_at < ?) order by id limit 100`,
      [new Date(Date.now() - 30_000), new Date(Date.now() - staleMs)],
    );
  for (const { id } of rows) await enqueuePlan(id);
  return rows.map((r) => r.id);
}
