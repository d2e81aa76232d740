/**
 * Nothing is lost when the worker dies: a receiver holds each request open, the worker is
 * killed with SIGKILL several times mid-delivery and started again, and in the end the
 * receiver has seen every event's webhook-id (duplicates allowed, none missing).
 */
import { readFileSync } from "node:fs";
import request from "supertest";
import { afterAll, describe, expect, it } from "vitest";
import { Event } from "../../entities";
import { daemon, startWorker } from "../../scripts/lib/web";
import { BASE_URL, profile, testAppEnv, WORKER_DAEMON } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, testOrm } from "../support/fixtures";
import { startReceiver } from "../support/receiver";

afterAll(closeTestOrm);

function killWorker() {
  const d = daemon(profile.dataRoot, WORKER_DAEMON);
  const pid = Number(readFileSync(d.pidFile, "utf8"));
  process.kill(-pid, "SIGKILL"); // the whole process group, no goodbye
  return d;
}

describe("worker crash", () => {
  it("delivers every event at least once across repeated SIGKILLs", async () => {
    const shop = await createTestShop("crash");
    const receiver = await startReceiver(() => ({ status: 204, holdMs: 300 }));
    try {
      const auth = { Authorization: `Bearer ${shop.key}` };
      await request(BASE_URL).post("/api/v1/webhook-endpoints").set(auth).send({ url: receiver.url }).expect(201);
      const creating = (async () => {
        for (let i = 0; i < 30; i++)
          await request(BASE_URL).post("/api/v1/programs").set(auth).send(exampleProgram(shop.shearId)).expect(201);
      })();
      for (let k = 0; k < 4; k++) {
        await new Promise((r) => setTimeout(r, 700));
        const d = killWorker();
        await new Promise((r) => setTimeout(r, 200));
        startWorker(d, testAppEnv());
      }
      await creating;
      const events = await (await testOrm()).em.fork().find(Event, { shop: shop.shopId });
      expect(events).toHaveLength(30);
      const wanted = new Set(events.map((e) => e.id));
      const deadline = Date.now() + 90_000;
      let seen = new Set<string>();
      while (Date.now() < deadline) {
        seen = new Set(receiver.received.map((r) => String(r.headers["webhook-id"])));
        if ([...wanted].every((id) => seen.has(id))) break;
        await new Promise((r) => setTimeout(r, 250));
      }
      expect([...wanted].filter((id) => !seen.has(id))).toEqual([]);
      expect([...seen].filter((id) => !wanted.has(id))).toEqual([]);
    } finally {
      await receiver.close();
    }
  }, 150_000);
});
