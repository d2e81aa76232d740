/**
 * Plans over real HTTP: the worked example planned and written as a program the shear core
 * agrees with, mixed demand in millimetres whose written programs make exactly what the plan
 * says, findings for what cannot be placed, bad input refused with nothing stored, and the
 * programs written once, all or nothing.
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Event, Program } from "../../entities";
import * as ops from "../../lib/api/operations/plans";
import { BASE_URL } from "../support/env";
import {
  closeTestOrm,
  createTestShop,
  exampleProgram,
  examplePlan,
  TEST_SHEAR,
  testOrm,
  type TestShop,
} from "../support/fixtures";
import { largestOrder } from "../../scripts/lib/orders";
import { expectDocumented } from "../support/openapi";

let shop: TestShop;
const api = () => request(BASE_URL);
const auth = () => ({ Authorization: `Bearer ${shop.key}` });
/** Plan and wait for the answer (Prefer: wait); a complete plan's result is flattened into the body, beside its id. */
async function plan(body: object) {
  const res = await api().post("/api/v1/plans").set(auth()).set("Prefer", "wait=10").send(body);
  if (res.status !== 201) return res;
  return {
    ...res,
    status: res.status,
    headers: res.headers,
    raw: res.body,
    body: { id: res.body.id, planStatus: res.body.status, ...res.body.result, programs: res.body.programs },
  };
}
const write = (id: string, body: object = {}) => api().post(`/api/v1/plans/${id}/programs`).set(auth()).send(body);
const sizeKey = (a: number, b: number) => (a <= b ? `${a}x${b}` : `${b}x${a}`);

beforeAll(async () => {
  shop = await createTestShop("plans");
});
afterAll(closeTestOrm);

describe("the worked example of our cut-program docs, as order lines", () => {
  it("plans 56 blanks 16 × 12 in onto two 120 × 48 in sheets and writes the same program the docs show", async () => {
    const res = await plan({
      reference: "WE-1",
      shear: shop.shearId,
      grade: "A36",
      thickness: { gauge: 10 },
      units: "in",
      stock: [{ length: 120, width: 48 }],
      blanks: [{ label: "panel", length: 16, width: 12, quantity: 56, canTurn: false }],
    });
    expect(res.status).toBe(201);
    expectDocumented(ops.createPlanOperation, { ...res, body: (res as { raw?: unknown }).raw });
    expect(res.body.planStatus).toBe("complete");
    expect(res.body.coverage).toBe("complete");
    expect(res.body.summary).toMatchObject({
      sheets: 2,
      patterns: 1,
      blanksAsked: 56,
      blanksPlanned: 56,
      extra: 0,
      short: 0,
      utilisationPct: 93.33,
    }); // worked example: 93.3 %
    // 56 × 192 in² is more than one 5 760 in² sheet, so 2 is the fewest (hand arithmetic); the first pattern filled already meets it
    expect(res.body.summary).toMatchObject({
      lowerBoundSheets: 2,
      provenFewest: true,
      bounds: { areaSheets: 2, lpSheets: null },
      method: "greedy",
      methodNote: null,
    });
    const [p] = res.body.patterns;
    expect(p.repeats).toBe(2);
    // Stored as runs: one strip repeated 4 times (worked example: 4 strips 12 × 120), one run of 7 blanks (worked example: 7 per strip).
    expect(p.strips).toEqual([
      expect.objectContaining({
        y: 0,
        width: 12,
        repeat: 4,
        pieces: [expect.objectContaining({ x: 0, length: 16, width: 12, count: 7 })],
      }),
    ]);
    expect(
      p.cuts.map((c: { backgauge: number; count: number; turn?: boolean }) => [c.backgauge, c.count, c.turn ?? false]),
    ).toEqual([
      [12, 3, false],
      [16, 7, true],
    ]); // the worked example's program
    expect(p.strokes * p.repeats).toBe(62); // worked example: 62 strokes for two sheets
    expect(res.body.summary.estimateSeconds).toBe(p.check.estimate.seconds.total);
    expect(p.check.validation).not.toBe("fail");

    const written = await write(res.body.id);
    expect(written.status).toBe(201);
    const [program] = written.body.data;
    expect(program).toMatchObject({
      reference: "WE-1/A",
      status: "draft",
      sheet: { length: 120, width: 48, count: 2 },
      metadata: { plan: res.body.id, pattern: "A" },
    });
    expect(program.check.yield.total.blanks).toBe(56); // worked example
    expect(program.check.yield.total.strokes).toBe(62); // worked example
    expect(program.check.yield.utilisationPct).toBe(93.3); // worked example
  });
});

