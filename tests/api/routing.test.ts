/**
 * Routing over real HTTP: a program or plan that names no shear is checked against every active
 * shear of the shop and given the one the shop's rule prefers, with each other shear's reason;
 * when none can cut it, 422 and nothing stored; the dry run says which shears can cut it.
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as ops from "../../lib/api/operations/programs";
import * as settingsOps from "../../lib/api/operations/settings";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, TEST_SHEAR, type TestShop } from "../support/fixtures";
import { expectDocumented } from "../support/openapi";

let shop: TestShop;
let big: string;
let small: string;
const api = () => request(BASE_URL);
const auth = () => ({ Authorization: `Bearer ${shop.key}` });
/** The worked example with no shear named. */
const unrouted = () => {
  const { shear: _shear, ...rest } = exampleProgram("");
  return rest;
};
type Routed = { shear: string; name: string; canCut: boolean; capacityUsedPct: number | null; reason: string | null };

beforeAll(async () => {
  shop = await createTestShop("routing");
  // Invented machines for the test: a wider, heavier shear, and a light one rated for 1.5 mm.
  const add = async (name: string, extra: object) =>
    (
      await api()
        .post("/api/v1/shears")
        .set(auth())
        .send({ ...TEST_SHEAR, name, ...extra })
        .expect(201)
    ).body.id;
  big = await add("Heavy shear", { ratedThicknessMm: 13, bladeLengthMm: 4000 });
  small = await add("Light shear", { ratedThicknessMm: 1.5 });
  await add("Retired shear", {}).then((id) => api().post(`/api/v1/shears/${id}/archive`).set(auth()).expect(200));
});
afterAll(closeTestOrm);

describe("a program without a shear", () => {
  it("goes to the shear with the least capacity used, with each other shear's reason", async () => {
    const res = await api().post("/api/v1/programs").set(auth()).send(unrouted());
    expectDocumented(ops.createProgramOperation, res);
    expect(res.status).toBe(201);
    expect(res.body.shear).toBe(big);
    const { routing } = res.body;
    expect(routing.rule).toBe("least_capacity");
    expect(routing.chosen).toBe(big);
    // every active shear, the chosen one first; archived ones are not candidates
    expect(routing.shears.map((s: Routed) => s.shear)).toEqual([big, shop.shearId, small]);
    const [chosen, other, light] = routing.shears as Routed[];
    expect(chosen.reason).toBeNull();
    expect(other.canCut).toBe(true);
    expect(other.reason).toMatch(/of its capacity; Heavy shear uses/);
    expect(light.canCut).toBe(false);
    expect(light.reason).toMatch(/force|thick/i);

    // Each figure is the largest share the shear's own check reports: force against the rating,
    // thickness against the most for the grade, longest cut against the blade. The 120 in cut is
    // 3048 mm (25.4 mm to the inch exactly, NIST SP 811 appendix B): 98.3 % of a 3100 mm blade,
    // 76.2 % of a 4000 mm one.
    for (const [s, bladeMm] of [
      [chosen, 4000],
      [other, 3100],
    ] as const) {
      const check = (await api().post("/api/v1/programs/validate").set(auth()).send(exampleProgram(s.shear))).body;
      const t = check.thickness.value / check.force.maxThicknessForGrade.value; // both in inches here
      const shares = [check.force.capacityUsedPct, 100 * t, (100 * 120 * 25.4) / bladeMm];
      expect(s.capacityUsedPct).toBeCloseTo(Math.max(...shares), 1);
    }
    expect(other.capacityUsedPct).toBeGreaterThanOrEqual(98.3);
    expect(chosen.capacityUsedPct).toBeLessThan(other.capacityUsedPct!);

    const read = await api().get(`/api/v1/programs/${res.body.id}`).set(auth());
    expect(read.body.routing).toEqual(routing);
  });

  it("goes to the shortest queue of released programs when the shop says so", async () => {
    const patched = await api().patch("/api/v1/settings").set(auth()).send({ routingRule: "shortest_queue" });
    expectDocumented(settingsOps.updateSettingsOperation, patched);
    expect(patched.body).toEqual({ routingRule: "shortest_queue", remnantMinMm: null });
    const read = await api().get("/api/v1/settings").set(auth());
    expectDocumented(settingsOps.getSettingsOperation, read);
    expect(read.body).toEqual({ routingRule: "shortest_queue", remnantMinMm: null });
    try {
      // one released program waits for the heavy shear
      const waiting = await api().post("/api/v1/programs").set(auth()).send(exampleProgram(big)).expect(201);
      const codes = [...new Set(waiting.body.check.findings.map((f: { code: string }) => f.code))];
      await api()
        .post(`/api/v1/programs/${waiting.body.id}/release`)
        .set(auth())
        .send({ acknowledge: codes })
        .expect(200);

      const res = await api().post("/api/v1/programs").set(auth()).send(unrouted()).expect(201);
      expect(res.body.routing.rule).toBe("shortest_queue");
      expect(res.body.shear).toBe(shop.shearId);
      const heavy = (res.body.routing.shears as (Routed & { releasedPrograms: number })[]).find(
        (s) => s.shear === big,
      )!;
      expect(heavy.releasedPrograms).toBe(1);
      expect(heavy.reason).toBe("1 released programs are waiting for it; Test shear has 0.");
    } finally {
      await api().patch("/api/v1/settings").set(auth()).send({ routingRule: "least_capacity" }).expect(200);
    }
  });

  it("is refused with every shear's reason when none can cut it, and nothing is stored", async () => {
    const body = { ...unrouted(), thickness: { value: 1 } }; // 1 in plate: beyond all three ratings
    const res = await api().post("/api/v1/programs").set(auth()).send(body);
    expectDocumented(ops.createProgramOperation, res);
    expect(res.status).toBe(422);
    expect(res.body.type).toBe("/problems/no-shear-can-cut");
    expect(res.body.shears).toHaveLength(3);
    for (const s of res.body.shears) expect(s.reason).toMatch(/\S/);
    const list = await api()
      .get(`/api/v1/programs?reference=${encodeURIComponent(body.reference)}`)
      .set(auth());
    expect(list.body.data).toEqual([]);
  });

  it("refuses bad settings", async () => {
    const res = await api().patch("/api/v1/settings").set(auth()).send({ routingRule: "fastest" });
    expect(res.status).toBe(422);
    expect((await api().patch("/api/v1/settings").set(auth()).send({})).status).toBe(422);
  });
});

