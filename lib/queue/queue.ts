/** The webhook delivery queue (BullMQ on Redis). Jobs carry a delivery id and attempt number. */
import { Queue } from "bullmq";
import { Redis } from "ioredis";
import { DEFAULT_REDIS_URL } from "../redis";

export const QUEUE_NAME = "shearwire-webhooks";

export interface DeliveryJob {
  deliveryId: string;
  attempt: number;
}

/** A Redis connection as BullMQ wants it (no per-request retry limit). */
export function bullConnection(): Redis {
  const redis = new Redis(process.env.REDIS_URL ?? DEFAULT_REDIS_URL, { maxRetriesPerRequest: null });
  redis.on("error", () => undefined);
  return redis;
}

const holder = globalThis as unknown as { __shearwireQueue?: Queue<DeliveryJob> };

export function deliveryQueue(): Queue<DeliveryJob> {
  holder.__shearwireQueue ??= new Queue<DeliveryJob>(QUEUE_NAME, {
    connection: bullConnection(),
    defaultJobOptions: { removeOnComplete: 1000, removeOnFail: 5000, attempts: 1 },
  });
  return holder.__shearwireQueue;
}

/**
 * Queue one attempt of a delivery; the job id makes a second enqueue of the same attempt a
 * no-op. With `waitMs` (the web process), stops waiting for an absent Redis after that long.
 */
export async function enqueueAttempt(deliveryId: string, attempt: number, delayMs = 0, waitMs?: number) {
  const adding = deliveryQueue().add(
    "deliver",
    { deliveryId, attempt },
    { jobId: `${deliveryId}-${attempt}`, delay: Math.max(0, delayMs) },
  );
  await (waitMs === undefined ? adding : within(adding, waitMs));
}

/**
 * `work`, or a rejection once `ms` have passed without an answer from Redis (BullMQ's
 * connections retry forever while Redis is away; a request must not hang on them).
 */
export async function within<T>(work: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`Redis did not answer within ${ms} ms`)), ms);
  });
  work.catch(() => undefined);
  try {
    return await Promise.race([work, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

export async function closeQueue() {
  const queue = holder.__shearwireQueue;
  holder.__shearwireQueue = undefined;
  await queue?.close();
}
