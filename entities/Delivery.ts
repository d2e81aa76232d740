import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { Event } from "./Event";
import { Shop } from "./Shop";
import { WebhookEndpoint } from "./WebhookEndpoint";

export const DELIVERY_STATUSES = ["pending", "succeeded", "failed", "skipped"] as const;

/** One event on its way to one endpoint, retried on a schedule until it succeeds or gives up. */
export const Delivery = defineEntity({
  name: "Delivery",
  tableName: "deliveries",
  indexes: [
    { properties: ["status", "nextAttemptAt"] },
    { properties: ["endpoint", "id"] },
    { properties: ["event", "id"] },
  ],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("delivery")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    event: () => p.manyToOne(Event).deleteRule("cascade"),
    endpoint: () => p.manyToOne(WebhookEndpoint).deleteRule("cascade"),
    status: p.enum([...DELIVERY_STATUSES]).default("pending"),
    attempts: p.integer().default(0),
    nextAttemptAt: p.datetime().nullable(),
    lastStatusCode: p.integer().nullable(),
    lastError: p.text().nullable(),
    /** true for a delivery made by "resend" */
    manual: p.boolean().default(false),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
