import pg from "pg";
import { afterAll, describe, expect, it, vi } from "vitest";
import { Event, Program, Shop, WebhookEndpoint } from "../../entities";
import { createProgram } from "../../lib/services/programs";
import { viewProgram } from "../../lib/services/program-view";
import { eventPayloads, OUTBOX_CHANNEL, recordEvent, type EventType } from "../../lib/services/events";
import { createBatch } from "../../lib/services/program-batch";
import { DATABASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, testOrm } from "../support/fixtures";

afterAll(closeTestOrm);

/** An enabled endpoint of the shop taking `eventTypes` (all when empty); `enabled: false` for a disabled one. */
async function subscribe(shopId: string, eventTypes: EventType[], enabled = true) {
  const em = (await testOrm()).em.fork();
  em.create(WebhookEndpoint, {
    shop: em.getReference(Shop, shopId),
    url: "https://erp.example/hooks",
    secret: "whsec_dGVzdA==",
    eventTypes,
    enabled,
  });
  await em.flush();
}

/** One row of counts about these programs: `sql` ends with `in` followed by the list of their ids. */
async function countsAbout<Row>(sql: string, programIds: string[]): Promise<Row> {
  const connection = (await testOrm()).em.fork().getConnection();
  const [row] = await connection.execute<Row[]>(`${sql} (${programIds.map(() => "?").join(", ")})`, programIds);
  return row;
}

/** How many deliveries the events about these programs have. */
async function deliveries(programIds: string[]) {
  const { n } = await countsAbout<{ n: string }>(
    "select count(*) as n from deliveries d join events e on e.id = d.event_id where e.subject_id in",
    programIds,
  );
  return Number(n);
}

/**
 * The created programs' events: how many, and how many were written as already fanned out (their `dispatched_at` is
 * the moment they were written; the worker's fan-out, which may come at any time, would mark them later than that).
 */
async function createdEvents(programIds: string[]) {
  const { n, written } = await countsAbout<{ n: string; written: string }>(
    `select count(*) as n, count(*) filter (where dispatched_at = created_at) as written from events
     where type = 'program.created' and subject_id in`,
    programIds,
  );
  return { events: Number(n), writtenFannedOut: Number(written) };
}

