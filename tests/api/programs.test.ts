/**
 * Program behaviour over real HTTP: duplicates, If-Match, the release rules, the lifecycle,
 * pagination and filters, the outbox events, and what gets logged.
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { Event, RequestLog } from "../../entities";
import * as ops from "../../lib/api/operations/programs";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, testOrm, type TestShop } from "../support/fixtures";
import { expectDocumented } from "../support/openapi";

let shop: TestShop;
const api = () => request(BASE_URL);
const auth = () => ({ Authorization: `Bearer ${shop.key}` });
const create = async (body: object) => api().post("/api/v1/programs").set(auth()).send(body);

beforeAll(async () => {
  shop = await createTestShop("programs");
});
afterAll(closeTestOrm);

describe("create", () => {
  it("answers 409 with the existing id for a second program with the same reference", async () => {
    const first = await create(exampleProgram(shop.shearId, "DUP-1"));
    expect(first.status).toBe(201);
    const second = await create({ ...exampleProgram(shop.shearId, "DUP-1"), title: "another" });
    expectDocumented(ops.createProgramOperation, second);
    expect(second.status).toBe(409);
    expect(second.body.existingId).toBe(first.body.id);
  });

  it("answers 409 for a taken reference before refusing its shear, and writes no second event", async () => {
    const first = await create(exampleProgram(shop.shearId, "DUP-2"));
    expect(first.status).toBe(201);
    const second = await create({ ...exampleProgram(shop.shearId, "DUP-2"), shear: "no such shear" });
    expect(second.status).toBe(409);
    expect(second.body.existingId).toBe(first.body.id);
    const em = (await testOrm()).em.fork();
    expect(await em.count(Event, { subjectId: first.body.id })).toBe(1);
  });

  it("stores a program with errors as a draft with its findings, pointing at the cut", async () => {
    const body = exampleProgram(shop.shearId);
    body.cuts[0].backgauge = 60; // wider than the 48 in sheet
    const res = await create(body);
    expect(res.status).toBe(201);
    expect(res.body.validation).toBe("fail");
    const finding = res.body.check.findings.find((f: { code: string }) => f.code === "backgauge_beyond_workpiece");
    expect(finding).toMatchObject({ severity: "error", pointer: "/cuts/0/backgauge", unit: "in" });
  });

  it("refuses an unknown shear with 422 naming /shear, and stores nothing", async () => {
    const res = await create(exampleProgram("shr_01J00000000000000000000000", "NOSHEAR-1"));
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([expect.objectContaining({ location: "body", pointer: "/shear" })]);
    const list = await api().get("/api/v1/programs?reference=NOSHEAR-1").set(auth());
    expect(list.body.data).toEqual([]);
  });

  it("takes the shear by name (any case) and stores its id; an unknown name is refused naming /shear", async () => {
    const res = await create(exampleProgram("test SHEAR"));
    expect(res.status).toBe(201);
    expect(res.body.shear).toBe(shop.shearId);
    const unknown = await create(exampleProgram("No such shear"));
    expect(unknown.status).toBe(422);
    expect(unknown.body.errors).toEqual([expect.objectContaining({ pointer: "/shear" })]);
  });

  it("reports an unknown grade as a finding", async () => {
    const res = await create({ ...exampleProgram(shop.shearId), grade: "UNOBTAINIUM" });
    expect(res.status).toBe(201);
    expect(res.body.check.findings.map((f: { code: string }) => f.code)).toContain("grade_unknown");
  });

  it("writes program.created in the outbox", async () => {
    const res = await create(exampleProgram(shop.shearId));
    const events = await (await testOrm()).em.fork().find(Event, { subjectId: res.body.id });
    expect(events.map((e) => e.type)).toEqual(["program.created"]);
    expect(events[0].data).toMatchObject({ program: { id: res.body.id, revision: 1 } });
  });
});

describe("layout", () => {
  // 1000 × 300.05 mm, two strokes at 100 mm: the 100.05 mm remnant is a third blank within a ±0.1 mm backgauge
  // repeatability (the default), offcut within ±0.02 mm (`tests/components/cut-drawing.test.ts` draws the same).
  const remnantProgram = (reference: string) => ({
    reference,
    shear: layoutShop.shearId,
    grade: "A36",
    thickness: { value: 3 },
    units: "mm",
    sheet: { length: 1000, width: 300.05, count: 1 },
    cuts: [{ backgauge: 100, count: 2 }],
  });
  const blanks = (layout: { rectangles: { kind: string }[] }) => layout.rectangles.filter((r) => r.kind === "blank");
  let layoutShop: TestShop;
  beforeAll(async () => {
    layoutShop = await createTestShop("programs-layout");
  });
  const as = () => ({ Authorization: `Bearer ${layoutShop.key}` });

  it("is placed with the tolerance its check counted with, even after the shear's repeatability changes", async () => {
    const first = await api().post("/api/v1/programs").set(as()).send(remnantProgram("LAYOUT-1"));
    expect(first.status).toBe(201);
    expect(first.body.check.yield).toMatchObject({ remnantToleranceMm: 0.1, perSheet: { blanks: 3 } });
    const tighter = await api()
      .patch(`/api/v1/shears/${layoutShop.shearId}`)
      .set(as())
      .send({ backgaugeRepeatabilityMm: 0.02 });
    expect(tighter.status).toBe(200);

    const read = await api().get(`/api/v1/programs/${first.body.id}/layout`).set(as());
    expectDocumented(ops.getProgramLayoutOperation, read);
    expect(blanks(read.body.layout)).toHaveLength(3); // as the stored check counted, not as the shear is now

    const second = await api().post("/api/v1/programs").set(as()).send(remnantProgram("LAYOUT-2"));
    expect(second.body.check.yield).toMatchObject({ remnantToleranceMm: 0.02, perSheet: { blanks: 2 } });
    const tight = await api().get(`/api/v1/programs/${second.body.id}/layout`).set(as());
    expect(blanks(tight.body.layout)).toHaveLength(2);
    expect(tight.body.layout.rectangles.filter((r: { kind: string }) => r.kind === "offcut")).toHaveLength(1);
  });

  it("places a check stored before it reported its tolerance with the shear's", async () => {
    await api().patch(`/api/v1/shears/${layoutShop.shearId}`).set(as()).send({ backgaugeRepeatabilityMm: null });
    const stored = await api().post("/api/v1/programs").set(as()).send(remnantProgram("LAYOUT-OLD"));
    expect(stored.body.check.yield.perSheet.blanks).toBe(3); // counted at the default 0.1 mm
    await api().patch(`/api/v1/shears/${layoutShop.shearId}`).set(as()).send({ backgaugeRepeatabilityMm: 0.02 });
    const em = (await testOrm()).em.fork();
    await em
      .getConnection()
      .execute(
        `update programs set "check" = json_build_object('validation', 'pass', 'findings', '[]'::json, 'yield', null) where id = ?`,
        [stored.body.id],
      );
    const read = await api().get(`/api/v1/programs/${stored.body.id}/layout`).set(as());
    expect(read.status).toBe(200);
    expect(blanks(read.body.layout)).toHaveLength(2); // the shear's 0.02 mm as it is now
  });
});

describe("update", () => {
  it("needs If-Match (428), refuses a stale one (412), and bumps the revision", async () => {
    const { body: p } = await create(exampleProgram(shop.shearId));
    const missing = await api().patch(`/api/v1/programs/${p.id}`).set(auth()).send({ title: "x" });
    expectDocumented(ops.updateProgramOperation, missing);
    expect(missing.status).toBe(428);

    const ok = await api().patch(`/api/v1/programs/${p.id}`).set(auth()).set("If-Match", '"1"').send({ title: "x" });
    expect(ok.status).toBe(200);
    expect(ok.headers.etag).toBe('"2"');

    const stale = await api().patch(`/api/v1/programs/${p.id}`).set(auth()).set("If-Match", '"1"').send({ title: "y" });
    expectDocumented(ops.updateProgramOperation, stale);
    expect(stale.status).toBe(412);
    expect(stale.body.currentRevision).toBe(2);

    const read = await api().get(`/api/v1/programs/${p.id}`).set(auth());
    expect(read.body.title).toBe("x");
  });

  it("checks the program again after a change", async () => {
    const { body: p } = await create(exampleProgram(shop.shearId));
    const res = await api()
      .patch(`/api/v1/programs/${p.id}`)
      .set(auth())
      .set("If-Match", '"1"')
      .send({ sheet: { length: 120, width: 48, count: 5 } });
    expect(res.body.check.yield.total.blanks).toBe(140); // 28 blanks a sheet × 5 sheets
  });

  it("refuses to change a released program (409, with its state)", async () => {
    const { body: p } = await create(exampleProgram(shop.shearId));
    await api().post(`/api/v1/programs/${p.id}/release`).set(auth()).send({}).expect(200);
    const res = await api()
      .patch(`/api/v1/programs/${p.id}`)
      .set(auth())
      .set("If-Match", '"2"')
      .send({ title: "late" });
    expect(res.status).toBe(409);
    expect(res.body.currentStatus).toBe("released");
  });

  it("refuses to take another program's reference", async () => {
    const a = await create(exampleProgram(shop.shearId, "REF-A"));
    const b = await create(exampleProgram(shop.shearId, "REF-B"));
    const res = await api()
      .patch(`/api/v1/programs/${b.body.id}`)
      .set(auth())
      .set("If-Match", '"1"')
      .send({ reference: "REF-A" });
    expect(res.status).toBe(409);
    expect(res.body.existingId).toBe(a.body.id);
  });
});

describe("release", () => {
  it("refuses a program with errors and lists them", async () => {
    const body = exampleProgram(shop.shearId);
    body.cuts[0].backgauge = 60;
    const { body: p } = await create(body);
    const res = await api().post(`/api/v1/programs/${p.id}/release`).set(auth()).send({});
    expectDocumented(ops.releaseProgramOperation, res);
    expect(res.status).toBe(409);
    expect(res.body.type).toBe("/problems/program-not-releasable");
    expect(res.body.findings.some((f: { pointer: string }) => f.pointer === "/cuts/0/backgauge")).toBe(true);
  });

  it("needs every warning acknowledged", async () => {
    // a strip 0.25 in wide and 120 in long out of 10 ga: narrow for its thickness and length
    const body = { ...exampleProgram(shop.shearId), cuts: [{ backgauge: 0.25, count: 1 }] };
    const { body: p } = await create(body);
    expect(p.validation).toBe("warn");
    const codes = [...new Set(p.check.findings.map((f: { code: string }) => f.code))];
    const refused = await api().post(`/api/v1/programs/${p.id}/release`).set(auth()).send({ acknowledge: [] });
    expect(refused.status).toBe(409);
    expect(refused.body.type).toBe("/problems/warnings-not-acknowledged");
    expect(refused.body.unacknowledged.sort()).toEqual(codes.sort());
    const ok = await api().post(`/api/v1/programs/${p.id}/release`).set(auth()).send({ acknowledge: codes });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ status: "released", acknowledged: codes });
    expect(ok.body.releasedAt).not.toBeNull();
  });

  it("is one-way: a released program cannot be released again", async () => {
    const { body: p } = await create(exampleProgram(shop.shearId));
    await api().post(`/api/v1/programs/${p.id}/release`).set(auth()).send({}).expect(200);
    const again = await api().post(`/api/v1/programs/${p.id}/release`).set(auth()).send({});
    expect(again.status).toBe(409);
    expect(again.body.currentStatus).toBe("released");
    const events = await (await testOrm()).em.fork().find(Event, { subjectId: p.id }, { orderBy: { id: "asc" } });
    expect(events.map((e) => e.type)).toEqual(["program.created", "program.released"]);
  });
});

describe("cancel", () => {
  it("cancels once and then refuses", async () => {
    const { body: p } = await create(exampleProgram(shop.shearId));
    const res = await api().post(`/api/v1/programs/${p.id}/cancel`).set(auth()).send({});
    expect(res.body.status).toBe("cancelled");
    const again = await api().post(`/api/v1/programs/${p.id}/cancel`).set(auth()).send({});
    expectDocumented(ops.cancelProgramOperation, again);
    expect(again.status).toBe(409);
    expect(again.body.currentStatus).toBe("cancelled");
  });
});

describe("list", () => {
  it("pages with limit and cursor, newest first, without repeats", async () => {
    const own = await createTestShop("paging");
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) {
      const r = await api()
        .post("/api/v1/programs")
        .set("Authorization", `Bearer ${own.key}`)
        .send(exampleProgram(own.shearId));
      ids.push(r.body.id);
    }
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const res: request.Response = await api()
        .get(`/api/v1/programs?limit=2${cursor ? `&cursor=${cursor}` : ""}`)
        .set("Authorization", `Bearer ${own.key}`);
      expect(res.body.data.length).toBeLessThanOrEqual(2);
      seen.push(...res.body.data.map((p: { id: string }) => p.id));
      cursor = res.body.next_cursor;
    } while (cursor);
    expect(seen).toEqual([...ids].reverse());
  });

  it("filters by status and updated_since, and refuses a forged cursor", async () => {
    const since = new Date().toISOString();
    const { body: p } = await create(exampleProgram(shop.shearId));
    const res = await api()
      .get(`/api/v1/programs?status=draft&updated_since=${encodeURIComponent(since)}`)
      .set(auth());
    expect(res.body.data.map((x: { id: string }) => x.id)).toContain(p.id);
    expect(res.body.data.every((x: { status: string }) => x.status === "draft")).toBe(true);
    const bad = await api().get("/api/v1/programs?cursor=not-a-cursor").set(auth());
    expect(bad.status).toBe(400);
    const badLimit = await api().get("/api/v1/programs?limit=5000").set(auth());
    expectDocumented(ops.listProgramsOperation, badLimit);
    expect(badLimit.status).toBe(422);
    expect(badLimit.body.errors[0]).toMatchObject({ location: "query", pointer: "/limit" });
  });
});

describe("request log", () => {
  it("logs key, route, status, latency and idempotency key, never the secret or body", async () => {
    const res = await api()
      .post("/api/v1/programs")
      .set(auth())
      .set("Idempotency-Key", "log-check-1")
      .send(exampleProgram(shop.shearId, "LOG-SECRET-REF"));
    const id = res.headers["x-request-id"];
    expect(id).toMatch(/^req_/);
    const em = (await testOrm()).em.fork();
    // rows are written in batches a fraction of a second after the response
    const row = await vi.waitFor(() => em.findOneOrFail(RequestLog, { id }, { disableIdentityMap: true }), {
      timeout: 5000,
      interval: 100,
    });
    expect(row).toMatchObject({
      shopId: shop.shopId,
      method: "POST",
      route: "/api/v1/programs",
      status: 201,
      idempotencyKey: "log-check-1",
    });
    expect(row.latencyMs).toBeGreaterThan(0);
    const raw = JSON.stringify(await em.getConnection().execute("select * from request_logs where id = ?", [id]));
    expect(raw).not.toContain(shop.key);
    expect(raw).not.toContain("LOG-SECRET-REF");
  });

  it("says where the time went (Server-Timing)", async () => {
    const res = await api().get("/api/v1/shears").set(auth());
    expect(res.headers["server-timing"]).toMatch(/^auth;dur=[\d.]+, ratelimit;dur=[\d.]+, handler;dur=[\d.]+$/);
  });

  it("sends no-store and a request id on every authenticated response, errors included", async () => {
    for (const r of [
      await api().get("/api/v1/programs").set(auth()),
      await api().get("/api/v1/programs/prg_x").set(auth()),
    ]) {
      expect(r.headers["cache-control"]).toBe("no-store");
      expect(r.headers["x-request-id"]).toMatch(/^req_/);
    }
  });
});
