/**
 * Every event type, sent for real: the server and the worker record and deliver each one to a
 * receiver named by host name, and each delivered body must match the OpenAPI document's
 * `webhooks` entry for its type (Ajv, JSON Schema 2020-12) and verify with the independent
 * `standardwebhooks` package. What is sent and what is documented cannot drift apart.
 */
import request from "supertest";
import { Webhook } from "standardwebhooks";
import { afterAll, describe, expect, it, vi } from "vitest";
import { Program } from "../../entities";
import { finishPlan } from "../../lib/worker/plan-jobs";
import { EVENT_TYPES } from "../../lib/schemas/enums";
import { createPlan } from "../../lib/services/plans";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, examplePlan, exampleProgram, testOrm } from "../support/fixtures";
import { doc, expectDocumentedWebhook } from "../support/openapi";
import { largestOrder } from "../../scripts/lib/orders";
import { startReceiver, type Receiver } from "../support/receiver";

const api = () => request(BASE_URL);
let receiver: Receiver | undefined;
afterAll(async () => {
  await receiver?.close();
  await closeTestOrm();
});

describe("webhook payloads", () => {
  it("documents every event type", () => {
    expect(Object.keys(doc.webhooks ?? {}).sort()).toEqual([...EVENT_TYPES].sort());
  });

  it("sends every event type as the document describes it", async () => {
    const shop = await createTestShop("payloads");
    const auth = { Authorization: `Bearer ${shop.key}` };
    receiver = await startReceiver();
    const endpoint = await api().post("/api/v1/webhook-endpoints").set(auth).send({ url: receiver.url }).expect(201);
    const secret = endpoint.body.secret as string;

    // endpoint.test
    await api().post(`/api/v1/webhook-endpoints/${endpoint.body.endpoint.id}/test`).set(auth).expect(202);

    // created, updated, released, claimed, started, progressed, completed; its run books the reserved
    // sheets out (stock.consumed) and its offcuts in as remnants (stock.remnant_added)
    await api().patch("/api/v1/settings").set(auth).send({ remnantMinMm: 200 }).expect(200);
    const created = await api().post("/api/v1/programs").set(auth).send(exampleProgram(shop.shearId)).expect(201);
    const a = created.body.id as string;
    const rack = await api()
      .post("/api/v1/stock")
      .set(auth)
      .send({ kind: "sheet", grade: "A36", thicknessMm: 3.42, lengthMm: 3048, widthMm: 1219.2, quantity: 2 })
      .expect(201);
    await api()
      .post(`/api/v1/stock/${rack.body.id}/reservations`)
      .set(auth)
      .send({ quantity: 2, program: a })
      .expect(201);
    await api()
      .patch(`/api/v1/programs/${a}`)
      .set(auth)
      .set("If-Match", created.headers.etag)
      .send({ title: "Side panels (rev B)" })
      .expect(200);
    await api().post(`/api/v1/programs/${a}/release`).set(auth).send({}).expect(200);
    await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(auth).send({}).expect(200);
    await api().post(`/api/v1/programs/${a}/start`).set(auth).expect(200);
    await api().post(`/api/v1/programs/${a}/progress`).set(auth).send({ groupsDone: 1, strokesDone: 5 }).expect(200);
    await api()
      .post(`/api/v1/programs/${a}/complete`)
      .set(auth)
      .send({ goodPieces: 56, scrappedPieces: 0 })
      .expect(200);

    // failed
    const b = (await api().post("/api/v1/programs").set(auth).send(exampleProgram(shop.shearId)).expect(201)).body.id;
    await api().post(`/api/v1/programs/${b}/release`).set(auth).send({}).expect(200);
    await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(auth).send({}).expect(200);
    await api()
      .post(`/api/v1/programs/${b}/fail`)
      .set(auth)
      .send({ reason: "overload", message: "relief valve opened" })
      .expect(200);

    // cancelled
    const c = (await api().post("/api/v1/programs").set(auth).send(exampleProgram(shop.shearId)).expect(201)).body.id;
    await api().post(`/api/v1/programs/${c}/cancel`).set(auth).send({ reason: "order withdrawn" }).expect(200);

    // lease_expired: the gateway goes quiet and the worker's sweeper takes the program back
    const d = (await api().post("/api/v1/programs").set(auth).send(exampleProgram(shop.shearId)).expect(201)).body.id;
    await api().post(`/api/v1/programs/${d}/release`).set(auth).send({}).expect(200);
    await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(auth).send({}).expect(200);
    await (await testOrm()).em.fork().nativeUpdate(Program, { id: d }, { leaseExpiresAt: new Date(Date.now() - 1000) });

    // stock: created, adjusted, reserved for a program and released when it is cancelled, archived
    const stock = await api()
      .post("/api/v1/stock")
      .set(auth)
      .send({ kind: "sheet", grade: "A36", thicknessMm: 3.42, lengthMm: 3048, widthMm: 1219.2, quantity: 4 })
      .expect(201);
    await api()
      .post(`/api/v1/stock/${stock.body.id}/adjust`)
      .set(auth)
      .send({ delta: -1, reason: "dented" })
      .expect(200);
    const e = (await api().post("/api/v1/programs").set(auth).send(exampleProgram(shop.shearId)).expect(201)).body.id;
    await api()
      .post(`/api/v1/stock/${stock.body.id}/reservations`)
      .set(auth)
      .send({ quantity: 2, program: e })
      .expect(201);
    await api().post(`/api/v1/programs/${e}/cancel`).set(auth).send({}).expect(200);
    await api().post(`/api/v1/stock/${stock.body.id}/archive`).set(auth).expect(200);

    // plan.completed and plan.cancelled through the API
    await api().post("/api/v1/plans").set(auth).set("Prefer", "wait=10").send(examplePlan(shop.shearId)).expect(201);
    const long = await api().post("/api/v1/plans").set(auth).send(largestOrder(shop.shearId, 11)).expect(202);
    await api().post(`/api/v1/plans/${long.body.id}/cancel`).set(auth).send({}).expect(200);

    // plan.failed: stored without a job, taken as a worker takes it, and finished as the worker
    // finishes a plan past its time limit (a real time limit would cost a minute of this suite).
    const em = (await testOrm()).em.fork();
    const failing = await createPlan(em, shop.shopId, examplePlan(shop.shearId), { queue: false });
    await em.getConnection().execute("update plans set status = 'running', attempts = 1 where id = ?", [failing.id]);
    await finishPlan(em.fork(), failing.id, {
      kind: "failed",
      reason: "time_limit",
      message: "The plan took longer than this install's limit of 60 s and was stopped.",
    });

    const received = await vi.waitFor(
      () => {
        const types = new Set(receiver!.received.map((r) => JSON.parse(r.body).type));
        expect([...types].sort()).toEqual([...EVENT_TYPES].sort());
        return receiver!.received;
      },
      { timeout: 30_000, interval: 200 },
    );

    const verifier = new Webhook(secret.replace(/^whsec_/, ""));
    for (const r of received) {
      const payload = verifier.verify(r.body, {
        "webhook-id": String(r.headers["webhook-id"]),
        "webhook-timestamp": String(r.headers["webhook-timestamp"]),
        "webhook-signature": String(r.headers["webhook-signature"]),
      }) as { type: string };
      expectDocumentedWebhook(payload);
    }
  });
});
