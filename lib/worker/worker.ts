/**
 * The worker process: fans out the outbox into deliveries (woken by NOTIFY on commit, and
 * every few seconds regardless), runs delivery attempts from the BullMQ queue, re-queues
 * overdue deliveries, returns expired gateway leases, purges old idempotency records, and
 * computes plans (each in a worker thread of its own, so a plan never holds up deliveries).
 * The web process never delivers webhooks or plans anything itself.
 */
import { Worker } from "bullmq";
import pg from "pg";
import { WebhookEndpoint } from "../../entities";
import { purgeExpired } from "../services/idempotency";
import { DEFAULT_DATABASE_URL } from "../db/config";
import { getOrm } from "../db/orm";
import { OUTBOX_CHANNEL } from "../services/events";
import { sweepExpiredLeases } from "../services/gateway";
import { mailEndpointDisabled } from "../services/mail";
import { attemptDelivery } from "./deliver";
import { dispatchAll, overdueDeliveries } from "./dispatch";
import { bullConnection, closeQueue, enqueueAttempt, QUEUE_NAME, type DeliveryJob } from "../queue/queue";
import { failLostPlan, planInThread, processStoredPlan, requeueOrphanPlans } from "./plan-jobs";
import { PLAN_QUEUE, planTimeLimitMs, previewTimeLimitMs, type PlanJob } from "../queue/plan-queue";
import { wholeNumberSetting } from "../settings-env";

/** A plan job's lock: a worker that dies loses it within this, and another worker takes the plan over. */
const PLAN_LOCK_MS = Number(process.env.SHEARWIRE_PLAN_LOCK_MS ?? 15_000);

/** the shortest time between the starts of two fan-out rounds, in milliseconds */
const DISPATCH_INTERVAL_MS = Number(process.env.SHEARWIRE_DISPATCH_INTERVAL_MS ?? 10);

const log = (msg: string) => console.log(`[worker] ${new Date().toISOString()} ${msg}`);

