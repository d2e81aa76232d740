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
  const r = new Redis(process.env.REDIS_URL ?? DEFAULT_REDIS_URL, { maxRetriesPerRequest: null });
  r.on("error", () => undefined);
  return r;
}

const holder = globalThis as unknown as { __shearwireQueue?: Queue<DeliveryJob> };

export function deliveryQueue(): Queue<DeliveryJob> {
  holder.__shearwireQueue ??= new Queue<DeliveryJob>(QUEUE_NAME, {
    connection: bullConnection(),
    defaultJobOptions: { removeOnComplete: 1000, removeOnFail: 5000, attempts: 1 },
  });
  return holder.__shearwireQueue;
}

/** Queue one attempt of a delivery; the job id makes a second enqueue of the same attempt a no-op. */
export async function enqueueAttempt(deliveryId: string, attempt: number, delayMs = 0) {
  await deliveryQueue().add("deliver", { deliveryId, attempt }, { jobId: `${deliveryId}-${attempt}`, delay: Math.max(0, delayMs) });
}

export async function closeQueue() {
  const q = holder.__shearwireQueue;
  holder.__shearwireQueue = undefined;
  await q?.close();
}
