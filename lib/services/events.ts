/**
 * The outbox: every change to a program writes its event in the same transaction, so a
 * rolled-back change leaves no event and a committed one always has its event.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { Event, Shop } from "../../entities";

export const EVENT_TYPES = [
  "program.created", "program.updated", "program.released", "program.claimed", "program.started",
  "program.progressed", "program.completed", "program.failed", "program.cancelled", "program.lease_expired",
  "endpoint.test",
] as const;
export type EventType = (typeof EVENT_TYPES)[number];

/** Stage an event in the unit of work; it is written by the caller's flush/commit. */
export function recordEvent(em: EntityManager, shopId: string, type: EventType, subjectId: string, data: Record<string, unknown>) {
  return em.create(Event, { shop: em.getReference(Shop, shopId), type, subjectId, data });
}
