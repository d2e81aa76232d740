/**
 * The outbox: every change to a program writes its event in the same transaction, so a
 * rolled-back change leaves no event and a committed one always has its event.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { Event, Shop } from "../../entities";

import type { EventData } from "../schemas/events";
import { webhookPayload } from "../schemas/webhook";
import { readEvents } from "./event-bodies";
import type { EventType } from "../schemas/enums";

export type { EventType } from "../schemas/enums";

export const OUTBOX_CHANNEL = "shearwire_outbox";
/** Notified with a shear's id when one of its programs becomes claimable (released, or back after a lease ran out). */
export const RELEASED_CHANNEL = "shearwire_released";

/**
 * SQL true when the webhook endpoint aliased `w` receives an event of type `type` (an SQL expression): it is
 * enabled and subscribed to that type (an empty list subscribes to every type); test events go only to the
 * endpoint that asked for one, never by fan-out. The worker's fan-out and the program writes share it.
 */
export function subscribesSql(w: string, type: string): string {
  return `${w}.enabled and ${type} <> 'endpoint.test'
    and (jsonb_array_length(${w}.event_types) = 0 or ${w}.event_types @> jsonb_build_array(${type}))`;
}

/** Wake the gateways waiting on this shear when the caller's transaction commits. */
export async function announceRelease(em: EntityManager, shearId: string) {
  await em.execute(`select pg_notify('${RELEASED_CHANNEL}', ?)`, [shearId]);
}

/**
 * Stage an event in the caller's transaction, and wake the worker when that transaction
 * commits (PostgreSQL delivers NOTIFY on commit only, so a rolled-back change wakes no one).
 */
export async function recordEvent<T extends EventType>(
  em: EntityManager,
  shopId: string,
  type: T,
  subjectId: string,
  data: EventData<T>,
) {
  const [event] = await recordEvents(em, shopId, [{ type, subjectId, data }]);
  return event;
}

/** Stage several events in the caller's transaction (written together at flush), with one wake-up. */
export async function recordEvents<T extends EventType>(
  em: EntityManager,
  shopId: string,
  events: { type: T; subjectId: string; data: EventData<T> }[],
) {
  const shop = em.getReference(Shop, shopId);
  const staged = events.map((e) => em.create(Event, { shop, type: e.type, subjectId: e.subjectId, data: e.data }));
  if (staged.length) await em.execute(`select pg_notify('${OUTBOX_CHANNEL}', '')`);
  return staged;
}

/** Each event's webhook body (`webhookPayload`), by id, built around its stored JSON text; unknown ids are left out. */
export async function eventPayloads(em: EntityManager, ids: readonly string[]): Promise<Map<string, string>> {
  const events = await readEvents(em, ids);
  return new Map(
    [...events.values()].map((e) => [e.id, webhookPayload({ type: e.type, createdAt: e.createdAt, dataJson: e.data })]),
  );
}
