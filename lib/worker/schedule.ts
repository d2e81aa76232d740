/**
 * The retry schedule of the Standard Webhooks guidance: immediately, then 5 s, 5 min, 30 min,
 * 2 h, 5 h, 10 h, 14 h, 20 h and 24 h after each failure, with ±10 % jitter.
 * SHEARWIRE_WEBHOOK_TIME_SCALE shrinks it for tests (0.001 turns 5 min into 300 ms).
 */
export const RETRY_SCHEDULE_MS = [
  0, 5_000, 300_000, 1_800_000, 7_200_000, 18_000_000, 36_000_000, 50_400_000, 72_000_000, 86_400_000,
];
export const MAX_ATTEMPTS = RETRY_SCHEDULE_MS.length;
const MAX_RETRY_AFTER_MS = 86_400_000;
const JITTER = 0.1;

export function timeScale(): number {
  const scale = Number(process.env.SHEARWIRE_WEBHOOK_TIME_SCALE ?? 1);
  return Number.isFinite(scale) && scale > 0 ? scale : 1;
}

/** Delay before attempt number `attempt` (1-based), or null when there is no such attempt. */
export function delayBefore(attempt: number, random = Math.random): number | null {
  if (attempt < 1 || attempt > MAX_ATTEMPTS) return null;
  const base = RETRY_SCHEDULE_MS[attempt - 1] * timeScale();
  return Math.round(base * (1 + (random() * 2 - 1) * JITTER));
}

/** A receiver's Retry-After (seconds or an HTTP date), in ms, capped at 24 h; null when absent or unreadable. */
export function retryAfterMs(header: string | null, now = Date.now()): number | null {
  if (!header) return null;
  const seconds = Number(header);
  const ms = Number.isFinite(seconds) ? seconds * 1000 : Date.parse(header) - now;
  if (!Number.isFinite(ms) || ms < 0) return null;
  return Math.min(ms, MAX_RETRY_AFTER_MS);
}

/** Failed attempts in a row after which an endpoint is disabled (and its shop's owners told). */
export function disableAfter(): number {
  return Number(process.env.SHEARWIRE_WEBHOOK_DISABLE_AFTER ?? 15);
}
