/**
 * The worker process: fans out the outbox into deliveries (woken by NOTIFY on commit, and
 * every few seconds regardless), runs delivery attempts from the BullMQ queue, re-queues
 * overdue deliveries, returns expired gateway leases, and purges old idempotency records.
 * The web process never delivers webhooks itself.
 */
import { Worker } from "bullmq";
import pg from "pg";
import { WebhookEndpoint } from "../../entities";
import { purgeExpired } from "../api/idempotency";
import { DEFAULT_DATABASE_URL } from "../db/config";
import { getOrm } from "../db/orm";
import { OUTBOX_CHANNEL } from "../services/events";
import { sweepExpiredLeases } from "../services/gateway";
import { mailEndpointDisabled } from "../services/mail";
import { attemptDelivery } from "./deliver";
import { dispatchPending, overdueDeliveries } from "./dispatch";
import { bullConnection, closeQueue, enqueueAttempt, QUEUE_NAME, type DeliveryJob } from "./queue";

const log = (msg: string) => console.log(`[worker] ${new Date().toISOString()} ${msg}`);

export async function runWorker({ concurrency = Number(process.env.SHEARWIRE_WORKER_CONCURRENCY ?? 32) } = {}) {
  const orm = await getOrm();
  const fork = () => orm.em.fork();

  let dispatching: Promise<void> | null = null;
  let again = false;
  const dispatch = () => {
    if (dispatching) {
      again = true;
      return dispatching;
    }
    dispatching = (async () => {
      do {
        again = false;
        try {
          for (;;) {
            const ids = await dispatchPending(fork());
            backlog.push(...ids);
            pump();
            if (ids.length < 200) break;
          }
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

  const attempt = async (deliveryId: string, n: number) => {
    const outcome = await attemptDelivery(fork(), deliveryId, n);
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
  ];
  await dispatch();
  log(`running: ${concurrency} deliveries at a time`);

  return async function stop() {
    timers.forEach(clearInterval);
    backlog.length = 0; // not started: the sweeper of the next worker queues them
    await Promise.all([...inFlight]);
    await worker.close();
    await listener.end().catch(() => undefined);
    await closeQueue();
    await orm.close(true);
  };
}
