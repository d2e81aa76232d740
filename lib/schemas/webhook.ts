/** Webhook endpoints, events and deliveries. */
import { EVENT_TYPES } from "./enums";
import { z } from "./zod";

export const EventType = z.enum(EVENT_TYPES).openapi("EventType");

const url = z
  .url({ protocol: /^https?$/ })
  .max(2000)
  .openapi({
    description:
      "Where to POST events (http or https). Loopback and private addresses are refused unless this install allows on-premises receivers.",
    example: "https://erp.example/hooks/shearwire",
  });

export const EndpointInput = z
  .object({
    url,
    description: z.string().max(200).optional(),
    eventTypes: z
      .array(EventType)
      .max(EVENT_TYPES.length)
      .optional()
      .openapi({ description: "Event types to receive; empty or absent = all" }),
    enabled: z.boolean().optional(),
  })
  .strict()
  .openapi("WebhookEndpointInput");

export const EndpointPatch = EndpointInput.partial().strict().openapi("WebhookEndpointPatch");

export const Endpoint = z
  .object({
    id: z.string().openapi({ example: "whe_01JEXAMPLE0000000000000000" }),
    url: z.string(),
    description: z.string().nullable(),
    eventTypes: z.array(EventType),
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

export const EndpointWithSecret = z
  .object({
    endpoint: Endpoint,
    secret: z.string().openapi({
      description: "The signing secret, shown this once",
      example: "whsec_MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw",
    }),
  })
  .openapi("WebhookEndpointWithSecret");

export const RotateInput = z
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

export const Event = z
  .object({
    id: z
      .string()
      .openapi({ description: "Also the `webhook-id` of its deliveries", example: "evt_01JEXAMPLE0000000000000000" }),
    type: EventType,
    subjectId: z.string(),
    data: z.record(z.string(), z.unknown()),
    createdAt: z.string(),
  })
  .openapi("Event");

export const Attempt = z
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

export const Delivery = z
  .object({
    id: z.string(),
    eventId: z.string(),
    eventType: EventType,
    endpointId: z.string(),
    status: z.enum(["pending", "succeeded", "failed", "skipped"]),
    attempts: z.number().int(),
    nextAttemptAt: z.string().nullable(),
    lastStatusCode: z.number().int().nullable(),
    lastError: z.string().nullable(),
    manual: z.boolean(),
    attemptLog: z.array(Attempt),
    createdAt: z.string(),
    updatedAt: z.string(),
  })
  .openapi("Delivery");

export const EventQuery = z.object({
  type: EventType.optional(),
  subject: z.string().max(64).optional().openapi({ description: "Only events about this object id" }),
});

export const ResendInput = z
  .object({ endpoint: z.string().min(1).max(64).openapi({ description: "The endpoint to send to" }) })
  .strict()
  .openapi("ResendInput");

export type EndpointT = z.infer<typeof Endpoint>;
export type DeliveryT = z.infer<typeof Delivery>;

/** The body of every delivery of an event: the same bytes on every attempt, and what the signature signs. */
export function webhookPayload(event: { type: string; createdAt: Date | string; data: unknown }): string {
  return JSON.stringify({ type: event.type, timestamp: new Date(event.createdAt).toISOString(), data: event.data });
}
