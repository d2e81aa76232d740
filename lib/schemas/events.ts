/**
 * What every event carries: one zod schema per event type for its `data`, and the envelope
 * each webhook delivers (`{ type, timestamp, data }`). The services that record events are
 * typed by these schemas, and the OpenAPI document's `webhooks` section is generated from
 * them, so what is sent and what is documented cannot drift apart.
 */
import { EVENT_TYPES, type EventType } from "./enums";
import { PROGRAM_STATUSES } from "./enums";
import { FAILURE_REASONS } from "./gateway";
import { PlanSummarySchema } from "./plan";
import { ProgramSchema } from "./program";
import { StockItemSchema, StockReservationSchema } from "./stock";
import { z } from "./zod";

const from = z.enum(PROGRAM_STATUSES).openapi({ description: "The state the program was in before" });
const gateway = z
  .string()
  .openapi({ description: "The id of the gateway's API key", example: "key_01JEXAMPLE0000000000000000" });

const Outcome = z.object({
  goodPieces: z.number().int(),
  scrappedPieces: z.number().int(),
  sheetsUsed: z.number().int().optional(),
  notes: z.string().optional(),
});

export const EVENT_DATA = {
  "program.created": z.object({ program: ProgramSchema }),
  "program.updated": z.object({
    program: ProgramSchema,
    changed: z.array(z.string()).openapi({ description: "The fields the change sent" }),
  }),
  "program.released": z.object({ program: ProgramSchema, from }),
  "program.claimed": z.object({ program: ProgramSchema, from, gateway }),
  "program.started": z.object({ program: ProgramSchema, from }),
  "program.progressed": z.object({
    program: ProgramSchema,
    from,
    progress: z.object({
      groupsDone: z.number().int(),
      strokesDone: z.number().int(),
      piecesDone: z.number().int().optional(),
    }),
  }),
  "program.completed": z.object({ program: ProgramSchema, from, outcome: Outcome }),
  "program.failed": z.object({
    program: ProgramSchema,
    from,
    outcome: z.object({
      reason: z.enum(FAILURE_REASONS),
      message: z.string().optional(),
      goodPieces: z.number().int().optional(),
      scrappedPieces: z.number().int().optional(),
      sheetsUsed: z.number().int().optional(),
    }),
  }),
  "program.cancelled": z.object({ program: ProgramSchema, from, reason: z.string().nullable() }),
  "program.lease_expired": z.object({ program: ProgramSchema, from, gateway, reason: z.string() }),
  "plan.completed": z.object({ plan: PlanSummarySchema }),
  "plan.failed": z.object({ plan: PlanSummarySchema }),
  "plan.cancelled": z.object({ plan: PlanSummarySchema }),
  "stock.created": z.object({ item: StockItemSchema }),
  "stock.adjusted": z.object({
    item: StockItemSchema,
    delta: z.number().int().openapi({ description: "Sheets added (positive) or taken away (negative)" }),
    reason: z.string(),
  }),
  "stock.archived": z.object({ item: StockItemSchema }),
  "stock.reserved": z.object({ item: StockItemSchema, reservation: StockReservationSchema }),
  "stock.released": z.object({
    item: StockItemSchema,
    reservation: StockReservationSchema,
    reason: z.string().openapi({ description: "Why the sheets went back" }),
  }),
  "stock.consumed": z.object({
    item: StockItemSchema,
    reservation: StockReservationSchema,
    program: z.string().openapi({ description: "The program whose run used the sheets" }),
    sheets: z.number().int().openapi({ description: "Sheets booked out of stock" }),
  }),
  "stock.remnant_added": z.object({
    item: StockItemSchema,
    program: z.string().openapi({ description: "The program whose run left the offcut" }),
  }),
  "endpoint.test": z.object({ endpoint: z.object({ id: z.string(), url: z.string() }), message: z.string() }),
} as const satisfies Record<EventType, z.ZodType>;

export type EventData<T extends EventType> = z.infer<(typeof EVENT_DATA)[T]>;

/** The body of a delivery of an event of this type (Standard Webhooks: `type`, `timestamp`, `data`). */
export function webhookEnvelope(type: EventType) {
  return z
    .object({
      type: z.literal(type),
      timestamp: z.iso.datetime().openapi({ description: "When the event happened (ISO 8601, UTC)" }),
      data: EVENT_DATA[type],
    })
    .openapi(`Webhook_${type.replace(/\./g, "_")}`);
}

export const WEBHOOK_ENVELOPES = Object.fromEntries(EVENT_TYPES.map((type) => [type, webhookEnvelope(type)])) as Record<
  EventType,
  ReturnType<typeof webhookEnvelope>
>;
