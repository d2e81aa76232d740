/**
 * Batch create over real HTTP: all or nothing by default (one problem pointing into the failing
 * programs, nothing written), program by program with `atomic: false`, one transaction, one
 * event per program, one Idempotency-Key for the whole batch, and the limit of 100.
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Event, Program } from "../../entities";
import * as ops from "../../lib/api/operations/programs";
import { WHOLE_BODY_SQL } from "../../lib/services/event-bodies";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, testOrm, type TestShop } from "../support/fixtures";
import { expectDocumented } from "../support/openapi";

let shop: TestShop;
const batch = (body: object, headers: Record<string, string> = {}) =>
  request(BASE_URL)
    .post("/api/v1/programs/batch")
    .set({ Authorization: `Bearer ${shop.key}`, ...headers })
    .send(body);
const stored = async (prefix: string) =>
  (await testOrm()).em.fork().count(Program, { shop: shop.shopId, reference: { $like: `${prefix}%` } });

beforeAll(async () => {
  shop = await createTestShop("batch");
});
afterAll(closeTestOrm);

describe("all or nothing (the default)", () => {
  it("creates every program in order, each checked, each with its program.created event", async () => {
    const programs = Array.from({ length: 5 }, (_, i) => exampleProgram(shop.shearId, `BA-${i}`));
    const res = await batch({ programs });
    expectDocumented(ops.createProgramBatchOperation, res);
    expect(res.status).toBe(201);
    expect(res.body.data.map((p: { reference: string }) => p.reference)).toEqual(programs.map((p) => p.reference));
    // by hand: each 120 × 48 in sheet ripped at 12 in (3 strokes, 4 strips), each strip crosscut at 16 in
    // (7 strokes, 7 blanks): 28 blanks from 31 strokes a sheet, 56 from 62 for the two sheets
    for (const p of res.body.data) {
      expect(p).toMatchObject({ status: "draft", revision: 1, shear: shop.shearId });
      expect(p.check.yield.total).toMatchObject({ blanks: 56, strokes: 62 });
    }
    const ids = res.body.data.map((p: { id: string }) => p.id);
    const events = await (
      await testOrm()
    ).em
      .fork()
      .find(Event, { subjectId: { $in: ids }, type: "program.created" }, { orderBy: { id: "asc" } });
    expect(events.map((e) => e.subjectId).sort()).toEqual([...ids].sort());
    expect(events.every((e) => (e.data as { program: { id: string } }).program.id === e.subjectId)).toBe(true);
  });

  it("stores each program's check and event body as the very text of its answer, each with its own program", async () => {
    // different cuts give different checks, so a program paired with another's check would show; the titles and
    // metadata hold what the statement splits its parameters at (as JSON escapes), quotes, and text beyond ASCII
    const programs = Array.from({ length: 4 }, (_, i) => ({
      ...exampleProgram(shop.shearId, `BT-${i}`),
      title: `Blank \u001e${i}\u001f "quoted" \\ ü 東 😀`,
      metadata: { line: `\u001f${i}\u001e`, "key \u001e": "é" },
      cuts: [{ backgauge: 10 + i, count: 1 + i }],
    }));
    const res = await batch({ programs });
    expect(res.status).toBe(201);
    const db = (await testOrm()).em.fork().getConnection();
    for (const [i, program] of res.body.data.entries()) {
      expect(program.title).toBe(programs[i].title);
      expect(program.metadata).toEqual(programs[i].metadata);
      const [row] = await db.execute<{ check: string; data: string; whole: string }[]>(
        `select p."check"::text as "check", e.data::text as data, ${WHOLE_BODY_SQL} as whole
         from programs p join events e on e.subject_id = p.id and e.type = 'program.created' where p.id = ?`,
        [program.id],
      );
      expect(row.check).toBe(JSON.stringify(program.check));
      // the check is stored once: the event's body borrows it (lib/services/event-bodies.ts)
      expect(row.data).toBe(JSON.stringify({ program: { ...program, check: null } }));
      expect(row.whole).toBe(JSON.stringify({ program }));
      // the answer holds the same text, byte for byte
      expect(res.text).toContain(row.whole.slice('{"program":'.length, -1));
    }
    // and as the API reads them back
    const one = await request(BASE_URL)
      .get(`/api/v1/programs/${res.body.data[3].id}`)
      .set({ Authorization: `Bearer ${shop.key}` });
    expect(one.body.check).toEqual(res.body.data[3].check);
  });

  it("refuses the whole batch with one problem naming each failing program, and writes nothing", async () => {
    const bad = exampleProgram(shop.shearId, "BB-1") as Record<string, unknown>;
    (bad.cuts as { count: number }[])[0].count = -1;
    const res = await batch({
      programs: [
        exampleProgram(shop.shearId, "BB-0"),
        bad,
        exampleProgram("No such shear", "BB-2"),
        exampleProgram(shop.shearId, "BB-3"),
      ],
    });
    expectDocumented(ops.createProgramBatchOperation, res);
    expect(res.status).toBe(422);
    expect(res.headers["content-type"]).toMatch(/application\/problem\+json/);
    expect(res.body.errors).toEqual([
      expect.objectContaining({ location: "body", pointer: "/programs/1/cuts/0/count" }),
      expect.objectContaining({ location: "body", pointer: "/programs/2/shear" }),
    ]);
    expect(res.body.failures.map((f: { index: number; status: number }) => [f.index, f.status])).toEqual([
      [1, 422],
      [2, 422],
    ]);
    expect(await stored("BB-")).toBe(0);
  });

  it("refuses a reference that exists (409 with its id) or appears twice in the batch", async () => {
    const first = await batch({ programs: [exampleProgram(shop.shearId, "BC-0")] });
    expect(first.status).toBe(201);
    const res = await batch({
      programs: [
        exampleProgram(shop.shearId, "BC-1"),
        exampleProgram(shop.shearId, "BC-0"),
        exampleProgram(shop.shearId, "BC-1"),
      ],
    });
    expectDocumented(ops.createProgramBatchOperation, res);
    expect(res.status).toBe(409);
    expect(res.body.failures).toEqual([
      expect.objectContaining({ index: 1, status: 409, existingId: first.body.data[0].id }),
      expect.objectContaining({ index: 2, status: 409, existingId: null }),
    ]);
    expect(await stored("BC-")).toBe(1);
  });

  it("names a taken reference when it is the batch's only refusal (the write meets the unique index)", async () => {
    const first = await batch({ programs: [exampleProgram(shop.shearId, "BK-0")] });
    expect(first.status).toBe(201);
    const res = await batch({
      programs: [exampleProgram(shop.shearId, "BK-1"), exampleProgram(shop.shearId, "BK-0")],
    });
    expectDocumented(ops.createProgramBatchOperation, res);
    expect(res.status).toBe(409);
    expect(res.body.failures).toEqual([
      expect.objectContaining({ index: 1, status: 409, existingId: first.body.data[0].id }),
    ]);
    expect(res.body.detail).toMatch(/^1 of the 2 programs cannot be created, so none was: Program 1: /);
    expect(await stored("BK-")).toBe(1);
  });

  it("takes at most 100 programs and at least one", async () => {
    const many = Array.from({ length: 101 }, (_, i) => exampleProgram(shop.shearId, `BD-${i}`));
    const res = await batch({ programs: many });
    expectDocumented(ops.createProgramBatchOperation, res);
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe("/programs");
    expect((await batch({ programs: [] })).status).toBe(422);
    expect(await stored("BD-")).toBe(0);
  });

  it("creates a batch of 100 in one request", async () => {
    const programs = Array.from({ length: 100 }, (_, i) => exampleProgram(shop.shearId, `BH-${i}`));
    const res = await batch({ programs });
    expect(res.status).toBe(201);
    expect(res.body.data).toHaveLength(100);
    expect(await stored("BH-")).toBe(100);
    // a large answer, handed over as a stream of its one buffer (lib/api/route.ts), arrives whole
    expect(Buffer.byteLength(res.text)).toBeGreaterThan(100 * 1024);
    expect(new Set(res.body.data.map((p: { id: string }) => p.id)).size).toBe(100);
  });
});

describe("program by program (atomic: false)", () => {
  it("creates what it can and answers 207 with each result or problem in order", async () => {
    await batch({ programs: [exampleProgram(shop.shearId, "BE-taken")] }).expect(201);
    const bad = exampleProgram(shop.shearId, "BE-2") as Record<string, unknown>;
    bad.units = "furlongs";
    const res = await batch({
      atomic: false,
      programs: [
        exampleProgram(shop.shearId, "BE-0"),
        exampleProgram(shop.shearId, "BE-taken"),
        bad,
        exampleProgram("test SHEAR", "BE-3"),
      ],
    });
    expectDocumented(ops.createProgramBatchOperation, res);
    expect(res.status).toBe(207);
    const data = res.body.data as { index: number; status: number; program?: { reference: string; shear: string } }[];
    expect(data.map((d) => [d.index, d.status])).toEqual([
      [0, 201],
      [1, 409],
      [2, 422],
      [3, 201],
    ]);
    expect(data[0].program!.reference).toBe("BE-0");
    expect(data[3].program!.shear).toBe(shop.shearId); // named by name, stored by id
    expect(res.body.data[2].problem.errors[0].pointer).toBe("/programs/2/units");
    expect(res.body.data[1].problem.existingId).toEqual(expect.stringMatching(/^prg_/));
    expect(await stored("BE-")).toBe(3);
  });

  it("refuses a taken reference and writes the rest when nothing else is refused", async () => {
    const first = await batch({ programs: [exampleProgram(shop.shearId, "BL-taken")] });
    expect(first.status).toBe(201);
    const res = await batch({
      atomic: false,
      programs: [
        exampleProgram(shop.shearId, "BL-0"),
        exampleProgram(shop.shearId, "BL-taken"),
        exampleProgram(shop.shearId, "BL-2"),
      ],
    });
    expectDocumented(ops.createProgramBatchOperation, res);
    expect(res.status).toBe(207);
    const data = res.body.data as { index: number; status: number; problem?: { existingId: string } }[];
    expect(data.map((d) => [d.index, d.status])).toEqual([
      [0, 201],
      [1, 409],
      [2, 201],
    ]);
    expect(data[1].problem!.existingId).toBe(first.body.data[0].id);
    expect(await stored("BL-")).toBe(3);
  });

  it("shares each reference out exactly once between concurrent batches", async () => {
    const programs = Array.from({ length: 20 }, (_, i) => exampleProgram(shop.shearId, `BF-${i}`));
    const answers = await Promise.all(Array.from({ length: 4 }, () => batch({ atomic: false, programs })));
    const created = answers.flatMap((a) => {
      expect(a.status).toBe(207);
      return (a.body.data as { status: number; program?: { reference: string } }[])
        .filter((d) => d.status === 201)
        .map((d) => d.program!.reference);
    });
    expect(created.sort()).toEqual(programs.map((p) => p.reference).sort());
    expect(await stored("BF-")).toBe(20);
  });
});

describe("one Idempotency-Key for the batch", () => {
  it("replays the batch for a retry, refuses another body, and creates once under concurrent retries", async () => {
    const programs = Array.from({ length: 3 }, (_, i) => exampleProgram(shop.shearId, `BG-${i}`));
    const key = `batch-${Date.now()}`;
    const answers = await Promise.all(Array.from({ length: 6 }, () => batch({ programs }, { "Idempotency-Key": key })));
    const statuses = answers.map((a) => a.status);
    expect(statuses.filter((s) => s === 201).length).toBeGreaterThanOrEqual(1);
    expect(statuses.every((s) => s === 201 || s === 409)).toBe(true);
    expect(await stored("BG-")).toBe(3);
    const first = answers.find((a) => a.status === 201)!;
    const replay = await batch({ programs }, { "Idempotency-Key": key });
    expect(replay.status).toBe(201);
    expect(replay.headers["idempotent-replayed"]).toBe("true");
    expect(replay.body).toEqual(first.body);
    const other = await batch({ programs: programs.slice(0, 1) }, { "Idempotency-Key": key });
    expect(other.status).toBe(422);
    expect(await stored("BG-")).toBe(3);
  });
});
