/**
 * Per-key rate limits on Redis (rate-limiter-flexible), announced with the IETF RateLimit
 * header fields: `RateLimit-Policy: "per-key";q=600;w=60` and `RateLimit: "per-key";r=…;t=…`.
 */
import { RateLimiterRedis, RateLimiterRes } from "rate-limiter-flexible";
import { getRedis } from "../redis";
import { tooManyRequests } from "../errors";

const POLICY = "per-key";
const holder = globalThis as unknown as { __shearwireLimiters?: Map<number, RateLimiterRedis> };

/** The default budget of a key, per minute. */
export function defaultLimitPerMinute(): number {
  return Number(process.env.SHEARWIRE_RATE_LIMIT_PER_MIN ?? 600);
}

/** One limiter per budget size (keys share Redis counters by key id). */
function limiter(points: number): RateLimiterRedis {
  const limiters = (holder.__shearwireLimiters ??= new Map());
  let cached = limiters.get(points);
  if (!cached) {
    cached = new RateLimiterRedis({
      storeClient: getRedis(),
      keyPrefix: `shearwire:rl:${points}`,
      points,
      duration: 60,
    });
    limiters.set(points, cached);
  }
  return cached;
}

function headers(res: RateLimiterRes, points: number): Record<string, string> {
  const reset = Math.max(0, Math.ceil(res.msBeforeNext / 1000));
  return {
    "RateLimit-Policy": `"${POLICY}";q=${points};w=60`,
    RateLimit: `"${POLICY}";r=${Math.max(0, res.remainingPoints)};t=${reset}`,
  };
}

/** Spend one request of the key's budget; returns the headers to send, or throws 429. */
export async function consume(keyId: string, perMinute: number | null = null): Promise<Record<string, string>> {
  const points = perMinute ?? defaultLimitPerMinute();
  try {
    return headers(await limiter(points).consume(keyId, 1), points);
  } catch (err) {
    if (err instanceof RateLimiterRes) {
      const apiError = tooManyRequests(Math.max(1, Math.ceil(err.msBeforeNext / 1000)));
      Object.assign(apiError.headers, headers(err, points));
      throw apiError;
    }
    throw err;
  }
}
