import { afterAll, describe, expect, it } from "vitest";
import { closePlanQueue, enqueuePlan } from "../../lib/queue/plan-queue";
import { closeQueue, enqueueAttempt } from "../../lib/queue/queue";

// A request that stores a plan must answer even when Redis is away: BullMQ's connection
// retries forever, so the web process stops waiting and leaves the plan to the sweeper.
describe("queueing work while Redis is away", () => {
  const before = process.env.REDIS_URL;
  afterAll(async () => {
    process.env.REDIS_URL = before;
    await Promise.race([Promise.all([closePlanQueue(), closeQueue()]), new Promise((r) => setTimeout(r, 1000))]);
  });

  it("gives up after the wait it was given instead of hanging", async () => {
    await closePlanQueue();
    process.env.REDIS_URL = "redis://127.0.0.1:1"; // nothing listens on port 1
    const started = Date.now();
    await expect(enqueuePlan("plan_test_absent_redis", 300)).rejects.toThrow(/did not answer within 300 ms/);
    expect(Date.now() - started).toBeLessThan(5_000);
  });

  it("does the same for a webhook delivery sent from a request (test event, resend)", async () => {
    await closeQueue();
    process.env.REDIS_URL = "redis://127.0.0.1:1";
    await expect(enqueueAttempt("dlv_test_absent_redis", 1, 0, 300)).rejects.toThrow(/did not answer within 300 ms/);
  });
});