describe("mixed demand in millimetres", () => {
  const body = () => ({
    reference: `MIX-${Date.now()}`,
    shear: shop.shearId,
    grade: "A36",
    thickness: { value: 3 },
    units: "mm",
    stock: [
      { length: 2500, width: 1250, count: 3 },
      { length: 3000, width: 1500 },
    ],
    blanks: [
      { label: "base", length: 600, width: 400, quantity: 10 },
      { label: "side", length: 450, width: 300, quantity: 12 },
      { label: "tab", length: 250, width: 150, quantity: 30 },
      { label: "lid", length: 950, width: 500, quantity: 4, canTurn: false },
      { label: "strap", length: 980, width: 62.5, quantity: 9 },
    ],
    options: { trim: 5, reusableOffcut: { length: 300, width: 200 } },
  });

  it("writes programs that the shear core agrees make exactly the planned blanks, and no more", async () => {
    const res = await plan(body());
    expect(res.status).toBe(201);
    expect(res.body.coverage).toBe("complete");
    const planned = new Map<string, number>();
    res.body.blanks.forEach(
      (b: { length: number; width: number; planned: number; quantity: number; extra: number }) => {
        expect(b.planned).toBe(b.quantity); // no allowance: exactly as asked
        expect(b.extra).toBe(0);
        planned.set(sizeKey(b.length, b.width), (planned.get(sizeKey(b.length, b.width)) ?? 0) + b.planned);
      },
    );
    for (const p of res.body.patterns) {
      expect(p.cuts[0]).toMatchObject({ backgauge: 5, scrap: true }); // the 5 mm first-edge trim
      for (const c of p.cuts) expect(c.backgauge).toBeLessThanOrEqual(1000); // the test shear's backgauge travel
      expect(p.sheet.length).toBeLessThanOrEqual(3100); // its blade
    }
    const written = await write(res.body.id);
    expect(written.status).toBe(201);
    const made = new Map<string, number>();
    for (const prg of written.body.data) {
      expect(prg.validation).not.toBe("fail");
      for (const b of prg.check.yield.blanks)
        made.set(sizeKey(b.width, b.length), (made.get(sizeKey(b.width, b.length)) ?? 0) + b.count);
    }
    expect(made).toEqual(planned);
    const sheets = written.body.data.reduce((s: number, prg: { sheet: { count: number } }) => s + prg.sheet.count, 0);
    expect(sheets).toBe(res.body.summary.sheets);
    const { summary } = res.body;
    expect(summary.lowerBoundSheets).toBeLessThanOrEqual(summary.sheets);
    expect(summary.lowerBoundSheets).toBe(Math.max(summary.bounds.areaSheets, summary.bounds.lpSheets ?? 0));
    expect(summary.provenFewest).toBe(summary.sheets === summary.lowerBoundSheets);
    expect(res.body.stock[0].used).toBeLessThanOrEqual(3);
  });

  it("says what it left as reusable offcuts and counts them in the net utilisation", async () => {
    const res = await plan(body());
    const reusableArea = res.body.reusableOffcuts.reduce(
      (s: number, o: { length: number; width: number; count: number }) => s + o.length * o.width * o.count,
      0,
    );
    const stockArea = res.body.patterns.reduce(
      (s: number, p: { sheet: { length: number; width: number }; repeats: number }) =>
        s + p.sheet.length * p.sheet.width * p.repeats,
      0,
    );
    const blankArea = res.body.blanks.reduce(
      (s: number, b: { length: number; width: number; planned: number }) => s + b.length * b.width * b.planned,
      0,
    );
    expect(res.body.summary.utilisationPct).toBeCloseTo((100 * blankArea) / stockArea, 2);
    expect(res.body.summary.netUtilisationPct).toBeCloseTo((100 * blankArea) / (stockArea - reusableArea), 2);
    for (const o of res.body.reusableOffcuts) expect(Math.min(o.length, o.width)).toBeGreaterThanOrEqual(200);
  });
});

