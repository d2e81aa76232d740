/**
 * Stock over real HTTP: add, filter, read, adjust with a reason (never below what is reserved),
 * archive; reservations made in parallel never take the same sheet twice; a cancelled program
 * gives its sheets back; bad input is refused with nothing stored.
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Event, StockReservation } from "../../entities";
import * as ops from "../../lib/api/operations/stock";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, testOrm, type TestShop } from "../support/fixtures";
import { expectDocumented } from "../support/openapi";

let shop: TestShop;
const api = () => request(BASE_URL);
const auth = () => ({ Authorization: `Bearer ${shop.key}` });
// Invented racks for the test: 3 mm A36 sheets and remnants, 6 mm 304 sheets.
const sheet = {
  kind: "sheet",
  grade: "A36",
  thicknessMm: 3,
  lengthMm: 2500,
  widthMm: 1250,
  quantity: 10,
  location: "B2",
};
const add = async (body: object) => (await api().post("/api/v1/stock").set(auth()).send(body).expect(201)).body;
const eventsOf = async (subjectId: string) =>
  (await (await testOrm()).em.fork().find(Event, { subjectId }, { orderBy: { id: "asc" } })).map((e) => e.type);

beforeAll(async () => {
  shop = await createTestShop("stock");
});
afterAll(closeTestOrm);

describe("stock items", () => {
  it("are added, read and listed with filters by grade, thickness and kind", async () => {
    const a = await add(sheet);
    const b = await add({ ...sheet, kind: "remnant", lengthMm: 1200, widthMm: 600, quantity: 1, sourceRun: "run 7" });
    const c = await add({ ...sheet, grade: "304", thicknessMm: 6 });
    expect(a).toMatchObject({ kind: "sheet", quantity: 10, reserved: 0, available: 10, location: "B2" });
    expect(b).toMatchObject({ kind: "remnant", sourceRun: "run 7", sourceProgram: null });
    const read = await api().get(`/api/v1/stock/${a.id}`).set(auth());
    expectDocumented(ops.getStockItemOperation, read);
    expect(read.body).toEqual(a);

    const ids = async (query: string) => {
      const res = await api().get(`/api/v1/stock?${query}`).set(auth());
      expectDocumented(ops.listStockOperation, res);
      expect(res.status).toBe(200);
      return res.body.data.map((s: { id: string }) => s.id);
    };
    expect(await ids("")).toEqual([c.id, b.id, a.id]); // newest first
    expect(await ids("grade=a36")).toEqual([b.id, a.id]);
    expect(await ids("thicknessMm=6")).toEqual([c.id]);
    expect(await ids("grade=A36&kind=remnant")).toEqual([b.id]);
    const first = await api().get("/api/v1/stock?limit=2").set(auth());
    expect(first.body.next_cursor).toEqual(expect.any(String));
    expect(await ids(`limit=2&cursor=${first.body.next_cursor}`)).toEqual([a.id]);
    expect(await eventsOf(a.id)).toEqual(["stock.created"]);
  });

  it("refuses bad input and stores nothing", async () => {
    const before = (await api().get("/api/v1/stock?limit=200").set(auth())).body.data.length;
    for (const bad of [
      { ...sheet, quantity: -1 },
      { ...sheet, thicknessMm: 0 },
      { ...sheet, kind: "offcut" },
      { ...sheet, sourceProgram: "prg_x" }, // a full sheet has no source
      { ...sheet, colour: "red" },
    ]) {
      const res = await api().post("/api/v1/stock").set(auth()).send(bad);
      expect(res.status, JSON.stringify(bad)).toBe(422);
    }
    expect((await api().get("/api/v1/stock?limit=200").set(auth())).body.data.length).toBe(before);
    expect((await api().get("/api/v1/stock?kind=offcut").set(auth())).status).toBe(422);
  });

  it("are adjusted with a reason, never below what is reserved", async () => {
    const item = await add({ ...sheet, quantity: 5 });
    const down = await api().post(`/api/v1/stock/${item.id}/adjust`).set(auth()).send({ delta: -2, reason: "dented" });
    expectDocumented(ops.adjustStockOperation, down);
    expect(down.body).toMatchObject({ quantity: 3, available: 3 });
    await api().post(`/api/v1/stock/${item.id}/reservations`).set(auth()).send({ quantity: 2 }).expect(201);
    const tooFar = await api().post(`/api/v1/stock/${item.id}/adjust`).set(auth()).send({ delta: -2, reason: "count" });
    expectDocumented(ops.adjustStockOperation, tooFar);
    expect(tooFar.status).toBe(409);
    expect(tooFar.body).toMatchObject({ quantity: 3, reserved: 2 });
    expect(
      (await api().post(`/api/v1/stock/${item.id}/adjust`).set(auth()).send({ delta: 0, reason: "x" })).status,
    ).toBe(422);
    expect((await api().post(`/api/v1/stock/${item.id}/adjust`).set(auth()).send({ delta: 1 })).status).toBe(422);
    const event = await (
      await testOrm()
    ).em
      .fork()
      .findOneOrFail(Event, { subjectId: item.id, type: "stock.adjusted" });
    expect(event.data).toMatchObject({ delta: -2, reason: "dented", item: { quantity: 3 } });
  });

  it("are archived only when nothing is reserved, and then leave the list", async () => {
    const item = await add({ ...sheet, quantity: 2 });
    const r = await api().post(`/api/v1/stock/${item.id}/reservations`).set(auth()).send({ quantity: 1 }).expect(201);
    const refused = await api().post(`/api/v1/stock/${item.id}/archive`).set(auth());
    expect(refused.status).toBe(409);
    const released = await api().post(`/api/v1/stock-reservations/${r.body.id}/release`).set(auth());
    expect(released.body).toMatchObject({ status: "released", quantity: 1 });
    expect((await api().post(`/api/v1/stock-reservations/${r.body.id}/release`).set(auth())).status).toBe(409);
    const archived = await api().post(`/api/v1/stock/${item.id}/archive`).set(auth());
    expectDocumented(ops.archiveStockItemOperation, archived);
    expect(archived.status).toBe(200);
    const listed = (await api().get("/api/v1/stock?limit=200").set(auth())).body.data.map((s: { id: string }) => s.id);
    expect(listed).not.toContain(item.id);
    const all = (await api().get("/api/v1/stock?limit=200&includeArchived=true").set(auth())).body.data;
    expect(all.map((s: { id: string }) => s.id)).toContain(item.id);
    expect((await api().post(`/api/v1/stock/${item.id}/reservations`).set(auth()).send({ quantity: 1 })).status).toBe(
      409,
    );
    expect(await eventsOf(item.id)).toEqual(["stock.created", "stock.reserved", "stock.released", "stock.archived"]);
  });
});

describe("reservations", () => {
  it("made in parallel never take the same sheet twice", async () => {
    const item = await add({ ...sheet, quantity: 7 });
    const asks = [1, 2, 1, 3, 2, 1, 2, 1, 3, 1, 2, 1]; // 20 sheets asked for 7 on hand
    const answers = await Promise.all(
      asks.map((quantity) =>
        api().post(`/api/v1/stock/${item.id}/reservations`).set(auth()).send({ quantity, note: "race" }),
      ),
    );
    for (const res of answers) expectDocumented(ops.reserveStockOperation, res);
    const granted = answers.filter((r) => r.status === 201);
    const refused = answers.filter((r) => r.status === 409);
    expect(granted.length + refused.length).toBe(asks.length);
    for (const r of refused) expect(r.body.type).toBe("/problems/stock-not-available");
    const taken = granted.reduce((sum, r) => sum + r.body.quantity, 0);
    expect(taken).toBeLessThanOrEqual(7);
    // every refusal came when too few were left for it
    for (const r of refused) expect(r.body.asked).toBeGreaterThan(r.body.available);
    const now = (await api().get(`/api/v1/stock/${item.id}`).set(auth())).body;
    expect(now).toMatchObject({ quantity: 7, reserved: taken, available: 7 - taken });
    const rows = await (await testOrm()).em.fork().find(StockReservation, { item: item.id, status: "open" });
    expect(rows.reduce((sum, r) => sum + r.quantity, 0)).toBe(taken);
    expect(rows).toHaveLength(granted.length);
  });

  it("held for a program go back to stock when the program is cancelled", async () => {
    const item = await add({ ...sheet, quantity: 4 });
    const program = (await api().post("/api/v1/programs").set(auth()).send(exampleProgram(shop.shearId)).expect(201))
      .body;
    const r = await api()
      .post(`/api/v1/stock/${item.id}/reservations`)
      .set(auth())
      .send({ quantity: 3, program: program.id })
      .expect(201);
    expect(r.body).toMatchObject({ status: "open", program: program.id, quantity: 3 });
    expect((await api().get(`/api/v1/stock/${item.id}`).set(auth())).body.available).toBe(1);

    await api().post(`/api/v1/programs/${program.id}/cancel`).set(auth()).send({ reason: "withdrawn" }).expect(200);
    expect((await api().get(`/api/v1/stock/${item.id}`).set(auth())).body).toMatchObject({ reserved: 0, available: 4 });
    const row = await (await testOrm()).em.fork().findOneOrFail(StockReservation, { id: r.body.id });
    expect(row.status).toBe("released");
    expect(row.closedAt).toBeInstanceOf(Date);
    const released = await (
      await testOrm()
    ).em
      .fork()
      .findOneOrFail(Event, { subjectId: item.id, type: "stock.released" });
    expect(released.data).toMatchObject({ reason: `program ${program.id} was cancelled` });

    // a cancelled program takes no more sheets
    const again = await api()
      .post(`/api/v1/stock/${item.id}/reservations`)
      .set(auth())
      .send({ quantity: 1, program: program.id });
    expect(again.status).toBe(422);
  });
});