export async function runWorker({
  concurrency = wholeNumberSetting(process.env, "SHEARWIRE_WORKER_CONCURRENCY", "deliveries", () => 32),
  planConcurrency = wholeNumberSetting(process.env, "SHEARWIRE_PLAN_CONCURRENCY", "plans", () => 1),
} = {}) {
  const orm = await getOrm();
  const fork = () => orm.em.fork();

  let dispatching: Promise<void> | null = null;
  let again = false;
  let lastRound = -Infinity;
  const dispatch = () => {
    if (dispatching) {
      again = true;
      return dispatching;
    }
    dispatching = (async () => {
      do {
        // Rounds start at most every DISPATCH_INTERVAL_MS: a lone change goes out at once, while
        // under a stream of changes each round takes several events instead of one.
        const wait = lastRound + DISPATCH_INTERVAL_MS - performance.now();
        if (wait > 0) await new Promise((resolve) => setTimeout(resolve, wait));
        lastRound = performance.now();
        again = false;
        try {
          await dispatchAll(fork, (ids) => {
            backlog.push(...ids);
            pump();
          });
        } catch (err) {
          log(`dispatch failed: ${(err as Error).message}`);
        }
      } while (again);
      dispatching = null;
    })();
    return dispatching;
  };

  // Woken by NOTIFY, which PostgreSQL sends when a transaction with an event commits.
  const listener = new pg.Client({ connectionString: process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL });
  listener.on("notification", () => void dispatch());
  listener.on("error", (err) => log(`listener: ${err.message}`));
  await listener.connect();
  await listener.query(`listen ${OUTBOX_CHANNEL}`);

  const attempt = async (deliveryId: string, attemptNumber: number) => {
    const outcome = await attemptDelivery(fork(), deliveryId, attemptNumber);
    if (outcome.kind === "retry") await enqueueAttempt(deliveryId, outcome.attempt, outcome.delayMs);
    if (outcome.kind === "endpoint-disabled") {
      log(`disabled ${outcome.endpointId}: ${outcome.reason}`);
      const em = fork();
      const ep = await em.findOneOrFail(WebhookEndpoint, { id: outcome.endpointId });
      await mailEndpointDisabled(em, ep.shop.id, ep, outcome.reason).catch((err) => log(`mail failed: ${err.message}`));
    }
  };

  // First attempts run here as soon as their deliveries are written, without a trip through the
  // queue; retries go through BullMQ (they wait). A first attempt lost with this process is
  // overdue within seconds and queued again by the sweeper, so delivery stays at least once.
  const backlog: string[] = [];
  const inFlight = new Set<Promise<void>>();
  const pump = () => {
    while (inFlight.size < concurrency && backlog.length) {
      const id = backlog.shift()!;
      const run: Promise<void> = attempt(id, 1)
        .catch((err) => log(`attempt failed: ${(err as Error).message}`))
        .finally(() => {
          inFlight.delete(run);
          pump();
        });
      inFlight.add(run);
    }
  };

  const worker = new Worker<DeliveryJob>(
    QUEUE_NAME,
    async (job) => attempt(job.data.deliveryId, job.data.attempt),
    // A worker that dies loses its job locks within 10 s; another run then takes the job up again.
    { connection: bullConnection(), concurrency, lockDuration: 10_000, stalledInterval: 5_000, maxStalledCount: 5 },
  );
  worker.on("error", (err) => log(`queue: ${err.message}`));

  // Plans: CPU-heavy, so each runs in a worker thread; this event loop only keeps the job's lock.
  const planWorker = new Worker<PlanJob>(
    PLAN_QUEUE,
    async (job) => {
      if (job.data.kind === "preview") {
        const outcome = await planInThread(job.data.order, job.data.context, { timeLimitMs: previewTimeLimitMs() });
        if (outcome.kind !== "complete")
          throw new Error(outcome.kind === "failed" ? outcome.message : "The preview was stopped.");
        return outcome.result;
      }
      const outcome = await processStoredPlan(fork, job.data.planId, planTimeLimitMs());
      log(`plan ${job.data.planId}: ${outcome}`);
      return outcome;
    },
    {
      connection: bullConnection(),
      concurrency: planConcurrency,
      lockDuration: PLAN_LOCK_MS,
      stalledInterval: Math.max(1_000, PLAN_LOCK_MS / 3),
      maxStalledCount: 3,
    },
  );
  planWorker.on("error", (err) => log(`plan queue: ${err.message}`));
  planWorker.on("failed", (job, err) => {
    // A stored plan whose workers kept dying (the job stalled too often) is failed, with the reason.
    if (job?.data.kind === "stored" && /stalled/i.test(err.message)) {
      void failLostPlan(
        fork(),
        job.data.planId,
        `The workers computing this plan stopped ${job.attemptsStarted ?? "several"} times; it was given up. ${err.message}`,
      ).catch((e) => log(`plan ${job.data.kind === "stored" ? job.data.planId : ""}: ${(e as Error).message}`));
    }
  });

  const timers = [
    setInterval(() => void dispatch(), 2_000),
    setInterval(async () => {
      try {
        for (const d of await overdueDeliveries(fork())) await enqueueAttempt(d.id, d.attempt);
      } catch (err) {
        log(`overdue sweep failed: ${(err as Error).message}`);
      }
    }, 5_000),
    setInterval(async () => {
      try {
        const returned = await sweepExpiredLeases(fork());
        if (returned.length) log(`leases expired, released again: ${returned.join(", ")}`);
      } catch (err) {
        log(`lease sweep failed: ${(err as Error).message}`);
      }
    }, 2_000),
    setInterval(() => void purgeExpired(fork()).catch(() => undefined), 3_600_000),
    setInterval(async () => {
      try {
        const requeued = await requeueOrphanPlans(fork(), PLAN_LOCK_MS * 4);
        if (requeued.length) log(`plans queued again: ${requeued.join(", ")}`);
      } catch (err) {
        log(`plan sweep failed: ${(err as Error).message}`);
      }
    }, 10_000),
  ];
  await dispatch();
  log(`running: ${concurrency} deliveries and ${planConcurrency} plan${planConcurrency === 1 ? "" : "s"} at a time`);

  return async function stop() {
    timers.forEach(clearInterval);
    backlog.length = 0; // not started: the sweeper of the next worker queues them
    await Promise.all([...inFlight]);
    await worker.close();
    await planWorker.close(true); // a plan in progress goes back to the queue for the next worker
    await listener.end().catch(() => undefined);
    await closeQueue();
    await orm.close(true);
  };
}