describe("findings instead of silent drops", () => {
  it("a blank no sheet can hold, and stock that runs out, make a partial plan with findings", async () => {
    const res = await plan({
      shear: shop.shearId,
      grade: "A36",
      thickness: { value: 2 },
      units: "mm",
      stock: [{ length: 2000, width: 1000, count: 1 }],
      blanks: [
        { label: "too long", length: 2600, width: 300, quantity: 2 },
        { label: "many", length: 1000, width: 500, quantity: 6 },
      ],
    });
    expect(res.status).toBe(201);
    expect(res.body.coverage).toBe("partial");
    expect(res.body.findings).toEqual([
      expect.objectContaining({ code: "blank_unplaceable", severity: "error", pointer: "/blanks/0", actual: 2 }),
      expect.objectContaining({ code: "stock_short", severity: "error", pointer: "/blanks/1", actual: 2 }), // one 2000 × 1000 sheet holds 4
    ]);
    expect(res.body.blanks.map((b: { planned: number; short: number }) => [b.planned, b.short])).toEqual([
      [0, 2],
      [4, 2],
    ]);
    expect(res.body.summary).toMatchObject({
      sheets: 1,
      short: 4,
      lowerBoundSheets: 1,
      provenFewest: true,
      bounds: { lpSheets: null },
    }); // a partial plan: bounded by the area it places
  });

  it("over-production within the allowance is a warning", async () => {
    const res = await plan({
      shear: shop.shearId,
      grade: "A36",
      thickness: { value: 2 },
      units: "mm",
      stock: [{ length: 1000, width: 1000 }],
      blanks: [{ label: "square", length: 500, width: 500, quantity: 7 }],
      options: { overProductionPct: 20 },
    });
    expect(res.body.findings).toEqual([
      expect.objectContaining({ code: "over_production", severity: "warning", actual: 1 }),
    ]); // 2 sheets of 4 for 7: floor(7 × 20 %) = 1 allowed
    expect(res.body.blanks[0]).toMatchObject({ planned: 8, extra: 1 });
  });
});

describe("inches and the shear's limits", () => {
  it("plans fractional inches on their own grid and writes programs in inches", async () => {
    const res = await plan({
      shear: shop.shearId,
      grade: "A36",
      thickness: { gauge: 12 },
      units: "in",
      stock: [{ length: 120, width: 48 }],
      blanks: [
        { label: "bracket", length: 16.5, width: 12.25, quantity: 20 },
        { label: "clip", length: 3.125, width: 2.0625, quantity: 40 },
      ],
      options: { trim: 0.25 },
    });
    expect(res.status).toBe(201);
    expect(res.body.coverage).toBe("complete");
    expect(res.body.findings).toEqual([]);
    for (const p of res.body.patterns) {
      expect(p.cuts[0]).toMatchObject({ backgauge: 0.25, scrap: true });
      expect(p.check.validation).not.toBe("fail");
    }
    const written = await write(res.body.id);
    const made = new Map<string, number>();
    for (const prg of written.body.data)
      for (const b of prg.check.yield.blanks)
        made.set(sizeKey(b.width, b.length), (made.get(sizeKey(b.width, b.length)) ?? 0) + b.count);
    expect(made).toEqual(
      new Map([
        [sizeKey(16.5, 12.25), 20],
        [sizeKey(3.125, 2.0625), 40],
      ]),
    ); // the shear core counts what was asked
  });

  it("keeps 1/32 and 1/64 in exact, so the written program makes every blank", async () => {
    const res = await plan({
      shear: shop.shearId,
      grade: "A36",
      thickness: { gauge: 16 },
      units: "in",
      stock: [{ length: 82.5, width: 12 }],
      blanks: [
        { label: "tab", length: 1.03125, width: 12, quantity: 80, canTurn: false },
        { label: "shim", length: 2.015625, width: 6, quantity: 2, canTurn: false },
      ],
    });
    expect(res.status).toBe(201);
    expect(
      res.body.patterns.flatMap((p: { cuts: { backgauge: number }[] }) => p.cuts.map((c) => c.backgauge)),
    ).toContain(1.03125);
    const written = await write(res.body.id);
    const total = (label: number) =>
      written.body.data.reduce(
        (n: number, prg: { check: { yield: { blanks: { width: number; length: number; count: number }[] } } }) =>
          n +
          prg.check.yield.blanks
            .filter((b) => Math.abs(Math.min(b.width, b.length) - [1.03125, 2.015625][label]) < 0.001)
            .reduce((m, b) => m + b.count, 0),
        0,
      );
    expect([total(0), total(1)]).toEqual([80, 2]); // the shear core counts every blank asked for (it shows sizes rounded to 4 places)
  });

  it("a trim closer than the backgauge can reach is a finding, not a silent program fault", async () => {
    const res = await plan({
      shear: shop.shearId,
      grade: "A36",
      thickness: { gauge: 12 },
      units: "in",
      stock: [{ length: 120, width: 48 }],
      blanks: [{ label: "bracket", length: 16.5, width: 12.25, quantity: 4 }],
      options: { trim: 0.125 }, // 3.175 mm; the test shear's backgauge comes no closer than 5 mm
    });
    expect(res.body.findings).toEqual(
      expect.arrayContaining([
        expect.objectContaining({
          code: "trim_out_of_travel",
          severity: "error",
          pointer: "/options/trim",
          actual: 0.125,
        }),
      ]),
    );
  });

  it("a thickness the shear cannot take still plans, and says the programs will not release", async () => {
    const res = await plan({
      shear: shop.shearId,
      grade: "A36",
      thickness: { value: 12 },
      units: "mm", // the test shear is rated 6.35 mm
      stock: [{ length: 2000, width: 1000 }],
      blanks: [{ label: "plate", length: 500, width: 500, quantity: 4 }],
    });
    expect(res.status).toBe(201);
    expect(res.body.patterns[0].check.findings.map((f: { code: string }) => f.code)).toContain(
      "thickness_over_capacity",
    );
    expect(res.body.findings).toEqual([
      expect.objectContaining({ code: "pattern_not_releasable", severity: "warning", pointer: "/patterns/0" }),
    ]);
  });
});

