/**
 * Webhook delivery end to end: the real server writes events, the real worker delivers them
 * through BullMQ on Redis to receivers on loopback. Signatures are checked with the
 * independent `standardwebhooks` package.
 */
import request from "supertest";
import { Webhook } from "standardwebhooks";
import { afterAll, afterEach, describe, expect, it, vi } from "vitest";
import { Delivery, WebhookEndpoint } from "../../entities";
import { BASE_URL, INBOX_URL } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, testOrm, type TestShop } from "../support/fixtures";
import { startReceiver, type Receiver, type Responder } from "../support/receiver";

const api = () => request(BASE_URL);
const bearer = (shop: TestShop) => ({ Authorization: `Bearer ${shop.key}` });
const receivers: Receiver[] = [];

afterEach(async () => {
  await Promise.all(receivers.splice(0).map((r) => r.close()));
});
afterAll(closeTestOrm);

async function setup(respond?: Responder, endpoint: object = {}) {
  const shop = await createTestShop("hooks");
  const receiver = await startReceiver(respond);
  receivers.push(receiver);
  const created = await api()
    .post("/api/v1/webhook-endpoints")
    .set(bearer(shop))
    .send({ url: receiver.url, ...endpoint })
    .expect(201);
  return { shop, receiver, endpointId: created.body.endpoint.id as string, secret: created.body.secret as string };
}

const verifier = (secret: string) => new Webhook(secret.replace(/^whsec_/, ""));
const headersOf = (r: { headers: Record<string, unknown> }) => ({
  "webhook-id": String(r.headers["webhook-id"]),
  "webhook-timestamp": String(r.headers["webhook-timestamp"]),
  "webhook-signature": String(r.headers["webhook-signature"]),
});

async function endpointRow(id: string) {
  return (await testOrm()).em.fork().findOneOrFail(WebhookEndpoint, { id }, { disableIdentityMap: true });
}