describe("the outbox", () => {
  it("writes the event in the same transaction as the change: a rolled-back change leaves no event", async () => {
    const shop = await createTestShop("outbox");
    const em = (await testOrm()).em.fork();
    const { id } = await createProgram(em, shop.shopId, exampleProgram(shop.shearId));
    await expect(
      em.fork().transactional(async (tx) => {
        const p = await tx.findOneOrFail(Program, { id });
        p.title = "changed, then rolled back";
        await tx.flush();
        await recordEvent(tx, shop.shopId, "program.updated", id, { program: viewProgram(p), changed: ["title"] });
        throw new Error("something failed after the change");
      }),
    ).rejects.toThrow("something failed");
    const fresh = (await testOrm()).em.fork();
    expect((await fresh.findOneOrFail(Program, { id })).title).toBe("Side panels, lot 4");
    expect((await fresh.find(Event, { subjectId: id })).map((e) => e.type)).toEqual(["program.created"]);
  });

  it("wakes the worker on the database that holds the change, once the change is committed", async () => {
    const shop = await createTestShop("wake");
    await subscribe(shop.shopId, ["program.created"]);
    const listener = new pg.Client({ connectionString: DATABASE_URL });
    await listener.connect();
    try {
      const heard: number[] = [];
      listener.on("notification", (n) => n.channel === OUTBOX_CHANNEL && heard.push(Date.now()));
      await listener.query(`listen ${OUTBOX_CHANNEL}`);
      const em = (await testOrm()).em.fork();
      const ids = [(await createProgram(em, shop.shopId, exampleProgram(shop.shearId))).id];
      ids.push(...(await createBatch(em, shop.shopId, [exampleProgram(shop.shearId)])).map((p) => p.id));
      const deadline = Date.now() + 2000;
      while (!heard.length && Date.now() < deadline) await new Promise((r) => setTimeout(r, 10));
      expect(heard.length).toBeGreaterThan(0);
      // by the time anyone is woken, the programs and their events are there to be read
      const fresh = (await testOrm()).em.fork();
      expect(await fresh.count(Event, { subjectId: { $in: ids }, type: "program.created" })).toBe(2);
    } finally {
      await listener.end();
    }
  });
  it("writes created programs' events as fanned out when no endpoint of the shop takes them", async () => {
    const shop = await createTestShop("unheard");
    const em = (await testOrm()).em.fork();
    const create = async () => [
      (await createProgram(em, shop.shopId, exampleProgram(shop.shearId))).id,
      ...(await createBatch(em, shop.shopId, [exampleProgram(shop.shearId), exampleProgram(shop.shearId)])).map(
        (p) => p.id,
      ),
    ];
    // no endpoint, a disabled one, one taking other types only: nothing for the worker to do
    expect(await createdEvents(await create())).toEqual({ events: 3, writtenFannedOut: 3 });
    await subscribe(shop.shopId, ["program.created"], false);
    await subscribe(shop.shopId, ["program.completed", "program.failed"]);
    expect(await createdEvents(await create())).toEqual({ events: 3, writtenFannedOut: 3 });
    // inside a caller's transaction too
    const inside = await em
      .fork()
      .transactional(async (tx) => createBatch(tx, shop.shopId, [exampleProgram(shop.shearId)]));
    expect(await createdEvents(inside.map((p) => p.id))).toEqual({ events: 1, writtenFannedOut: 1 });
    // an endpoint taking every type (an empty list) or program.created: the events wait for the worker's fan-out,
    // which gives each its delivery (an event written as fanned out would never get one)
    const everything = await createTestShop("everything");
    await subscribe(everything.shopId, []);
    const [one] = await createBatch(em, everything.shopId, [exampleProgram(everything.shearId)]);
    await subscribe(shop.shopId, ["program.created"]);
    const later = await create();
    expect(await createdEvents(later)).toEqual({ events: 3, writtenFannedOut: 0 });
    await vi.waitFor(async () => expect(await deliveries([one.id, ...later])).toBe(4), { timeout: 10_000 });
  });

  it("builds each event's webhook body around its stored text, the bytes JSON.stringify writes for it", async () => {
    const shop = await createTestShop("payloads");
    const em = (await testOrm()).em.fork();
    const input = {
      ...exampleProgram(shop.shearId, "PAY-1"),
      title: 'Blank "é" 東 😀 \\ \u0001',
      metadata: { a: "\u2028" },
    };
    const [created] = await createBatch(em, shop.shopId, [input]);
    await recordEvent(em, shop.shopId, "program.updated", created.id, { program: created, changed: ["title"] });
    await em.flush();
    const events = await em.fork().find(Event, { subjectId: created.id }, { orderBy: { id: "asc" } });
    expect(events.map((e) => e.type)).toEqual(["program.created", "program.updated"]);
    const payloads = await eventPayloads(em.fork(), [...events.map((e) => e.id), events[0].id, "evt_unknown"]);
    expect([...payloads.keys()]).toEqual(expect.arrayContaining(events.map((e) => e.id)));
    expect(payloads.size).toBe(2);
    for (const event of events) {
      // the created event's body borrows the program's check (lib/services/event-bodies.ts): whole, it is the program
      const data = event.type === "program.created" ? { program: created } : event.data;
      const expected = JSON.stringify({ type: event.type, timestamp: event.createdAt.toISOString(), data });
      expect(payloads.get(event.id)).toBe(expected);
    }
    expect(JSON.parse(payloads.get(events[0].id)!).data.program.title).toBe(input.title);
    expect(await eventPayloads(em, [])).toEqual(new Map());
  });
});
