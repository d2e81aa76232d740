import { MikroORM } from "@mikro-orm/postgresql";
import { Redis } from "ioredis";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ormConfig } from "../../lib/db/config";
import { checkHealth } from "../../lib/services/health";
import { DATABASE_URL, REDIS_URL } from "../support/env";

let orm: MikroORM;
beforeAll(async () => {
  orm = await MikroORM.init(ormConfig(DATABASE_URL));
});
afterAll(async () => orm?.close(true));

describe("checkHealth", () => {
  it("is ok when both answer", async () => {
    const redis = new Redis(REDIS_URL, { lazyConnect: true });
    const health = await checkHealth(async () => orm.em.fork(), redis);
    expect(health.status).toBe("ok");
    redis.disconnect();
  });

  it("is degraded, naming no secrets, when Redis does not answer", async () => {
    // nothing listens on port 1 of loopback
    const redis = new Redis("redis://:hunter2@127.0.0.1:1", {
      lazyConnect: true,
      maxRetriesPerRequest: 0,
      retryStrategy: () => null,
    });
    redis.on("error", () => undefined);
    const health = await checkHealth(async () => orm.em.fork(), redis);
    expect(health).toMatchObject({ status: "degraded", database: { status: "up" }, redis: { status: "down" } });
    expect(JSON.stringify(health)).not.toContain("hunter2");
    redis.disconnect();
  });

  it("is degraded when the database does not answer", async () => {
    const broken = await MikroORM.init({ ...ormConfig("postgres://x:y@127.0.0.1:1/none"), connect: false });
    const redis = new Redis(REDIS_URL, { lazyConnect: true });
    const health = await checkHealth(async () => broken.em.fork(), redis);
    expect(health).toMatchObject({ status: "degraded", database: { status: "down" }, redis: { status: "up" } });
    redis.disconnect();
    await broken.close(true);
  });
});
