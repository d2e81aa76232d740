/** Webhook endpoints, events and deliveries. */
import { EVENT_TYPES } from "./enums";
import { z } from "./zod";

export const EventTypeSchema = z.enum(EVENT_TYPES).openapi("EventType");

const url = z
  .url({ protocol: /^https?$/ })
  .max(2000)
  .openapi({
    description:
      "Where to POST events (http or https). Loopback and private addresses are refused unless this install allows on-premises receivers.",
    example: "https://erp.example/hooks/shearwire",
  });

export const EndpointInputSchema = z
  .object({
    url,
    description: z.string().max(200).optional(),
    eventTypes: z
      .array(EventTypeSchema)
      .max(EVENT_TYPES.length)
      .optional()
      .openapi({ description: "Event types to receive; empty or absent = all" }),
    enabled: z.boolean().optional(),
  })
  .strict()
  .openapi("WebhookEndpointInput");

export const EndpointPatchSchema = EndpointInputSchema.partial().strict().openapi("WebhookEndpointPatch");

export const EndpointSchema = z
  .object({
    id: z.string().openapi({ example: "whe_01JEXAMPLE0000000000000000" }),
    url: z.string(),
    description: z.string().nullable(),
    eventTypes: z.array(EventTypeSchema),
    enabled: z.boolean(),
    disabledReason: z.string().nullable(),
    secretRotation: z
      .object({ previousSecretExpiresAt: z.string() })
      .nullable()
      .openapi({ description: "While set, deliveries carry signatures with both the new and the previous secret" }),
    consecutiveFailures: z.number().int(),
    createdAt: z.string(),
    updatedAt: z.string(),
  })
  .openapi("WebhookEndpoint");

export const EndpointWithSecretSchema = z
  .object({
    endpoint: EndpointSchema,
    secret: z.string().openapi({
      description: "The signing secret, shown this once",
      example: "whsec_MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw",
    }),
  })
  .openapi("WebhookEndpointWithSecret");

export const RotateInputSchema = z
  .object({
    overlapHours: z
      .number()
      .min(0)
      .max(168)
      .optional()
      .openapi({ description: "How long the previous secret keeps signing too (default 24)" }),
  })
  .strict()
  .openapi("RotateSecretInput");

export const EventSchema = z
  .object({
    id: z
      .string()
      .openapi({ description: "Also the `webhook-id` of its deliveries", example: "evt_01JEXAMPLE0000000000000000" }),
    type: EventTypeSchema,
    subjectId: z.string(),
    data: z.record(z.string(), z.unknown()),
    createdAt: z.string(),
  })
  .openapi("Event");

export const AttemptSchema = z
  .object({
    id: z.string(),
    attemptedAt: z.string(),
    requestHeaders: z
      .record(z.string(), z.string())
      .nullable()
      .openapi({ description: "The headers sent, signature included (the body is the event's webhook payload)" }),
    statusCode: z.number().int().nullable(),
    responseHeaders: z
      .record(z.string(), z.string())
      .nullable()
      .openapi({ description: "The receiver's response headers" }),
    latencyMs: z.number(),
    responseExcerpt: z
      .string()
      .nullable()
      .openapi({ description: "The first 2,000 characters of the receiver's response body" }),
    error: z.string().nullable(),
  })
  .openapi("DeliveryAttempt");

export const DeliverySchema = z
  .object({
    id: z.string(),
    eventId: z.string(),
    eventType: EventTypeSchema,
    endpointId: z.string(),
    status: z.enum(["pending", "succeeded", "failed", "skipped"]),
    attempts: z.number().int(),
    nextAttemptAt: z.string().nullable(),
    lastStatusCode: z.number().int().nullable(),
    lastError: z.string().nullable(),
    manual: z.boolean(),
    attemptLog: z.array(AttemptSchema),
    createdAt: z.string(),
    updatedAt: z.string(),
  })
  .openapi("Delivery");

export const EventQuerySchema = z.object({
  type: EventTypeSchema.optional(),
  subject: z.string().max(64).optional().openapi({ description: "Only events about this object id" }),
});

export const ResendInputSchema = z
  .object({ endpoint: z.string().min(1).max(64).openapi({ description: "The endpoint to send to" }) })
  .strict()
  .openapi("ResendInput");

export type EndpointT = z.infer<typeof EndpointSchema>;
export type DeliveryT = z.infer<typeof DeliverySchema>;

/**
 * The body of every delivery of an event, `{ type, timestamp, data }`: the same bytes on every attempt, and what the
 * signature signs. `dataJson` is the event's body as stored (JSON text), placed as it is rather than parsed and
 * written out again.
 */
export function webhookPayload(event: { type: string; createdAt: Date | string; dataJson: string }): string {
  const timestamp = new Date(event.createdAt).toISOString();
  return `{"type":${JSON.stringify(event.type)},"timestamp":"${timestamp}","data":${event.dataJson}}`;
}
