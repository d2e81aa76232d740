import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { EVENT_TYPES } from "../lib/schemas/enums";
import { Shop } from "./Shop";

/**
 * Something that happened to a shop's objects, written in the same transaction as the
 * change itself (an outbox): a rolled-back change leaves no event.
 */
export const Event = defineEntity({
  name: "Event",
  tableName: "events",
  indexes: [
    { properties: ["shop", "id"] },
    { properties: ["subjectId", "id"] },
    // the events waiting to be fanned out, oldest first: the worker's query, whatever the statistics say
    {
      name: "events_pending_index",
      expression: 'create index "events_pending_index" on "events" ("id") where "dispatched_at" is null',
    },
  ],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("event")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    /** e.g. program.created, program.released */
    type: p.enum([...EVENT_TYPES]),
    /** the id of the object the event is about */
    subjectId: p.string(),
    /**
     * JSON kept as `text`: written once (by `JSON.stringify`), read whole (a webhook's body is built around the
     * stored text), never queried inside; `json` would only check it again on every insert (migration 20261204070000).
     */
    data: p.json<Record<string, unknown>>().columnType("text"),
    /**
     * Where the body borrows its program's check: the character position of the `null` written in the check's
     * place, which readers replace with the program's check in the statement that reads the body
     * (`lib/services/event-bodies.ts`); null when the body is whole. Set only on `program.created` events
     * written with their program; a trigger gives them their own copy before the program's check changes
     * (migration 20261204200000). Read bodies through `lib/services/event-bodies.ts`, never this entity's `data`.
     */
    checkAt: p.integer().nullable(),
    /** when the event was fanned out into deliveries, one per subscribed endpoint */
    dispatchedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
