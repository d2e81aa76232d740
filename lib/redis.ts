import { Redis } from "ioredis";

export const DEFAULT_REDIS_URL = "redis://127.0.0.1:56379";

const holder = globalThis as unknown as { __shearwireRedis?: Redis };

/**
 * The process-wide Redis connection (commands only; BullMQ opens its own). Commands issued in the
 * same turn of the event loop (the rate limits of requests that arrive together) go out in one write.
 */
export function getRedis(): Redis {
  holder.__shearwireRedis ??= new Redis(process.env.REDIS_URL ?? DEFAULT_REDIS_URL, {
    lazyConnect: true,
    connectTimeout: 2000,
    maxRetriesPerRequest: 1,
    enableOfflineQueue: true,
    enableAutoPipelining: true,
  });
  // Connection errors surface where they matter (health, rate limits); don't crash or spam.
  holder.__shearwireRedis.on("error", () => undefined);
  return holder.__shearwireRedis;
}