describe("bad input", () => {
  it("is refused with a problem pointing at the field, and stores nothing", async () => {
    const before = (await api().get("/api/v1/plans?limit=200").set(auth())).body.data.length;
    const base = {
      shear: shop.shearId,
      grade: "A36",
      thickness: { value: 2 },
      units: "mm",
      stock: [{ length: 2000, width: 1000 }],
      blanks: [{ label: "a", length: 100, width: 100, quantity: 1 }],
    };
    const offGrid = await plan({ ...base, blanks: [{ label: "a", length: 100.005, width: 100, quantity: 1 }] });
    expectDocumented(ops.createPlanOperation, offGrid);
    expect(offGrid.status).toBe(422);
    expect(offGrid.headers["content-type"]).toMatch(/application\/problem\+json/);
    expect(offGrid.body.errors[0]).toMatchObject({ pointer: "/blanks/0/length" });
    const noBlanks = await plan({ ...base, blanks: [] });
    expect(noBlanks.status).toBe(422);
    expect(noBlanks.body.errors[0].pointer).toBe("/blanks");
    const badShear = await plan({ ...base, shear: "shr_nope" });
    expect(badShear.status).toBe(422);
    expect(badShear.body.errors[0].pointer).toBe("/shear");
    const negative = await plan({ ...base, blanks: [{ label: "a", length: -1, width: 100, quantity: 1 }] });
    expect(negative.status).toBe(422);
    const after = (await api().get("/api/v1/plans?limit=200").set(auth())).body.data.length;
    expect(after).toBe(before);
  });
});