describe("delivery", () => {
  it("sends each event as a Standard Webhooks request that the standardwebhooks package verifies", async () => {
    const { shop, receiver, secret } = await setup();
    const program = await api()
      .post("/api/v1/programs")
      .set(bearer(shop))
      .send(exampleProgram(shop.shearId))
      .expect(201);
    const [req] = await receiver.waitFor(1);
    const payload = verifier(secret).verify(req.body, headersOf(req)) as {
      type: string;
      timestamp: string;
      data: { program: { id: string } };
    };
    expect(payload.type).toBe("program.created");
    expect(payload.data.program.id).toBe(program.body.id);
    expect(Date.parse(payload.timestamp)).not.toBeNaN();
    const events = await api().get(`/api/v1/events?subject=${program.body.id}`).set(bearer(shop));
    expect(req.headers["webhook-id"]).toBe(events.body.data[0].id);
    expect(req.headers["content-type"]).toBe("application/json");
    // a tampered body does not verify
    expect(() =>
      verifier(secret).verify(req.body.replace("program.created", "program.completed"), headersOf(req)),
    ).toThrow();
  });

  it("sends only the event types an endpoint chose", async () => {
    const { shop, receiver } = await setup(undefined, { eventTypes: ["program.released"] });
    const p = await api().post("/api/v1/programs").set(bearer(shop)).send(exampleProgram(shop.shearId)).expect(201);
    await api().post(`/api/v1/programs/${p.body.id}/release`).set(bearer(shop)).send({}).expect(200);
    const [req] = await receiver.waitFor(1);
    expect(JSON.parse(req.body).type).toBe("program.released");
    await new Promise((r) => setTimeout(r, 500));
    expect(receiver.received).toHaveLength(1);
  });

  it("retries on the schedule with the same webhook-id and logs every attempt", async () => {
    const { shop, receiver, endpointId } = await setup((_r, n) =>
      n < 3
        ? { status: 500, body: "receiver down" }
        : { status: 200, body: "ok", headers: { "X-Receiver": "erp-test" } },
    );
    await api().post(`/api/v1/webhook-endpoints/${endpointId}/test`).set(bearer(shop)).expect(202);
    const reqs = await receiver.waitFor(3);
    expect(new Set(reqs.map((r) => r.headers["webhook-id"])).size).toBe(1);
    // schedule ×0.001 in tests: 5 s → 5 ms, 5 min → 300 ms (each ±10 %)
    expect(reqs[2].at - reqs[1].at).toBeGreaterThanOrEqual(250);
    const deliveries = await vi.waitFor(
      async () => {
        const res = await api().get(`/api/v1/webhook-endpoints/${endpointId}/deliveries`).set(bearer(shop));
        expect(res.body.data[0].status).toBe("succeeded");
        return res.body.data;
      },
      { timeout: 5000 },
    );
    expect(deliveries[0].attemptLog.map((a: { statusCode: number }) => a.statusCode)).toEqual([500, 500, 200]);
    expect(deliveries[0].attemptLog[0].responseExcerpt).toBe("receiver down");
    // Every attempt keeps what was sent (signature included) and what came back.
    const last = deliveries[0].attemptLog[2];
    expect(last.requestHeaders).toMatchObject({
      "webhook-id": reqs[2].headers["webhook-id"],
      "webhook-signature": reqs[2].headers["webhook-signature"],
      "content-type": "application/json",
    });
    expect(last.responseHeaders).toMatchObject({ "x-receiver": "erp-test" });
    expect((await endpointRow(endpointId)).consecutiveFailures).toBe(0);
  });

  it("honours Retry-After", async () => {
    const { shop, receiver, endpointId } = await setup((_r, n) =>
      n === 1 ? { status: 503, headers: { "Retry-After": "2" } } : { status: 204 },
    );
    await api().post(`/api/v1/webhook-endpoints/${endpointId}/test`).set(bearer(shop)).expect(202);
    const reqs = await receiver.waitFor(2);
    expect(reqs[1].at - reqs[0].at).toBeGreaterThanOrEqual(1900); // the schedule alone would wait ~5 ms
  });

  it("does not follow redirects: a 3xx is a failed attempt", async () => {
    const target = await startReceiver();
    receivers.push(target);
    const { shop, receiver, endpointId } = await setup(() => ({ status: 302, headers: { Location: target.url } }));
    await api().post(`/api/v1/webhook-endpoints/${endpointId}/test`).set(bearer(shop)).expect(202);
    await receiver.waitFor(2);
    expect(target.received).toHaveLength(0);
  });

  it("disables an endpoint that answers 410 Gone", async () => {
    const { shop, receiver, endpointId } = await setup(() => ({ status: 410 }));
    await api().post(`/api/v1/webhook-endpoints/${endpointId}/test`).set(bearer(shop)).expect(202);
    await receiver.waitFor(1);
    await vi.waitFor(async () => expect((await endpointRow(endpointId)).enabled).toBe(false), { timeout: 5000 });
    expect((await endpointRow(endpointId)).disabledReason).toMatch(/410/);
    await new Promise((r) => setTimeout(r, 400));
    expect(receiver.received).toHaveLength(1); // no retry after 410
  });

  it("disables an endpoint after repeated failures and e-mails the shop's owners and admins", async () => {
    const { shop, receiver, endpointId } = await setup(() => ({ status: 500 }));
    await api().post(`/api/v1/webhook-endpoints/${endpointId}/test`).set(bearer(shop)).expect(202);
    await receiver.waitFor(3); // the test install disables after 3 failed attempts in a row
    await vi.waitFor(async () => expect((await endpointRow(endpointId)).enabled).toBe(false), { timeout: 5000 });
    const mail = await vi.waitFor(
      async () => {
        const inbox = (await (await fetch(INBOX_URL)).json()) as { to: string[]; subject: string; text: string }[];
        const found = inbox.find((m) => m.text.includes(endpointId));
        expect(found).toBeDefined();
        return found!;
      },
      { timeout: 10_000, interval: 200 },
    );
    expect(mail.to.sort()).toEqual([...shop.admins].sort()); // owner and admin, not the viewer
    expect(mail.subject).toContain(receiver.url);
    // later events are not sent to a disabled endpoint
    await api().post("/api/v1/programs").set(bearer(shop)).send(exampleProgram(shop.shearId)).expect(201);
    await new Promise((r) => setTimeout(r, 500));
    expect(receiver.received).toHaveLength(3);
    const test = await api().post(`/api/v1/webhook-endpoints/${endpointId}/test`).set(bearer(shop));
    expect(test.status).toBe(409);
  });

  it("resends an event with its original webhook-id", async () => {
    const { shop, receiver, endpointId } = await setup();
    await api().post(`/api/v1/webhook-endpoints/${endpointId}/test`).set(bearer(shop)).expect(202);
    const [first] = await receiver.waitFor(1);
    const eventId = String(first.headers["webhook-id"]);
    await api().post(`/api/v1/events/${eventId}/resend`).set(bearer(shop)).send({ endpoint: endpointId }).expect(202);
    const reqs = await receiver.waitFor(2);
    expect(reqs[1].headers["webhook-id"]).toBe(eventId);
    const deliveries = await (await testOrm()).em.fork().find(Delivery, { event: eventId });
    expect(deliveries).toHaveLength(2);
  });
});

describe("secret rotation", () => {
  it("signs with both secrets during the overlap, and with the new one only after", async () => {
    const { shop, receiver, endpointId, secret: oldSecret } = await setup();
    const rotated = await api()
      .post(`/api/v1/webhook-endpoints/${endpointId}/rotate-secret`)
      .set(bearer(shop))
      .send({ overlapHours: 24 })
      .expect(200);
    const newSecret = rotated.body.secret as string;
    expect(newSecret).not.toBe(oldSecret);
    await api().post(`/api/v1/webhook-endpoints/${endpointId}/test`).set(bearer(shop)).expect(202);
    const [during] = await receiver.waitFor(1);
    expect(String(during.headers["webhook-signature"]).split(" ")).toHaveLength(2);
    expect(() => verifier(oldSecret).verify(during.body, headersOf(during))).not.toThrow();
    expect(() => verifier(newSecret).verify(during.body, headersOf(during))).not.toThrow();

    // end the overlap: rotate again with none
    const again = await api()
      .post(`/api/v1/webhook-endpoints/${endpointId}/rotate-secret`)
      .set(bearer(shop))
      .send({ overlapHours: 0 })
      .expect(200);
    await api().post(`/api/v1/webhook-endpoints/${endpointId}/test`).set(bearer(shop)).expect(202);
    const [, after] = await receiver.waitFor(2);
    expect(String(after.headers["webhook-signature"]).split(" ")).toHaveLength(1);
    expect(() => verifier(again.body.secret).verify(after.body, headersOf(after))).not.toThrow();
    expect(() => verifier(newSecret).verify(after.body, headersOf(after))).toThrow();
  });
});
