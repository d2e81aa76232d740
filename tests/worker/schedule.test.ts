import { afterEach, describe, expect, it } from "vitest";
import { delayBefore, MAX_ATTEMPTS, RETRY_SCHEDULE_MS, retryAfterMs } from "../../lib/worker/schedule";

afterEach(() => {
  delete process.env.SHEARWIRE_WEBHOOK_TIME_SCALE;
});

describe("retry schedule", () => {
  it("is the Standard Webhooks guidance: immediately, 5 s, 5 min, 30 min, 2 h, 5 h, 10 h, 14 h, 20 h, 24 h", () => {
    const s = 1000,
      m = 60 * s,
      h = 60 * m;
    expect(RETRY_SCHEDULE_MS).toEqual([0, 5 * s, 5 * m, 30 * m, 2 * h, 5 * h, 10 * h, 14 * h, 20 * h, 24 * h]);
    expect(MAX_ATTEMPTS).toBe(10);
  });

  it("adds at most ±10 % jitter and stops after the last attempt", () => {
    expect(delayBefore(3, () => 0)).toBe(270_000);
    expect(delayBefore(3, () => 1)).toBe(330_000);
    expect(delayBefore(1)).toBe(0);
    expect(delayBefore(11)).toBeNull();
  });

  it("shrinks with the test-speed setting", () => {
    process.env.SHEARWIRE_WEBHOOK_TIME_SCALE = "0.001";
    expect(delayBefore(3, () => 0.5)).toBe(300);
  });

  it("reads Retry-After as seconds or an HTTP date, capped at 24 h", () => {
    expect(retryAfterMs("120")).toBe(120_000);
    expect(
      retryAfterMs(new Date(Date.parse("2026-12-02T00:01:00Z")).toUTCString(), Date.parse("2026-12-02T00:00:00Z")),
    ).toBe(60_000);
    expect(retryAfterMs("999999")).toBe(86_400_000);
    expect(retryAfterMs("soon")).toBeNull();
    expect(retryAfterMs(null)).toBeNull();
  });
});