describe("writing the programs", () => {
  const twoPatterns = (reference: string) => ({
    reference,
    shear: shop.shearId,
    grade: "A36",
    thickness: { value: 2 },
    units: "mm",
    stock: [{ length: 2000, width: 1000 }],
    blanks: [
      { label: "a", length: 1000, width: 500, quantity: 5 },
      { label: "b", length: 300, width: 200, quantity: 3 },
    ],
  });

  it("is all or nothing: a reference already in use writes none of them", async () => {
    const ref = `AON-${Date.now()}`;
    const res = await plan(twoPatterns(ref));
    expect(res.body.patterns.length).toBeGreaterThan(1);
    const last = res.body.patterns[res.body.patterns.length - 1].key;
    expect(
      (
        await api()
          .post("/api/v1/programs")
          .set(auth())
          .send(exampleProgram(shop.shearId, `${ref}/${last}`))
      ).status,
    ).toBe(201);
    const refused = await write(res.body.id);
    expectDocumented(ops.writePlanProgramsOperation, refused);
    expect(refused.status).toBe(409);
    const em = (await testOrm()).em.fork();
    expect(await em.count(Program, { shop: shop.shopId, reference: `${ref}/A` })).toBe(0);
    expect((await api().get(`/api/v1/plans/${res.body.id}`).set(auth())).body.programs).toEqual([]);

    const ok = await write(res.body.id, { referencePrefix: `${ref}-2`, dueAt: "2026-12-09T07:00:00Z" });
    expect(ok.status).toBe(201);
    expect(ok.body.data.map((p: { reference: string }) => p.reference)).toEqual(
      res.body.patterns.map((p: { key: string }) => `${ref}-2/${p.key}`),
    );
    expect(ok.body.data.every((p: { dueAt: string }) => p.dueAt === "2026-12-09T07:00:00.000Z")).toBe(true);
    const events = await em.find(Event, {
      shop: shop.shopId,
      type: "program.created",
      subjectId: { $in: ok.body.data.map((p: { id: string }) => p.id) },
    });
    expect(events).toHaveLength(ok.body.data.length); // each written the way any program is, with its event
  });

  it("happens once: two requests at the same time write one set", async () => {
    const res = await plan(twoPatterns(`ONCE-${Date.now()}`));
    const [a, b] = await Promise.all([write(res.body.id), write(res.body.id)]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const em = (await testOrm()).em.fork();
    expect(await em.count(Program, { shop: shop.shopId, metadata: { plan: res.body.id } })).toBe(
      res.body.patterns.length,
    );
    const read = await api().get(`/api/v1/plans/${res.body.id}`).set(auth());
    expect(read.body.programs).toHaveLength(res.body.patterns.length);
  });
});

describe("plans are jobs", () => {
  const read = (id: string) => api().get(`/api/v1/plans/${id}`).set(auth());
  async function untilEnded(id: string, seconds = 60) {
    const deadline = Date.now() + seconds * 1000;
    for (;;) {
      const res = await read(id);
      if (!["queued", "running"].includes(res.body.status) || Date.now() > deadline) return res;
      await new Promise((r) => setTimeout(r, 200));
    }
  }

  it("answers 202 with the plan's URL at once; a worker computes it and sends plan.completed", async () => {
    const res = await api().post("/api/v1/plans").set(auth()).send(examplePlan(shop.shearId));
    expectDocumented(ops.createPlanOperation, res);
    expect(res.status).toBe(202);
    expect(res.headers.location).toBe(`/api/v1/plans/${res.body.id}`);
    expect(["queued", "running", "complete"]).toContain(res.body.status);
    expect(res.body.result === null || res.body.status === "complete").toBe(true);
    const done = await untilEnded(res.body.id);
    expectDocumented(ops.getPlanOperation, done);
    expect(done.body).toMatchObject({
      status: "complete",
      attempts: 1,
      failure: null,
      result: { coverage: "complete" },
    });
    expect(done.body.progress).toMatchObject({ patterns: done.body.result.summary.patterns });
    expect(Date.parse(done.body.finishedAt)).toBeGreaterThanOrEqual(Date.parse(done.body.startedAt));
    const events = await (await testOrm()).em.fork().find(Event, { subjectId: res.body.id });
    expect(events.map((e) => e.type)).toEqual(["plan.completed"]);
  });

  it("holds the answer for a small plan when asked (Prefer: wait), and says so", async () => {
    const res = await api().post("/api/v1/plans").set(auth()).set("Prefer", "wait=10").send(examplePlan(shop.shearId));
    expectDocumented(ops.createPlanOperation, res);
    expect(res.status).toBe(201);
    expect(res.headers["preference-applied"]).toBe("wait=10");
    expect(res.body.status).toBe("complete");
  });

  it("lists summaries, not layouts", async () => {
    const list = await api().get("/api/v1/plans?limit=5").set(auth());
    expectDocumented(ops.listPlansOperation, list);
    for (const p of list.body.data) {
      expect(p).not.toHaveProperty("result");
      expect(p).toHaveProperty("summary");
    }
  });

  it("previews a plan without storing anything", async () => {
    const em = (await testOrm()).em.fork();
    const before = await em.count("Plan", { shop: shop.shopId });
    const res = await api().post("/api/v1/plans/preview").set(auth()).send(examplePlan(shop.shearId));
    expectDocumented(ops.previewPlanOperation, res);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ coverage: "complete", shear: shop.shearId });
    expect(res.body.patterns.length).toBeGreaterThan(0);
    expect(await em.fork().count("Plan", { shop: shop.shopId })).toBe(before);
  });

  it("cancels a plan while it runs: the worker stops, plan.cancelled is sent, and it cannot be cancelled twice", async () => {
    const res = await api().post("/api/v1/plans").set(auth()).send(largestOrder(shop.shearId, 7));
    expect(res.status).toBe(202);
    const cancelled = await api().post(`/api/v1/plans/${res.body.id}/cancel`).set(auth()).send({});
    expectDocumented(ops.cancelPlanOperation, cancelled);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.status).toBe("cancelled");
    const again = await api().post(`/api/v1/plans/${res.body.id}/cancel`).set(auth()).send({});
    expect(again.status).toBe(409);
    expect(again.body.currentStatus).toBe("cancelled");
    await new Promise((r) => setTimeout(r, 1_500));
    const after = await read(res.body.id);
    expect(after.body).toMatchObject({ status: "cancelled", result: null });
    const events = await (await testOrm()).em.fork().find(Event, { subjectId: res.body.id });
    expect(events.map((e) => e.type)).toEqual(["plan.cancelled"]);
    expect((await write(res.body.id)).status).toBe(409); // no programs from a plan that never ended
  });
});

