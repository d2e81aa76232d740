/**
 * The planning queue (BullMQ on Redis): one job per stored plan (its id is the job's id, so a
 * plan is queued once however often it is asked), and previews, which store nothing and
 * answer through the job's return value. Nothing here computes: workers do (plan-jobs.ts).
 */
import { Queue, QueueEvents } from "bullmq";
import { randomUUID } from "node:crypto";
import type { Order } from "../planner/order";
import type { PlanContext, PlannedOrder } from "../planner/planned";
import { bullConnection, within } from "./queue";

export const PLAN_QUEUE = "shearwire-plans";

export type PlanJob = { kind: "stored"; planId: string } | { kind: "preview"; order: Order; context: PlanContext };

/** Wall-clock limit of one plan in the worker (a plan past it fails with `time_limit`). */
export function planTimeLimitMs(): number {
  return Number(process.env.SHEARWIRE_PLAN_TIME_LIMIT_S ?? 60) * 1000;
}

/** Previews are answered while the caller waits: a shorter limit. */
export function previewTimeLimitMs(): number {
  return Number(process.env.SHEARWIRE_PREVIEW_TIME_LIMIT_S ?? 20) * 1000;
}

const holder = globalThis as unknown as { __shearwirePlanQueue?: Queue<PlanJob>; __shearwirePlanEvents?: QueueEvents };

export function planQueue(): Queue<PlanJob> {
  holder.__shearwirePlanQueue ??= new Queue<PlanJob>(PLAN_QUEUE, {
    connection: bullConnection(),
    defaultJobOptions: { removeOnComplete: 1000, removeOnFail: 1000, attempts: 1 },
  });
  return holder.__shearwirePlanQueue;
}

/**
 * Queue a stored plan (a second call for the same plan while its job exists does nothing).
 * With `waitMs`, gives up waiting after that long: BullMQ's connection retries forever while
 * Redis is away, and a request must not hang on it.
 */
export async function enqueuePlan(planId: string, waitMs?: number) {
  const adding = planQueue().add("plan", { kind: "stored", planId }, { jobId: planId });
  await (waitMs === undefined ? adding : within(adding, waitMs));
}

/** Drop a queued plan's job, if no worker has taken it yet. */
export async function dequeuePlan(planId: string, waitMs = 2_000) {
  const job = await within(planQueue().getJob(planId), waitMs);
  if (job && (await job.isWaiting())) await job.remove().catch(() => undefined);
}

export class PreviewTimeout extends Error {}

/** Plan without storing: a worker computes it; this waits for the answer up to the preview limit. */
export async function previewOnWorker(order: Order, context: PlanContext): Promise<PlannedOrder> {
  holder.__shearwirePlanEvents ??= new QueueEvents(PLAN_QUEUE, { connection: bullConnection() });
  const events = holder.__shearwirePlanEvents;
  const limit = previewTimeLimitMs();
  try {
    await within(events.waitUntilReady(), 2_000);
  } catch {
    throw new PreviewTimeout("The planning queue is not answering.");
  }
  const job = await within(
    planQueue().add(
      "preview",
      { kind: "preview", order, context },
      { jobId: `preview-${randomUUID()}`, removeOnComplete: { age: 60 }, removeOnFail: { age: 600 } },
    ),
    2_000,
  ).catch(() => {
    throw new PreviewTimeout("The planning queue is not answering.");
  });
  try {
    // A little longer than the worker's own limit, so its "too long" answer arrives rather than ours.
    return (await job.waitUntilFinished(events, limit + 5_000)) as PlannedOrder;
  } catch (err) {
    if (/timed out/i.test((err as Error).message)) {
      await job.remove().catch(() => undefined);
      throw new PreviewTimeout(`No worker answered within ${Math.round(limit / 1000)} s.`);
    }
    throw err;
  }
}

/** Close this process's connections to the planning queue (scripts that queue a plan and exit). */
export async function closePlanQueue() {
  const queue = holder.__shearwirePlanQueue;
  const events = holder.__shearwirePlanEvents;
  holder.__shearwirePlanQueue = undefined;
  holder.__shearwirePlanEvents = undefined;
  await Promise.all([queue?.close(), events?.close()]);
}