describe("the dry run without a shear", () => {
  it("says which shears can cut it and which would be chosen", async () => {
    const res = await api().post("/api/v1/programs/validate").set(auth()).send(unrouted());
    expectDocumented(ops.validateProgramOperation, res);
    expect(res.status).toBe(200);
    expect(res.body.routing.chosen).toBe(big);
    const can = (res.body.routing.shears as Routed[]).filter((s) => s.canCut).map((s) => s.shear);
    expect(can.sort()).toEqual([big, shop.shearId].sort());
  });

  it("answers with no choice when none can cut it", async () => {
    const res = await api()
      .post("/api/v1/programs/validate")
      .set(auth())
      .send({ ...unrouted(), thickness: { value: 1 } });
    expect(res.status).toBe(200);
    expect(res.body.validation).toBe("fail");
    expect(res.body.routing.chosen).toBeNull();
    expect((res.body.routing.shears as Routed[]).every((s) => !s.canCut && s.reason)).toBe(true);
  });

  it("names no routing when the program names its shear", async () => {
    const res = await api().post("/api/v1/programs/validate").set(auth()).send(exampleProgram(small));
    expect(res.body.routing).toBeNull();
  });
});

describe("a plan without a shear", () => {
  it("is routed the same way and planned on the shear chosen", async () => {
    const res = await api()
      .post("/api/v1/plans")
      .set(auth())
      .set("Prefer", "wait=10")
      .send({
        reference: `RT-${Date.now()}`,
        grade: "A36",
        thickness: { gauge: 10 },
        units: "in",
        stock: [{ length: 120, width: 48, count: 2 }],
        blanks: [{ label: "panel", length: 16, width: 12, quantity: 20 }],
      });
    expect([201, 202]).toContain(res.status);
    expect(res.body.shear).toBe(big);
    expect(res.body.routing.chosen).toBe(big);
    expect(res.body.routing.shears.find((s: Routed) => s.shear === small).canCut).toBe(false);
  });
});