describe("the planner's limits", () => {
  const base = () => ({
    shear: shop.shearId,
    grade: "A36",
    thickness: { value: 3 },
    units: "mm",
    stock: [{ length: 2500, width: 1250 }],
    blanks: [{ label: "a", length: 100, width: 100, quantity: 1 }],
  });

  it.each([
    [
      "blankTypes",
      () => ({
        ...base(),
        blanks: Array.from({ length: 201 }, (_, i) => ({ label: `b${i}`, length: 100 + i, width: 50, quantity: 1 })),
      }),
      201,
    ],
    [
      "stockSizes",
      () => ({ ...base(), stock: Array.from({ length: 11 }, (_, i) => ({ length: 2000 + i, width: 1000 })) }),
      11,
    ],
    [
      "totalPieces",
      () => ({
        ...base(),
        blanks: [
          { label: "a", length: 100, width: 100, quantity: 15_000 },
          { label: "b", length: 50, width: 50, quantity: 5_001 },
        ],
      }),
      20_001,
    ],
    ["sheetToBlade", () => ({ ...base(), stock: [{ length: 40_000, width: 1250 }] }), 12.903],
    [
      "work",
      () => ({
        ...base(),
        stock: [{ length: 500, width: 500 }],
        blanks: Array.from({ length: 200 }, (_, i) => ({
          label: `b${i}`,
          length: 10.01 + i,
          width: 20.02 + i * 0.97,
          quantity: 1,
        })),
      }),
      null,
    ],
  ])(
    "refuses an order over %s with a 422 naming the limit and the value, storing nothing",
    async (limit, body, value) => {
      const em = (await testOrm()).em.fork();
      const before = await em.count("Plan", { shop: shop.shopId });
      const res = await api().post("/api/v1/plans").set(auth()).send(body());
      expect(res.status).toBe(422);
      expect(res.body.limit).toBe(limit);
      if (value !== null) expect(res.body.value).toBe(value);
      expect(res.body.max).toEqual(expect.any(Number));
      expect(res.body.detail).toContain(String(limit));
      const preview = await api().post("/api/v1/plans/preview").set(auth()).send(body());
      expect(preview.status).toBe(422);
      expect(preview.body.limit).toBe(limit);
      expect(await em.fork().count("Plan", { shop: shop.shopId })).toBe(before);
    },
  );

  it("refuses a sheet side of more grid steps than the planner takes, on a shear long enough to cut it", async () => {
    const long = (
      await api()
        .post("/api/v1/shears")
        .set(auth())
        .send({ ...TEST_SHEAR, name: `Long ${Date.now()}`, bladeLengthMm: 10_000 })
    ).body.id;
    const res = await api()
      .post("/api/v1/plans")
      .set(auth())
      .send({ ...base(), shear: long, stock: [{ length: 60_001, width: 1250 }] });
    expect(res.status).toBe(422);
    expect(res.body).toMatchObject({ limit: "gridSteps", value: 60_001, max: 60_000 });
  });
});
