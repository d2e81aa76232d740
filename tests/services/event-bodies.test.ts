/**
 * A created program's `program.created` body borrows the program's check instead of holding a second
 * copy; readers put it back, and a trigger gives the event its own copy before the check changes or
 * the program goes, so an event's body never changes.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Event } from "../../entities";
import { readEvents } from "../../lib/services/event-bodies";
import { eventPayloads } from "../../lib/services/events";
import { createBatch } from "../../lib/services/program-batch";
import { updateProgram } from "../../lib/services/programs";
import { getEvent, listEvents } from "../../lib/services/webhooks";
import type { ProgramT } from "../../lib/schemas/program";
import { closeTestOrm, createTestShop, exampleProgram, testOrm, type TestShop } from "../support/fixtures";

let shop: TestShop;
beforeAll(async () => {
  shop = await createTestShop("event-bodies");
});
afterAll(closeTestOrm);

const em = async () => (await testOrm()).em.fork();
const raw = async (programId: string) => {
  const [row] = await (
    await em()
  )
    .getConnection()
    .execute<{ id: string; data: string; check_at: number | null; check: string }[]>(
      `select e.id, e.data, e.check_at, p."check" from events e join programs p on p.id = e.subject_id
       where e.subject_id = ? and e.type = 'program.created'`,
      [programId],
    );
  return row;
};

async function created(reference: string, title = 'Blank ü 東 😀 "quoted"'): Promise<ProgramT> {
  const [program] = await createBatch(await em(), shop.shopId, [{ ...exampleProgram(shop.shearId, reference), title }]);
  return program;
}

describe("a created program's event", () => {
  it("stores the check once and is read whole: by id, in lists, and as a webhook's body", async () => {
    const program = await created("EB-1");
    const row = await raw(program.id);
    // stored: the body with null in the check's place, at check_at (characters, 1-based; the title is beyond ASCII)
    expect(row.data).toBe(JSON.stringify({ program: { ...program, check: null } }));
    expect(row.check_at).not.toBeNull();
    expect([...row.data].slice(row.check_at! - 1, row.check_at! + 3).join("")).toBe("null");
    expect(row.check).toBe(JSON.stringify(program.check));
    // read: whole, the very text of the created program's answer
    const whole = JSON.stringify({ program });
    expect((await readEvents(await em(), [row.id])).get(row.id)?.data).toBe(whole);
    expect((await getEvent(await em(), shop.shopId, row.id)).data).toEqual({ program });
    const listed = await listEvents(await em(), shop.shopId, { limit: 10, subject: program.id });
    expect(listed.data.map((e) => e.data)).toEqual([{ program }]);
    const payload = (await eventPayloads(await em(), [row.id])).get(row.id)!;
    expect(JSON.parse(payload).data).toEqual({ program });
    expect(payload).toContain(whole);
  });

  it("gets its own copy before the program's check changes, so its body stays the one sent", async () => {
    const program = await created("EB-2");
    const before = await raw(program.id);
    const updated = await updateProgram(
      await em(),
      shop.shopId,
      program.id,
      { cuts: [{ backgauge: 10, count: 2 }] },
      `"${program.revision}"`,
    );
    expect(updated.check).not.toEqual(program.check);
    const after = await raw(program.id);
    expect(after.check_at).toBeNull();
    expect(after.data).toBe(JSON.stringify({ program }));
    expect(after.check).toBe(JSON.stringify(updated.check));
    expect((await getEvent(await em(), shop.shopId, before.id)).data).toEqual({ program });
    // the update's own event holds the new check
    const events = await (await em()).find(Event, { subjectId: program.id, type: "program.updated" });
    expect((events[0].data as { program: ProgramT }).program.check).toEqual(updated.check);
  });

  it("gets its own copy by any write that changes the check, and none when the check is written unchanged", async () => {
    const program = await created("EB-3");
    const db = (await em()).getConnection();
    await db.execute(`update programs set "check" = "check", title = 'renamed' where id = ?`, [program.id]);
    expect((await raw(program.id)).check_at).not.toBeNull();
    await db.execute(`update programs set "check" = '{"validation":"pass"}' where id = ?`, [program.id]);
    const row = await raw(program.id);
    expect(row.check_at).toBeNull();
    expect(row.data).toBe(JSON.stringify({ program }));
  });

  it("keeps its whole body when the program is deleted", async () => {
    const program = await created("EB-4");
    const { id } = await raw(program.id);
    await (await em()).getConnection().execute(`delete from programs where id = ?`, [program.id]);
    const [event] = await (
      await em()
    )
      .getConnection()
      .execute<{ data: string; check_at: number | null }[]>(`select data, check_at from events where id = ?`, [id]);
    expect(event).toEqual({ data: JSON.stringify({ program }), check_at: null });
    expect((await readEvents(await em(), [id])).get(id)?.data).toBe(JSON.stringify({ program }));
  });
});
