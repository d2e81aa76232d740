/**
 * A run books its material over real HTTP: a completed run takes the sheets it used out of the
 * stock reserved for its program and books its reusable offcuts in as remnants traceable to the
 * program and the run; a failed run books what its report says and gives the rest back.
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Event, StockReservation } from "../../entities";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, testOrm, type TestShop } from "../support/fixtures";

let shop: TestShop;
const api = () => request(BASE_URL);
const auth = () => ({ Authorization: `Bearer ${shop.key}` });
// An invented rack of 10 ga A36 sheets, 120 × 48 in (3048 × 1219.2 mm, 25.4 mm to the inch exactly: NIST SP 811 B.8)
const rack = { kind: "sheet", grade: "A36", thicknessMm: 3.42, lengthMm: 3048, widthMm: 1219.2, quantity: 5 };

/** Store the worked example with its sheets reserved, release it and take it to the shear as a gateway would. */
async function running(reserve: number) {
  const item = (await api().post("/api/v1/stock").set(auth()).send(rack).expect(201)).body;
  const program = (await api().post("/api/v1/programs").set(auth()).send(exampleProgram(shop.shearId)).expect(201))
    .body;
  await api()
    .post(`/api/v1/stock/${item.id}/reservations`)
    .set(auth())
    .send({ quantity: reserve, program: program.id })
    .expect(201);
  await api().post(`/api/v1/programs/${program.id}/release`).set(auth()).send({}).expect(200);
  const claimed = await api().post(`/api/v1/shears/${shop.shearId}/claims`).set(auth()).send({}).expect(200);
  expect(claimed.body.program.id).toBe(program.id);
  await api().post(`/api/v1/programs/${program.id}/start`).set(auth()).expect(200);
  return { item, program };
}
const stockItem = async (id: string) => (await api().get(`/api/v1/stock/${id}`).set(auth())).body;

beforeAll(async () => {
  shop = await createTestShop("booking");
  await api().patch("/api/v1/settings").set(auth()).send({ remnantMinMm: 200 }).expect(200);
});
afterAll(closeTestOrm);

describe("a completed run", () => {
  it("books its sheets out and its reusable offcuts in as remnants naming the program and run", async () => {
    const { item, program } = await running(2);
    await api().post(`/api/v1/programs/${program.id}/complete`).set(auth()).send({ goodPieces: 56 }).expect(200);
    expect(await stockItem(item.id)).toMatchObject({ quantity: 3, reserved: 0, available: 3 });
    const em = (await testOrm()).em.fork();
    const [reservation] = await em.find(StockReservation, { program: program.id });
    expect(reservation).toMatchObject({ status: "consumed", quantity: 2 });

    // Each sheet is ripped into four 12 in strips, each crosscut to seven 16 in blanks: 120 − 7 × 16 = 8 in
    // left per strip, so four 8 × 12 in offcuts (203.2 × 304.8 mm) a sheet, eight from two; at least 200 mm
    // both ways, so they are kept.
    const remnants = (await api().get("/api/v1/stock?kind=remnant").set(auth())).body.data;
    expect(remnants).toEqual([
      expect.objectContaining({
        grade: "A36",
        lengthMm: 304.8,
        widthMm: 203.2,
        quantity: 8,
        sourceProgram: program.id,
        sourceRun: expect.stringContaining(program.id),
      }),
    ]);
    expect(remnants[0].thicknessMm).toBeCloseTo(0.1345 * 25.4, 2); // 10 ga manufacturers' standard gauge: 0.1345 in
    const types = (await em.find(Event, { subjectId: { $in: [item.id, remnants[0].id] } })).map((e) => e.type);
    expect(types).toEqual(expect.arrayContaining(["stock.consumed", "stock.remnant_added"]));
  });

  it("keeps no offcut below the shop's remnant size", async () => {
    await api().patch("/api/v1/settings").set(auth()).send({ remnantMinMm: 250 }).expect(200);
    const before = (await api().get("/api/v1/stock?kind=remnant").set(auth())).body.data.length;
    const { program } = await running(2);
    await api().post(`/api/v1/programs/${program.id}/complete`).set(auth()).send({ goodPieces: 56 }).expect(200);
    expect((await api().get("/api/v1/stock?kind=remnant").set(auth())).body.data.length).toBe(before);
    await api().patch("/api/v1/settings").set(auth()).send({ remnantMinMm: 200 }).expect(200);
  });
});

describe("a failed run", () => {
  it("books the sheets its report names and gives the rest back, with no remnants", async () => {
    const before = (await api().get("/api/v1/stock?kind=remnant").set(auth())).body.data.length;
    const { item, program } = await running(2);
    const res = await api()
      .post(`/api/v1/programs/${program.id}/fail`)
      .set(auth())
      .send({ reason: "overload", goodPieces: 20, sheetsUsed: 1 });
    expect(res.status).toBe(200);
    expect(await stockItem(item.id)).toMatchObject({ quantity: 4, reserved: 0 });
    expect((await api().get("/api/v1/stock?kind=remnant").set(auth())).body.data.length).toBe(before);
    const released = await (
      await testOrm()
    ).em
      .fork()
      .findOneOrFail(Event, { subjectId: item.id, type: "stock.released" });
    expect(released.data).toMatchObject({ reason: expect.stringContaining("used 1 of the 2") });
  });

  it("refuses a report of more sheets than the program has", async () => {
    const { program } = await running(2);
    const res = await api()
      .post(`/api/v1/programs/${program.id}/fail`)
      .set(auth())
      .send({ reason: "overload", sheetsUsed: 3 });
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe("/sheetsUsed");
  });
});
