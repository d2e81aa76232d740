/**
 * Two web servers and two workers against one PostgreSQL and one Redis (the suite's own): 16
 * gateways spread over both web servers claim 200 programs, each exactly once; 500 events for
 * 5 endpoints each arrive at every endpoint (de-duplicated by webhook-id, the duplicates
 * counted and printed), although one worker is killed with SIGKILL halfway through.
 */
import { readFileSync } from "node:fs";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Event } from "../../entities";
import { daemon, startWeb, startWorker, stopDaemon, waitForHttp, type Daemon } from "../../scripts/lib/web";
import { profile, testAppEnv, WORKER_DAEMON } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, keyFor, testOrm } from "../support/fixtures";
import { startReceiver, type Receiver } from "../support/receiver";

const PORTS = [3101, 3102];
const bases = PORTS.map((p) => `http://127.0.0.1:${p}`);
const webs = PORTS.map((p) => daemon(profile.dataRoot, `web-two-${p}`));
const workers = [1, 2].map((i) => daemon(profile.dataRoot, `worker-two-${i}`));
const suiteWorker = daemon(profile.dataRoot, WORKER_DAEMON);
const bearer = (key: string) => ({ Authorization: `Bearer ${key}` });

beforeAll(async () => {
  // exactly two workers while this runs: the suite's own one rests
  await stopDaemon(suiteWorker);
  for (const w of workers) startWorker(w, testAppEnv());
  for (const [i, web] of webs.entries()) await startWeb(web, PORTS[i], testAppEnv());
  for (const [i, web] of webs.entries()) await waitForHttp(`${bases[i]}/api/v1/health`, web);
}, 180_000);

afterAll(async () => {
  for (const d of [...webs, ...workers]) await stopDaemon(d);
  startWorker(suiteWorker, testAppEnv());
  await closeTestOrm();
});

/** Create programs in batches of 100, the batches shared between both web servers. */
async function createPrograms(key: string, shearId: string, n: number): Promise<string[]> {
  const batches = Array.from({ length: Math.ceil(n / 100) }, (_, b) =>
    Array.from({ length: Math.min(100, n - b * 100) }, () => exampleProgram(shearId)),
  );
  const answers = await Promise.all(
    batches.map((programs, b) =>
      request(bases[b % 2])
        .post("/api/v1/programs/batch")
        .set(bearer(key))
        .send({ programs })
        .expect(201),
    ),
  );
  return answers.flatMap((a) => a.body.data.map((p: { id: string }) => p.id));
}

function kill(d: Daemon) {
  process.kill(-Number(readFileSync(d.pidFile, "utf8")), "SIGKILL"); // the whole process group, no goodbye
}

describe("two web servers and two workers", () => {
  it("hands each of 200 programs to exactly one of 16 gateways spread over both web servers", async () => {
    const shop = await createTestShop("two-claims");
    const ids = await createPrograms(shop.key, shop.shearId, 200);
    for (let i = 0; i < ids.length; i += 20) {
      await Promise.all(
        ids.slice(i, i + 20).map((id, j) =>
          request(bases[j % 2])
            .post(`/api/v1/programs/${id}/release`)
            .set(bearer(shop.key))
            .send({})
            .expect(200),
        ),
      );
    }
    const gateways = await Promise.all(Array.from({ length: 16 }, () => keyFor(shop.shopId, ["gateway"])));
    const claimed = await Promise.all(
      gateways.map(async ({ secret }, g) => {
        const mine: string[] = [];
        for (;;) {
          const res = await request(bases[g % 2])
            .post(`/api/v1/shears/${shop.shearId}/claims`)
            .set(bearer(secret))
            .send({ waitSeconds: 0 });
          if (res.status === 204) return mine;
          expect(res.status).toBe(200);
          mine.push(res.body.program.id);
        }
      }),
    );
    const all = claimed.flat();
    expect(all).toHaveLength(200);
    expect(new Set(all)).toEqual(new Set(ids));
    for (const server of [0, 1]) expect(claimed.filter((_, g) => g % 2 === server).flat().length).toBeGreaterThan(0);
  }, 120_000);

  it("delivers 500 events to each of 5 endpoints although a worker is killed mid-run", async () => {
    const shop = await createTestShop("two-hooks");
    const receivers: Receiver[] = await Promise.all(Array.from({ length: 5 }, () => startReceiver()));
    try {
      for (const [i, r] of receivers.entries())
        await request(bases[i % 2])
          .post("/api/v1/webhook-endpoints")
          .set(bearer(shop.key))
          .send({ url: r.url, eventTypes: ["program.created"] })
          .expect(201);
      const ids = await createPrograms(shop.key, shop.shearId, 500);
      const events = await (
        await testOrm()
      ).em
        .fork()
        .find(Event, { shop: shop.shopId, type: "program.created" }, { fields: ["id"] });
      expect(events).toHaveLength(ids.length);
      const wanted = new Set(events.map((e) => e.id));

      // kill one worker once the deliveries are under way
      const started = Date.now();
      while (receivers.reduce((n, r) => n + r.received.length, 0) < 250 && Date.now() - started < 30_000)
        await new Promise((r) => setTimeout(r, 20));
      kill(workers[0]);

      const missing = () =>
        receivers.map((r) => {
          const seen = new Set(r.received.map((x) => String(x.headers["webhook-id"])));
          return [...wanted].filter((id) => !seen.has(id)).length;
        });
      const deadline = Date.now() + 90_000;
      while (missing().some((n) => n > 0) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 250));
      expect(missing()).toEqual([0, 0, 0, 0, 0]);
      const received = receivers.reduce((n, r) => n + r.received.length, 0);
      const duplicates = received - wanted.size * receivers.length;
      console.log(
        `[two-of-everything] ${wanted.size} events × ${receivers.length} endpoints: ${received} deliveries received, ${duplicates} duplicates (one worker killed), ${((Date.now() - started) / 1000).toFixed(1)} s`,
      );
      for (const r of receivers)
        for (const x of r.received) expect(wanted.has(String(x.headers["webhook-id"]))).toBe(true);
    } finally {
      await Promise.all(receivers.map((r) => r.close()));
    }
  }, 150_000);
});
