/**
 * Plans from stock over real HTTP: `"stock": "on_hand"` draws the shop's items of the plan's grade
 * and thickness, remnants first; blanks a remnant can carry go onto remnants before a full sheet;
 * writing the programs reserves the sheets each pattern uses, all or nothing; a cancelled program
 * gives them back. Fits are counted by hand (whole pieces per side: floor division).
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, type TestShop } from "../support/fixtures";

let shop: TestShop;
const api = () => request(BASE_URL);
const auth = () => ({ Authorization: `Bearer ${shop.key}` });
const addStock = async (body: object) => (await api().post("/api/v1/stock").set(auth()).send(body).expect(201)).body;
const stockItem = async (id: string) => (await api().get(`/api/v1/stock/${id}`).set(auth())).body;
// An invented order: 450 × 280 mm brackets of 3 mm A36; floor(1000/450) × floor(600/280) = 4 on a 1000 × 600 remnant.
const order = (quantity: number) => ({
  reference: `ST-${Date.now()}-${Math.random().toString(36).slice(2, 6)}`,
  shear: shop.shearId,
  grade: "A36",
  thickness: { value: 3 },
  units: "mm",
  stock: "on_hand",
  blanks: [{ label: "bracket", length: 450, width: 280, quantity }],
});
const plan = async (body: object) => {
  const res = await api().post("/api/v1/plans").set(auth()).set("Prefer", "wait=10").send(body);
  expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(201);
  expect(res.body.status).toBe("complete");
  return res.body;
};

let sheet: { id: string };
let remnant: { id: string };

beforeAll(async () => {
  shop = await createTestShop("plan-stock");
  sheet = await addStock({ kind: "sheet", grade: "A36", thicknessMm: 3, lengthMm: 2500, widthMm: 1250, quantity: 5 });
  remnant = await addStock({
    kind: "remnant",
    grade: "A36",
    thicknessMm: 3,
    lengthMm: 1000,
    widthMm: 600,
    quantity: 1,
    location: "R1",
  });
  // other grades and thicknesses are not drawn
  await addStock({ kind: "remnant", grade: "304", thicknessMm: 3, lengthMm: 1000, widthMm: 600, quantity: 9 });
  await addStock({ kind: "remnant", grade: "A36", thicknessMm: 6, lengthMm: 1000, widthMm: 600, quantity: 9 });
});
afterAll(closeTestOrm);

describe("a plan from stock on hand", () => {
  it("draws the grade and thickness, remnants first, and cuts the remnant before a full sheet", async () => {
    const p = await plan(order(4));
    expect(p.result.stock).toEqual([
      expect.objectContaining({ item: remnant.id, remnant: true, length: 1000, width: 600, count: 1, used: 1 }),
      expect.objectContaining({ item: sheet.id, remnant: false, length: 2500, width: 1250, count: 5, used: 0 }),
    ]);
    expect(p.result.coverage).toBe("complete");
    expect(p.result.patterns.every((pattern: { stock: number }) => pattern.stock === 0)).toBe(true);

    // writing the programs reserves the remnant for the program that cuts it
    const written = await api().post(`/api/v1/plans/${p.id}/programs`).set(auth()).send({}).expect(201);
    expect(written.body.data).toHaveLength(1);
    expect(await stockItem(remnant.id)).toMatchObject({ quantity: 1, reserved: 1, available: 0 });

    // …and cancelling that program gives it back
    await api().post(`/api/v1/programs/${written.body.data[0].id}/cancel`).set(auth()).send({}).expect(200);
    expect(await stockItem(remnant.id)).toMatchObject({ reserved: 0, available: 1 });
  });

  it("puts what the remnant cannot take on full sheets, and reserves both", async () => {
    const p = await plan(order(10)); // 4 on the remnant, 6 on a full sheet
    const used = p.result.stock.map((s: { item: string; used: number }) => [s.item, s.used]);
    expect(used).toEqual([
      [remnant.id, 1],
      [sheet.id, 1],
    ]);
    const written = await api().post(`/api/v1/plans/${p.id}/programs`).set(auth()).send({}).expect(201);
    expect(written.body.data).toHaveLength(2);
    expect(await stockItem(remnant.id)).toMatchObject({ reserved: 1 });
    expect(await stockItem(sheet.id)).toMatchObject({ reserved: 1, available: 4 });
    for (const program of written.body.data)
      await api().post(`/api/v1/programs/${program.id}/cancel`).set(auth()).send({}).expect(200);
    expect(await stockItem(sheet.id)).toMatchObject({ reserved: 0 });
  });

  it("writes nothing when the sheets were taken meanwhile", async () => {
    const p = await plan(order(4));
    const held = await api().post(`/api/v1/stock/${remnant.id}/reservations`).set(auth()).send({ quantity: 1 });
    expect(held.status).toBe(201);
    const res = await api().post(`/api/v1/plans/${p.id}/programs`).set(auth()).send({});
    expect(res.status).toBe(409);
    expect(res.body.type).toBe("/problems/stock-not-available");
    const listed = await api().get(`/api/v1/programs?search=${p.reference}`).set(auth());
    expect(listed.body.data).toEqual([]);
    expect((await api().get(`/api/v1/plans/${p.id}`).set(auth())).body.programs).toEqual([]);
    await api().post(`/api/v1/stock-reservations/${held.body.id}/release`).set(auth()).expect(200);
  });

  it("is refused when no stock of the grade and thickness is available, storing nothing", async () => {
    const before = (await api().get("/api/v1/plans?limit=200").set(auth())).body.data.length;
    const res = await api()
      .post("/api/v1/plans")
      .set(auth())
      .send({ ...order(4), thickness: { value: 10 } });
    expect(res.status).toBe(422);
    expect(res.body.errors[0]).toMatchObject({ pointer: "/stock" });
    expect((await api().get("/api/v1/plans?limit=200").set(auth())).body.data.length).toBe(before);
  });
  it("keeps the full sheets in the plan when there are more small remnants than the planner takes sizes", async () => {
    const own = await createTestShop("plan-stock-crowd");
    const ownAuth = { Authorization: `Bearer ${own.key}` };
    const add = async (body: object) =>
      (await api().post("/api/v1/stock").set(ownAuth).send(body).expect(201)).body as { id: string };
    // 12 offcut strips, each its own rack item and each too small for a 450 × 280 bracket, and one full sheet
    for (let i = 0; i < 12; i++)
      await add({ kind: "remnant", grade: "A36", thicknessMm: 3, lengthMm: 300 + i, widthMm: 150, quantity: 1 });
    const full = await add({ kind: "sheet", grade: "A36", thicknessMm: 3, lengthMm: 2500, widthMm: 1250, quantity: 2 });
    const res = await api()
      .post("/api/v1/plans")
      .set(ownAuth)
      .set("Prefer", "wait=10")
      .send({ ...order(4), shear: own.shearId });
    expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(201);
    expect(res.body.result.coverage).toBe("complete");
    const rows = res.body.result.stock as { item: string; remnant: boolean; used: number }[];
    expect(rows.length).toBeLessThanOrEqual(10); // the planner's limit on stock sizes
    expect(rows.find((r) => r.item === full.id)).toMatchObject({ remnant: false, used: 1 });
  });
});
