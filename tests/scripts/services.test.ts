import net from "node:net";
import os from "node:os";
import path from "node:path";
import { existsSync, mkdtempSync, rmSync } from "node:fs";
import pg from "pg";
import { Redis } from "ioredis";
import { afterAll, describe, expect, it } from "vitest";
import {
  databaseUrl,
  pgRunning,
  redisRunning,
  redisUrl,
  ServiceError,
  startAll,
  startPostgres,
  startRedis,
  stopAll,
  type Profile,
} from "../../scripts/lib/services";

// A profile of its own (ports and folder) so this suite never touches the other servers.
const dataRoot = mkdtempSync(path.join(os.tmpdir(), "shearwire-svc-"));
const profile: Profile = {
  name: "test",
  dataRoot,
  pg: {
    dataDir: path.join(dataRoot, "pg"),
    port: 55452,
    user: "shearwire",
    password: "s3cret-test",
    database: "svc_test",
  },
  redis: { dataDir: path.join(dataRoot, "redis"), port: 56399 },
  mail: { smtpPort: 2599, httpPort: 2598, dir: path.join(dataRoot, "mail") },
};

async function sql<T = unknown>(query: string): Promise<T[]> {
  const client = new pg.Client({ connectionString: databaseUrl(profile.pg) });
  await client.connect();
  try {
    return (await client.query(query)).rows as T[];
  } finally {
    await client.end();
  }
}

afterAll(async () => {
  await stopAll(profile).catch(() => undefined);
  rmSync(dataRoot, { recursive: true, force: true });
});

describe("local PostgreSQL and Redis", () => {
  it("initialises and starts both on loopback, then reuses them when started again", async () => {
    expect(await startAll(profile)).toEqual({ pg: "started", redis: "started" });
    expect(await startAll(profile)).toEqual({ pg: "reused", redis: "reused" });
    const [row] = await sql<{ addr: string; port: number }>(
      "select inet_server_addr()::text as addr, inet_server_port() as port",
    );
    expect(row).toEqual({ addr: "127.0.0.1/32", port: 55452 });
  });

  it("keeps data across a stop and a start", async () => {
    await sql("create table kept (v text)");
    await sql("insert into kept values ('still here')");
    const redis = new Redis(redisUrl(profile.redis));
    await redis.set("kept", "still here");
    await redis.quit();

    expect(await stopAll(profile)).toEqual({ pg: "stopped", redis: "stopped" });
    expect(pgRunning(profile.pg)).toBe(false);
    expect(redisRunning(profile.redis)).toBe(false);
    expect(await stopAll(profile)).toEqual({ pg: "not running", redis: "not running" });

    expect(await startAll(profile)).toEqual({ pg: "started", redis: "started" });
    expect(await sql("select v from kept")).toEqual([{ v: "still here" }]);
    const again = new Redis(redisUrl(profile.redis));
    expect(await again.get("kept")).toBe("still here");
    await again.quit();
  });

  it("refuses password-less connections over TCP", async () => {
    const client = new pg.Client({
      host: "127.0.0.1",
      port: profile.pg.port,
      user: "shearwire",
      password: "wrong",
      database: "svc_test",
    });
    await expect(client.connect()).rejects.toThrow(/password authentication failed/);
  });

  it("says clearly when a port is taken by another program", async () => {
    // A port the system hands out (a fixed one can be in use as another connection's own port, and listen then fails).
    const blocker = net.createServer();
    await new Promise<void>((resolve, reject) => blocker.once("error", reject).listen(0, "127.0.0.1", resolve));
    const { port } = blocker.address() as net.AddressInfo;
    try {
      const other = path.join(dataRoot, "other");
      const pgErr = await startPostgres({ ...profile.pg, dataDir: path.join(other, "pg"), port }).catch((e) => e);
      expect(pgErr).toBeInstanceOf(ServiceError);
      expect(pgErr.message).toMatch(new RegExp(`port ${port} on 127\\.0\\.0\\.1 is busy.*SHEARWIRE_PG_PORT`));
      // a new folder is refused before initdb runs
      expect(existsSync(path.join(other, "pg", "PG_VERSION"))).toBe(false);
      const redisErr = await startRedis({ dataDir: path.join(other, "redis"), port }).catch((e) => e);
      expect(redisErr).toBeInstanceOf(ServiceError);
      expect(redisErr.message).toMatch(/busy.*SHEARWIRE_REDIS_PORT/);
    } finally {
      blocker.close();
    }
  });
});
