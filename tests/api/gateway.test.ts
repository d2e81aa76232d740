/**
 * Gateways over real HTTP: concurrent claims never share a program, leases run out and
 * programs return, the lifecycle refuses illegal moves, binding and long polls work.
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { Event, Program } from "../../entities";
import { createProgram, releaseProgram } from "../../lib/services/programs";
import { BASE_URL } from "../support/env";
import {
  closeTestOrm,
  createTestShop,
  exampleProgram,
  keyFor,
  TEST_SHEAR,
  testOrm,
  type TestShop,
} from "../support/fixtures";

const api = () => request(BASE_URL);
const bearer = (key: string) => ({ Authorization: `Bearer ${key}` });

/** Released programs made straight through the services (fast), optionally with priority and due date. */
async function releasedPrograms(shop: TestShop, n: number, extra: (i: number) => object = () => ({})) {
  const ids: string[] = [];
  for (let i = 0; i < n; i++) {
    const em = (await testOrm()).em.fork();
    const p = await createProgram(em, shop.shopId, { ...exampleProgram(shop.shearId), ...extra(i) });
    await releaseProgram(em.fork(), shop.shopId, p.id);
    ids.push(p.id);
  }
  return ids;
}

afterAll(closeTestOrm);

describe("claims", () => {
  it("gives each of 200 released programs to exactly one of 16 concurrent gateways", { timeout: 120_000 }, async () => {
    const shop = await createTestShop("claims");
    const ids = await releasedPrograms(shop, 200);
    const keys = await Promise.all(Array.from({ length: 16 }, () => keyFor(shop.shopId, ["gateway"])));
    const claimed: string[][] = await Promise.all(
      keys.map(async ({ secret }) => {
        const mine: string[] = [];
        for (;;) {
          const res = await api()
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
    expect(claimed.filter((c) => c.length > 0).length).toBeGreaterThan(1); // the work was really shared
    const events = await (await testOrm()).em.fork().count(Event, { type: "program.claimed", subjectId: { $in: ids } });
    expect(events).toBe(200);
  });

  it("hands out the highest priority first, then the earliest due date", async () => {
    const shop = await createTestShop("order");
    const spec = [
      { priority: 1, dueAt: "2026-12-01T08:00:00Z" },
      { priority: 9, dueAt: "2026-12-09T08:00:00Z" },
      { priority: 5, dueAt: "2026-12-05T08:00:00Z" },
      { priority: 5, dueAt: "2026-12-03T08:00:00Z" },
    ];
    const ids = await releasedPrograms(shop, spec.length, (i) => spec[i]);
    const order: string[] = [];
    for (let i = 0; i < spec.length; i++) {
      order.push(
        (await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(bearer(shop.key)).send({})).body.program.id,
      );
    }
    expect(order).toEqual([ids[1], ids[3], ids[2], ids[0]]);
  });

  it("waits (long poll) for a program released meanwhile, and answers 204 when the wait ends empty", async () => {
    const shop = await createTestShop("longpoll");
    const started = Date.now();
    const empty = await api()
      .post(`/api/v1/shears/${shop.shearId}/claims`)
      .set(bearer(shop.key))
      .send({ waitSeconds: 1 });
    expect(empty.status).toBe(204);
    expect(Date.now() - started).toBeGreaterThanOrEqual(900);

    const waiting = api().post(`/api/v1/shears/${shop.shearId}/claims`).set(bearer(shop.key)).send({ waitSeconds: 10 });
    const [id] = await new Promise<string[]>((resolve) => setTimeout(() => resolve(releasedPrograms(shop, 1)), 500));
    const res = await waiting;
    expect(res.status).toBe(200);
    expect(res.body.program.id).toBe(id);
  });

  it("refuses a key bound to other shears (403) and another shop's shear (404)", async () => {
    const shop = await createTestShop("bound");
    const other = await createTestShop("bound-other");
    const em = (await testOrm()).em.fork();
    const { createKey } = await import("../../lib/services/keys");
    const { Shear } = await import("../../entities");
    const second = em.create(Shear, { ...TEST_SHEAR, name: "Second shear", shop: shop.shopId });
    await em.flush();
    const { secret } = await createKey(em, shop.shopId, { name: "bound", scopes: ["gateway"], shearIds: [second.id] });
    const bound = await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(bearer(secret)).send({});
    expect(bound.status).toBe(403);
    const foreign = await api().post(`/api/v1/shears/${other.shearId}/claims`).set(bearer(shop.key)).send({});
    expect(foreign.status).toBe(404);
  });
});

describe("leases", () => {
  it("returns a program whose lease ran out to released, records why, and lets another gateway claim it", async () => {
    const shop = await createTestShop("lease");
    const [id] = await releasedPrograms(shop, 1);
    const first = await keyFor(shop.shopId, ["gateway"]);
    const second = await keyFor(shop.shopId, ["gateway"]);
    await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(bearer(first.secret)).send({}).expect(200);
    await api().post(`/api/v1/programs/${id}/start`).set(bearer(first.secret)).expect(200);
    // the gateway goes quiet: its lease is in the past
    await (await testOrm()).em.fork().nativeUpdate(Program, { id }, { leaseExpiresAt: new Date(Date.now() - 1000) });

    // the worker's sweeper notices within a few seconds
    const p = await vi.waitFor(
      async () => {
        const row = await (await testOrm()).em.fork().findOneOrFail(Program, { id }, { disableIdentityMap: true });
        expect(row.status).toBe("released");
        return row;
      },
      { timeout: 10_000, interval: 200 },
    );
    expect(p.leaseExpiries).toBe(1);
    const expired = await (
      await testOrm()
    ).em
      .fork()
      .findOneOrFail(Event, { subjectId: id, type: "program.lease_expired" });
    expect(expired.data).toMatchObject({
      from: "running",
      gateway: first.key.id,
      reason: expect.stringMatching(/No heartbeat/),
    });

    // the quiet gateway has lost it; the other one gets it
    const late = await api().post(`/api/v1/programs/${id}/heartbeat`).set(bearer(first.secret)).send({});
    expect(late.status).toBe(409);
    const claim = await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(bearer(second.secret)).send({});
    expect(claim.body.program.id).toBe(id);
  });

  it("extends the lease on heartbeat", async () => {
    const shop = await createTestShop("heartbeat");
    const [id] = await releasedPrograms(shop, 1);
    const claim = await api()
      .post(`/api/v1/shears/${shop.shearId}/claims`)
      .set(bearer(shop.key))
      .send({ leaseSeconds: 30 });
    const before = Date.parse(claim.body.lease.expiresAt);
    const hb = await api().post(`/api/v1/programs/${id}/heartbeat`).set(bearer(shop.key)).send({ leaseSeconds: 300 });
    expect(Date.parse(hb.body.lease.expiresAt)).toBeGreaterThan(before + 200_000);
  });
});

describe("the lifecycle", () => {
  let shop: TestShop;
  beforeAll(async () => {
    shop = await createTestShop("lifecycle");
  });

  it("refuses moves the lifecycle does not allow, answering 409 with the current state", async () => {
    const [id] = await releasedPrograms(shop, 1);
    const notClaimed = await api().post(`/api/v1/programs/${id}/start`).set(bearer(shop.key));
    expect(notClaimed.status).toBe(409);
    expect(notClaimed.body.currentStatus).toBe("released");

    await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(bearer(shop.key)).send({}).expect(200);
    const tooEarly = await api().post(`/api/v1/programs/${id}/complete`).set(bearer(shop.key)).send({ goodPieces: 1 });
    expect(tooEarly.status).toBe(409);
    expect(tooEarly.body.currentStatus).toBe("claimed");

    const other = await keyFor(shop.shopId, ["gateway"]);
    const notYours = await api().post(`/api/v1/programs/${id}/start`).set(bearer(other.secret));
    expect(notYours.status).toBe(409);

    await api().post(`/api/v1/programs/${id}/start`).set(bearer(shop.key)).expect(200);
    await api().post(`/api/v1/programs/${id}/complete`).set(bearer(shop.key)).send({ goodPieces: 56 }).expect(200);
    const afterDone = await api().post(`/api/v1/programs/${id}/fail`).set(bearer(shop.key)).send({ reason: "other" });
    expect(afterDone.status).toBe(409);
    expect(afterDone.body.currentStatus).toBe("completed");
    const cancelDone = await api().post(`/api/v1/programs/${id}/cancel`).set(bearer(shop.key)).send({});
    expect(cancelDone.status).toBe(409);
  });

  it("stops a gateway whose program the office cancelled", async () => {
    const [id] = await releasedPrograms(shop, 1);
    await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(bearer(shop.key)).send({}).expect(200);
    await api().post(`/api/v1/programs/${id}/start`).set(bearer(shop.key)).expect(200);
    await api()
      .post(`/api/v1/programs/${id}/cancel`)
      .set(bearer(shop.key))
      .send({ reason: "customer changed the order" })
      .expect(200);
    const hb = await api().post(`/api/v1/programs/${id}/heartbeat`).set(bearer(shop.key)).send({});
    expect(hb.status).toBe(409);
    expect(hb.body.currentStatus).toBe("cancelled");
  });

  it("records every state change as an event, in order", async () => {
    const [id] = await releasedPrograms(shop, 1);
    await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(bearer(shop.key)).send({}).expect(200);
    await api().post(`/api/v1/programs/${id}/start`).set(bearer(shop.key)).expect(200);
    await api()
      .post(`/api/v1/programs/${id}/progress`)
      .set(bearer(shop.key))
      .send({ groupsDone: 1, strokesDone: 3 })
      .expect(200);
    await api()
      .post(`/api/v1/programs/${id}/fail`)
      .set(bearer(shop.key))
      .send({ reason: "overload", message: "relief valve opened" })
      .expect(200);
    const events = await api().get(`/api/v1/events?subject=${id}`).set(bearer(shop.key));
    expect(events.body.data.map((e: { type: string }) => e.type).reverse()).toEqual([
      "program.created",
      "program.released",
      "program.claimed",
      "program.started",
      "program.progressed",
      "program.failed",
    ]);
  });
});

describe("run reports are checked against the program", () => {
  let shop: TestShop;
  beforeAll(async () => {
    shop = await createTestShop("reports");
  });

  async function running() {
    const [id] = await releasedPrograms(shop, 1);
    await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(bearer(shop.key)).send({}).expect(200);
    await api().post(`/api/v1/programs/${id}/start`).set(bearer(shop.key)).expect(200);
    return id;
  }

  it("refuses more pieces, strokes, groups or sheets than the program makes, naming the field and the limit", async () => {
    // The worked example: 56 blanks from 62 strokes on 2 sheets of 2 cut groups (its check says so).
    const id = await running();
    const huge = await api()
      .post(`/api/v1/programs/${id}/complete`)
      .set(bearer(shop.key))
      .send({ goodPieces: 9_007_199_254_740_991 });
    expect(huge.status).toBe(422);
    const tooMany = await api()
      .post(`/api/v1/programs/${id}/complete`)
      .set(bearer(shop.key))
      .send({ goodPieces: 50, scrappedPieces: 7 });
    expect(tooMany.status).toBe(422);
    expect(tooMany.body.errors[0]).toMatchObject({
      pointer: "/goodPieces",
      message: expect.stringMatching(/is 57; the program has 56 blanks/),
    });
    const sheets = await api()
      .post(`/api/v1/programs/${id}/complete`)
      .set(bearer(shop.key))
      .send({ goodPieces: 56, sheetsUsed: 3 });
    expect(sheets.body.errors[0]).toMatchObject({
      pointer: "/sheetsUsed",
      message: expect.stringMatching(/the program has 2 sheets/),
    });
    const strokes = await api()
      .post(`/api/v1/programs/${id}/progress`)
      .set(bearer(shop.key))
      .send({ groupsDone: 5, strokesDone: 63 });
    expect(strokes.status).toBe(422);
    expect(strokes.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(["/groupsDone", "/strokesDone"]);
    const stored = await (await testOrm()).em.fork().findOneOrFail(Program, { id });
    expect(stored.status).toBe("running");
    expect(stored.outcome ?? null).toBeNull();
    await api()
      .post(`/api/v1/programs/${id}/complete`)
      .set(bearer(shop.key))
      .send({ goodPieces: 55, scrappedPieces: 1, sheetsUsed: 2 })
      .expect(200);
  });

  it("lets progress only move forward", async () => {
    const id = await running();
    await api()
      .post(`/api/v1/programs/${id}/progress`)
      .set(bearer(shop.key))
      .send({ groupsDone: 2, strokesDone: 31 })
      .expect(200);
    const back = await api()
      .post(`/api/v1/programs/${id}/progress`)
      .set(bearer(shop.key))
      .send({ groupsDone: 1, strokesDone: 31 });
    expect(back.status).toBe(422);
    expect(back.body.errors[0]).toMatchObject({
      pointer: "/groupsDone",
      message: expect.stringMatching(/below the 2 reported before/),
    });
  });
});
