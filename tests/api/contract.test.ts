/**
 * Every operation of the OpenAPI document, called on the real server over HTTP, each
 * response checked against the document. The last test fails if an operation was missed.
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as catalogOps from "../../lib/api/operations/catalog";
import { operations } from "../../lib/api/operations";
import * as metaOps from "../../lib/api/operations/meta";
import * as gatewayOps from "../../lib/api/operations/gateway";
import * as programOps from "../../lib/api/operations/programs";
import * as planOps from "../../lib/api/operations/plans";
import * as webhookOps from "../../lib/api/operations/webhooks";
import * as settingsOps from "../../lib/api/operations/settings";
import * as stockOps from "../../lib/api/operations/stock";
import { startReceiver, type Receiver } from "../support/receiver";
import { BASE_URL } from "../support/env";
import {
  closeTestOrm,
  createTestShop,
  examplePlan,
  exampleProgram,
  TEST_SHEAR,
  type TestShop,
} from "../support/fixtures";
import { doc, exercised, expectDocumented } from "../support/openapi";

let shop: TestShop;
const api = () => request(BASE_URL);
const auth = () => ({ Authorization: `Bearer ${shop.key}` });

beforeAll(async () => {
  shop = await createTestShop("contract");
});
afterAll(closeTestOrm);

describe("meta", () => {
  it("health", async () => {
    const res = await api().get("/api/v1/health");
    expectDocumented(metaOps.getHealthOperation, res);
    expect(res.status).toBe(200);
  });

  it("serves the OpenAPI document it is tested against", async () => {
    const res = await api().get("/api/v1/openapi.json");
    expectDocumented(metaOps.getOpenApiOperation, res);
    expect(res.body).toEqual(doc);
  });

  it("serves the cut program JSON Schema", async () => {
    const res = await api().get("/api/v1/schemas/cut-program.json");
    expectDocumented(metaOps.getCutProgramSchemaOperation, res);
    expect(res.body.$schema).toBe("https://json-schema.org/draft/2020-12/schema");
    expect(res.body.required).toEqual(
      expect.arrayContaining(["reference", "grade", "thickness", "units", "sheet", "cuts"]),
    );
    expect(res.body.required).not.toContain("shear"); // left out, the shop's shears are checked and one chosen
  });
});

describe("catalog", () => {
  let shearId: string;
  let gradeId: string;

  it("lists, creates, reads, changes and archives shears", async () => {
    const list = await api().get("/api/v1/shears?limit=1").set(auth());
    expectDocumented(catalogOps.listShearsOperation, list);
    expect(list.body.data).toHaveLength(1);

    const created = await api()
      .post("/api/v1/shears")
      .set(auth())
      .send({ ...TEST_SHEAR, name: "Contract shear", backgaugeRepeatabilityMm: 0.05, crownBaselineMm: 0.03 });
    expectDocumented(catalogOps.createShearOperation, created);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ backgaugeRepeatabilityMm: 0.05, crownBaselineMm: 0.03, crownAtRatedMm: null }); // the machine's figures as given
    shearId = created.body.id;
    expect(shearId).toMatch(/^shr_[0-9A-Z]{26}$/);

    const read = await api().get(`/api/v1/shears/${shearId}`).set(auth());
    expectDocumented(catalogOps.getShearOperation, read);
    expect(read.body).toEqual(created.body);

    const changed = await api()
      .patch(`/api/v1/shears/${shearId}`)
      .set(auth())
      .send({ strokesPerMin: 25, gradeThicknessLimitsMm: { "304": 3 } });
    expectDocumented(catalogOps.updateShearOperation, changed);
    expect(changed.body).toMatchObject({ strokesPerMin: 25, gradeThicknessLimitsMm: { "304": 3 } });

    const archived = await api().post(`/api/v1/shears/${shearId}/archive`).set(auth());
    expectDocumented(catalogOps.archiveShearOperation, archived);
    expect(archived.body.archivedAt).not.toBeNull();
    const active = await api().get("/api/v1/shears").set(auth());
    expect(active.body.data.map((s: { id: string }) => s.id)).not.toContain(shearId);
    const all = await api().get("/api/v1/shears?include_archived=true").set(auth());
    expect(all.body.data.map((s: { id: string }) => s.id)).toContain(shearId);
  });

  it("lists, creates, reads, changes and archives grades", async () => {
    const list = await api().get("/api/v1/grades?family=stainless").set(auth());
    expectDocumented(catalogOps.listGradesOperation, list);
    expect(list.body.data.every((g: { family: string }) => g.family === "stainless")).toBe(true);

    const created = await api().post("/api/v1/grades").set(auth()).send({
      code: "S355",
      name: "Structural steel (demo entry)",
      family: "hsla-steel",
      standard: "entered by the shop",
      yieldMpa: 355,
      tensileMinMpa: 470,
      gaugeFamily: null,
    });
    expectDocumented(catalogOps.createGradeOperation, created);
    expect(created.status).toBe(201);
    expect(created.body.shearTensileRatio).toBeGreaterThan(0);
    gradeId = created.body.id;

    const read = await api().get(`/api/v1/grades/${gradeId}`).set(auth());
    expectDocumented(catalogOps.getGradeOperation, read);

    const changed = await api().patch(`/api/v1/grades/${gradeId}`).set(auth()).send({ hardnessHb: 160 });
    expectDocumented(catalogOps.updateGradeOperation, changed);
    expect(changed.body.hardnessHb).toBe(160);

    const archived = await api().post(`/api/v1/grades/${gradeId}/archive`).set(auth());
    expectDocumented(catalogOps.archiveGradeOperation, archived);
    expect(archived.body.archivedAt).not.toBeNull();
  });

  it("reads the gauge tables", async () => {
    const res = await api().get("/api/v1/gauges").set(auth());
    expectDocumented(catalogOps.listGaugesOperation, res);
    expect(res.body.data.map((t: { family: string }) => t.family)).toEqual(["msg", "galvanized", "ussg", "awg"]);
    const msg = res.body.data[0].rows.find((r: { gauge: number }) => r.gauge === 10);
    expect(msg.in).toBeCloseTo(0.1345, 4); // Manufacturers' Standard Gauge chart: 10 ga = 0.1345 in
  });

  it("recommends a setup without a program", async () => {
    const res = await api()
      .post("/api/v1/setup")
      .set(auth())
      .send({ shear: shop.shearId, grade: "A36", thickness: { gauge: 10 }, units: "in" });
    expectDocumented(catalogOps.recommendSetupOperation, res);
    expect(res.body.thickness.value).toBeCloseTo(0.1345, 4);
    expect(res.body.setup.bladeGap.why).toMatch(/thickness/);
    expect(res.body.setup.bladeGap.value).toBeGreaterThanOrEqual(0.005); // a shear-blade maker's mild-steel chart: 10 ga, 0.005–0.009 in
    expect(res.body.setup.bladeGap.value).toBeLessThanOrEqual(0.009);
    expect(res.body.setup.gapEnds.value).toBe(res.body.setup.bladeGap.value);
    expect(res.body.setup.gapCentre.value).toBeCloseTo(res.body.setup.gapEnds.value - res.body.setup.crown.value, 4);
    expect(res.body.setup.crown.value).toBeGreaterThanOrEqual(0.002); // the 0.002 in no-load baseline (US Navy shipfitter manual) plus the load's part
    expect(res.body.setup.gapCentre.why).toMatch(/crown/);
    expect(res.body.setup.rake.why).toMatch(/twist, bow and camber/);
    expect(res.body.findings).toEqual([]);

    const over = await api()
      .post("/api/v1/setup")
      .set(auth())
      .send({ shear: shop.shearId, grade: "A36", thickness: { value: 12 }, units: "mm" });
    expect(over.body.findings.map((f: { code: string }) => f.code)).toContain("thickness_over_capacity");
  });
});

describe("programs", () => {
  let id: string;
  let etag: string;

  it("checks a program without storing it", async () => {
    const res = await api().post("/api/v1/programs/validate").set(auth()).send(exampleProgram(shop.shearId));
    expectDocumented(programOps.validateProgramOperation, res);
    expect(res.body).toMatchObject({ validation: "pass", findings: [] });
    const none = await api().get("/api/v1/programs").set(auth());
    expect(none.body.data).toEqual([]);
  });

  it("creates a program with its check", async () => {
    const res = await api().post("/api/v1/programs").set(auth()).send(exampleProgram(shop.shearId, "SO-2291/4"));
    expectDocumented(programOps.createProgramOperation, res);
    expect(res.status).toBe(201);
    id = res.body.id;
    etag = res.headers.etag;
    expect(res.headers.location).toBe(`/api/v1/programs/${id}`);
    expect(etag).toBe('"1"');
    // the cut-program worked example of our API docs: 56 blanks, 62 strokes, 93.3 % of the stock used
    expect(res.body.check.yield.total).toMatchObject({ blanks: 56, strokes: 62 });
    expect(res.body.check.yield.utilisationPct).toBe(93.3);
    expect(res.body.check).not.toHaveProperty("layout"); // read apart: GET /programs/{id}/layout
    expect(res.body.check.setup.gapCentre.value).toBeLessThan(res.body.check.setup.gapEnds.value);
  });

  it("creates programs in a batch, all or nothing or each on its own", async () => {
    const all = await api()
      .post("/api/v1/programs/batch")
      .set(auth())
      .send({ programs: [exampleProgram(shop.shearId), exampleProgram(shop.shearId)] });
    expectDocumented(programOps.createProgramBatchOperation, all);
    expect(all.status).toBe(201);
    expect(all.body.data).toHaveLength(2);
    const each = await api()
      .post("/api/v1/programs/batch")
      .set(auth())
      .send({ atomic: false, programs: [exampleProgram(shop.shearId), { reference: "half a program" }] });
    expectDocumented(programOps.createProgramBatchOperation, each);
    expect(each.status).toBe(207);
    expect(each.body.data.map((d: { status: number }) => d.status)).toEqual([201, 422]);
  });

  it("reads and lists programs", async () => {
    const read = await api().get(`/api/v1/programs/${id}`).set(auth());
    expectDocumented(programOps.getProgramOperation, read);
    expect(read.headers.etag).toBe(etag);
    const list = await api().get("/api/v1/programs?status=draft&reference=SO-2291%2F4").set(auth());
    expectDocumented(programOps.listProgramsOperation, list);
    expect(list.body.data.map((p: { id: string }) => p.id)).toEqual([id]);
  });

  it("reads one sheet of a program as it is cut", async () => {
    const res = await api().get(`/api/v1/programs/${id}/layout`).set(auth());
    expectDocumented(programOps.getProgramLayoutOperation, res);
    expect(res.headers.etag).toBe(etag);
    expect(res.body).toMatchObject({ id, revision: 1, layout: { unit: "in" } });
    // the cut-program worked example of our API docs, one sheet: 28 blanks 16 × 12 in and 4 offcuts 8 × 12 in,
    // 31 cut lines (3 rips, then 7 crosscuts on each of the 4 strips)
    const rectangles = res.body.layout.rectangles as Array<{ kind: string; length: number; width: number }>;
    expect(rectangles.filter((r) => r.kind === "blank")).toHaveLength(28);
    expect(rectangles.filter((r) => r.kind === "blank").every((r) => r.length === 16 && r.width === 12)).toBe(true);
    expect(rectangles.filter((r) => r.kind === "offcut").every((r) => r.length === 8 && r.width === 12)).toBe(true);
    expect(res.body.layout.cuts).toHaveLength(31);
    const missing = await api().get("/api/v1/programs/prg_01JEXAMPLE0000000000000000/layout").set(auth());
    expectDocumented(programOps.getProgramLayoutOperation, missing);
    expect(missing.status).toBe(404);
  });

  it("changes a draft with If-Match", async () => {
    const res = await api()
      .patch(`/api/v1/programs/${id}`)
      .set(auth())
      .set("If-Match", etag)
      .send({ title: "Side panels, lot 4 (rev B)" });
    expectDocumented(programOps.updateProgramOperation, res);
    expect(res.body.revision).toBe(2);
    etag = res.headers.etag;
  });

  it("releases and cancels", async () => {
    const released = await api().post(`/api/v1/programs/${id}/release`).set(auth()).send({});
    expectDocumented(programOps.releaseProgramOperation, released);
    expect(released.body.status).toBe("released");
    const cancelled = await api().post(`/api/v1/programs/${id}/cancel`).set(auth()).send({ reason: "order withdrawn" });
    expectDocumented(programOps.cancelProgramOperation, cancelled);
    expect(cancelled.body.status).toBe("cancelled");
  });
});

describe("plans", () => {
  let planId: string;

  it("queues, waits, lists, reads, previews and writes the programs; cancels another", async () => {
    const created = await api()
      .post("/api/v1/plans")
      .set(auth())
      .set("Prefer", "wait=10")
      .send(examplePlan(shop.shearId));
    expectDocumented(planOps.createPlanOperation, created);
    expect(created.status).toBe(201);
    expect(created.body.status).toBe("complete");
    planId = created.body.id;
    expect(created.headers.location).toBe(`/api/v1/plans/${planId}`);

    const list = await api().get("/api/v1/plans?limit=5").set(auth());
    expectDocumented(planOps.listPlansOperation, list);
    expect(list.body.data[0].id).toBe(planId);

    const read = await api().get(`/api/v1/plans/${planId}`).set(auth());
    expectDocumented(planOps.getPlanOperation, read);
    expect(read.body).toEqual(created.body);

    const preview = await api().post("/api/v1/plans/preview").set(auth()).send(examplePlan(shop.shearId));
    expectDocumented(planOps.previewPlanOperation, preview);
    expect(preview.body.patterns).toEqual(created.body.result.patterns); // the same order plans the same, stored or not

    const written = await api().post(`/api/v1/plans/${planId}/programs`).set(auth()).send({ priority: 7 });
    expectDocumented(planOps.writePlanProgramsOperation, written);
    expect(written.status).toBe(201);
    expect(written.body.data).toHaveLength(created.body.result.patterns.length);

    const again = await api().post(`/api/v1/plans/${planId}/programs`).set(auth()).send({});
    expectDocumented(planOps.writePlanProgramsOperation, again);
    expect(again.status).toBe(409);

    const queued = await api().post("/api/v1/plans").set(auth()).send(examplePlan(shop.shearId));
    expectDocumented(planOps.createPlanOperation, queued);
    expect(queued.status).toBe(202);
    const cancelled = await api().post(`/api/v1/plans/${queued.body.id}/cancel`).set(auth()).send({});
    expectDocumented(planOps.cancelPlanOperation, cancelled);
    expect([200, 409]).toContain(cancelled.status); // 409 if the worker finished it first
  });
});

describe("gateway", () => {
  async function released() {
    const created = await api().post("/api/v1/programs").set(auth()).send(exampleProgram(shop.shearId));
    await api().post(`/api/v1/programs/${created.body.id}/release`).set(auth()).send({}).expect(200);
    return created.body.id as string;
  }

  it("claims, keeps, starts, reports and completes", async () => {
    const id = await released();
    const claim = await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(auth()).send({ waitSeconds: 0 });
    expectDocumented(gatewayOps.claimProgramOperation, claim);
    expect(claim.body.program).toMatchObject({ id, status: "claimed" });
    const hb = await api().post(`/api/v1/programs/${id}/heartbeat`).set(auth()).send({ leaseSeconds: 120 });
    expectDocumented(gatewayOps.heartbeatProgramOperation, hb);
    expect(hb.body.lease.seconds).toBe(120);
    const started = await api().post(`/api/v1/programs/${id}/start`).set(auth());
    expectDocumented(gatewayOps.startProgramOperation, started);
    const progressed = await api()
      .post(`/api/v1/programs/${id}/progress`)
      .set(auth())
      .send({ groupsDone: 2, strokesDone: 10 });
    expectDocumented(gatewayOps.reportProgressOperation, progressed);
    expect(progressed.body.run.progress).toEqual({ groupsDone: 2, strokesDone: 10 });
    const done = await api()
      .post(`/api/v1/programs/${id}/complete`)
      .set(auth())
      .send({ goodPieces: 56, scrappedPieces: 0 });
    expectDocumented(gatewayOps.completeProgramOperation, done);
    expect(done.body).toMatchObject({ status: "completed", run: { outcome: { result: "completed", goodPieces: 56 } } });
  });

  it("reports a failed run, and answers 204 when nothing is released", async () => {
    const id = await released();
    await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(auth()).send({}).expect(200);
    const failed = await api()
      .post(`/api/v1/programs/${id}/fail`)
      .set(auth())
      .send({ reason: "guard_tripped", message: "rear guard opened" });
    expectDocumented(gatewayOps.failProgramOperation, failed);
    expect(failed.body.status).toBe("failed");
    const none = await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(auth()).send({ waitSeconds: 0 });
    expectDocumented(gatewayOps.claimProgramOperation, none);
    expect(none.status).toBe(204);
  });
});

describe("webhooks", () => {
  let receiver: Receiver;
  let endpointId: string;
  beforeAll(async () => {
    receiver = await startReceiver();
  });
  afterAll(async () => receiver.close());

  it("adds, lists, reads and changes an endpoint", async () => {
    const created = await api()
      .post("/api/v1/webhook-endpoints")
      .set(auth())
      .send({ url: receiver.url, description: "contract", eventTypes: ["program.created"] });
    expectDocumented(webhookOps.createEndpointOperation, created);
    expect(created.body.secret).toMatch(/^whsec_/);
    endpointId = created.body.endpoint.id;
    const list = await api().get("/api/v1/webhook-endpoints").set(auth());
    expectDocumented(webhookOps.listEndpointsOperation, list);
    const read = await api().get(`/api/v1/webhook-endpoints/${endpointId}`).set(auth());
    expectDocumented(webhookOps.getEndpointOperation, read);
    expect(JSON.stringify(read.body)).not.toContain(created.body.secret);
    const changed = await api().patch(`/api/v1/webhook-endpoints/${endpointId}`).set(auth()).send({ eventTypes: [] });
    expectDocumented(webhookOps.updateEndpointOperation, changed);
  });

  it("sends a test event, rotates the secret, and shows deliveries", async () => {
    const test = await api().post(`/api/v1/webhook-endpoints/${endpointId}/test`).set(auth());
    expectDocumented(webhookOps.testEndpointOperation, test);
    expect(test.status).toBe(202);
    await receiver.waitFor(1);
    const rotated = await api()
      .post(`/api/v1/webhook-endpoints/${endpointId}/rotate-secret`)
      .set(auth())
      .send({ overlapHours: 1 });
    expectDocumented(webhookOps.rotateSecretOperation, rotated);
    expect(rotated.body.endpoint.secretRotation).not.toBeNull();
    const deliveries = await api().get(`/api/v1/webhook-endpoints/${endpointId}/deliveries`).set(auth());
    expectDocumented(webhookOps.listEndpointDeliveriesOperation, deliveries);
  });

  it("lists events, reads one with its deliveries, and resends it", async () => {
    const events = await api().get("/api/v1/events?type=endpoint.test").set(auth());
    expectDocumented(webhookOps.listEventsOperation, events);
    const eventId = events.body.data[0].id;
    const event = await api().get(`/api/v1/events/${eventId}`).set(auth());
    expectDocumented(webhookOps.getEventOperation, event);
    const deliveries = await api().get(`/api/v1/events/${eventId}/deliveries`).set(auth());
    expectDocumented(webhookOps.listEventDeliveriesOperation, deliveries);
    const resent = await api().post(`/api/v1/events/${eventId}/resend`).set(auth()).send({ endpoint: endpointId });
    expectDocumented(webhookOps.resendEventOperation, resent);
    expect(resent.status).toBe(202);
  });

  it("removes an endpoint", async () => {
    const res = await api().delete(`/api/v1/webhook-endpoints/${endpointId}`).set(auth());
    expectDocumented(webhookOps.deleteEndpointOperation, res);
    expect(res.status).toBe(204);
  });
});

describe("stock", () => {
  it("adds, lists, reads, adjusts, reserves, releases and archives stock", async () => {
    const created = await api().post("/api/v1/stock").set(auth()).send({
      kind: "remnant",
      grade: "A36",
      thicknessMm: 3,
      lengthMm: 900,
      widthMm: 600,
      quantity: 2,
      location: "R9",
    });
    expectDocumented(stockOps.createStockItemOperation, created);
    expect(created.status).toBe(201);
    const id = created.body.id;
    const list = await api().get("/api/v1/stock?grade=A36&thicknessMm=3&kind=remnant&limit=5").set(auth());
    expectDocumented(stockOps.listStockOperation, list);
    expect(list.body.data.map((s: { id: string }) => s.id)).toContain(id);
    const read = await api().get(`/api/v1/stock/${id}`).set(auth());
    expectDocumented(stockOps.getStockItemOperation, read);
    const adjusted = await api().post(`/api/v1/stock/${id}/adjust`).set(auth()).send({ delta: 1, reason: "found" });
    expectDocumented(stockOps.adjustStockOperation, adjusted);
    expect(adjusted.body.quantity).toBe(3);
    const reserved = await api().post(`/api/v1/stock/${id}/reservations`).set(auth()).send({ quantity: 2 });
    expectDocumented(stockOps.reserveStockOperation, reserved);
    expect(reserved.status).toBe(201);
    const released = await api().post(`/api/v1/stock-reservations/${reserved.body.id}/release`).set(auth());
    expectDocumented(stockOps.releaseReservationOperation, released);
    expect(released.body.status).toBe("released");
    const archived = await api().post(`/api/v1/stock/${id}/archive`).set(auth());
    expectDocumented(stockOps.archiveStockItemOperation, archived);
    expect(archived.body.archivedAt).not.toBeNull();
  });
});

describe("settings", () => {
  it("reads and changes the shop's settings", async () => {
    const read = await api().get("/api/v1/settings").set(auth());
    expectDocumented(settingsOps.getSettingsOperation, read);
    expect(read.body).toEqual({ routingRule: "least_capacity", remnantMinMm: null });
    const changed = await api().patch("/api/v1/settings").set(auth()).send({ routingRule: "least_capacity" });
    expectDocumented(settingsOps.updateSettingsOperation, changed);
    expect(changed.status).toBe(200);
  });
});

describe("the document", () => {
  it("has been exercised operation by operation", () => {
    expect([...exercised].sort()).toEqual(operations.map((o) => o.operationId).sort());
  });
});
