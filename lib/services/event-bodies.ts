/**
 * Reading events' bodies whole. A `program.created` body written with its program borrows the
 * program's check (`null` stands at `check_at`, migration 20261204200000); it is put back in the
 * same statement that reads the body, so a body read while the program's check is being replaced is
 * either the borrowed one with the old check (the replacement not yet committed) or the copy the
 * trigger wrote: never the new check. Every reader of an event's body goes through here.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import type { EventEntity } from "../../entities";

/** SQL for the whole body of the event aliased `e`, as JSON text. */
export const WHOLE_BODY_SQL = `case when e.check_at is null then e.data
  else overlay(e.data placing coalesce((select p."check" from programs p where p.id = e.subject_id), 'null')
    from e.check_at for 4) end`;

export interface StoredEvent {
  id: string;
  type: string;
  /** the whole body, as the JSON text stored */
  data: string;
  createdAt: Date;
}

/** The given events' whole bodies, by id (unknown ids are left out). */
export async function readEvents(em: EntityManager, ids: readonly string[]): Promise<Map<string, StoredEvent>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map();
  const rows = await em.getConnection().execute<{ id: string; type: string; data: string; created_at: Date }[]>(
    `select e.id, e.type, ${WHOLE_BODY_SQL} as data, e.created_at from events e
       where e.id in (${unique.map(() => "?").join(", ")})`,
    unique,
  );
  return new Map(rows.map((e) => [e.id, { id: e.id, type: e.type, data: e.data, createdAt: e.created_at }]));
}

/**
 * The whole bodies of those of `events` (as loaded) that borrow their program's check, by id, read again in
 * one statement (an event that got its own copy meanwhile is read as that copy); the others' loaded bodies are
 * whole already. The entities are left as they were stored.
 */
export async function borrowedBodies(
  em: EntityManager,
  events: readonly EventEntity[],
): Promise<Map<string, Record<string, unknown>>> {
  const borrowing = events.filter((e) => e.checkAt != null).map((e) => e.id);
  const whole = await readEvents(em, borrowing);
  return new Map([...whole].map(([id, read]) => [id, JSON.parse(read.data) as Record<string, unknown>]));
}
