import type { EntityManager } from "@mikro-orm/postgresql";
import type { Redis } from "ioredis";
import { VERSION } from "../version";

export interface ComponentHealth {
  status: "up" | "down";
  latencyMs: number;
  error?: string;
}

export interface Health {
  status: "ok" | "degraded";
  version: string;
  time: string;
  database: ComponentHealth;
  redis: ComponentHealth;
}

async function probe(fn: () => Promise<unknown>, timeoutMs = 2000): Promise<ComponentHealth> {
  const started = performance.now();
  try {
    await Promise.race([
      fn(),
      new Promise((_, reject) =>
        setTimeout(() => reject(new Error(`no answer within ${timeoutMs} ms`)), timeoutMs).unref(),
      ),
    ]);
    return { status: "up", latencyMs: Math.round((performance.now() - started) * 10) / 10 };
  } catch (err) {
    // Name the failure without leaking connection strings or SQL.
    const code = (err as { code?: string }).code;
    return { status: "down", latencyMs: Math.round(performance.now() - started), error: code ?? "unreachable" };
  }
}

/** Reachability of the database and Redis, and the running version. */
export async function checkHealth(em: () => Promise<EntityManager>, redis: Redis): Promise<Health> {
  const [database, redisHealth] = await Promise.all([
    probe(async () => (await em()).getConnection().execute("select 1")),
    probe(async () => {
      if (redis.status === "wait" || redis.status === "end") await redis.connect().catch(() => undefined);
      const pong = await redis.ping();
      if (pong !== "PONG") throw new Error("unexpected ping answer");
    }),
  ]);
  return {
    status: database.status === "up" && redisHealth.status === "up" ? "ok" : "degraded",
    version: VERSION,
    time: new Date().toISOString(),
    database,
    redis: redisHealth,
  };
}
