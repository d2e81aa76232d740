import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import type { EventType } from "../lib/schemas/enums";
import { Shop } from "./Shop";

/**
 * A shop's webhook receiver. The signing secret (`whsec_…`) is shown once; after a rotation
 * the previous secret keeps signing alongside the new one until `previousSecretExpiresAt`.
 */
export const WebhookEndpoint = defineEntity({
  name: "WebhookEndpoint",
  tableName: "webhook_endpoints",
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("endpoint")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    url: p.text(),
    description: p.text().nullable(),
    /** event types this endpoint receives; empty = every type */
    eventTypes: p.json<EventType[]>().default("[]"),
    enabled: p.boolean().default(true),
    /** why it was disabled: by a person, after repeated failures, or because the receiver answered 410 */
    disabledReason: p.text().nullable(),
    secret: p.string().hidden(),
    previousSecret: p.string().nullable(),
    previousSecretExpiresAt: p.datetime().nullable(),
    /** failed attempts in a row; reset by any success */
    consecutiveFailures: p.integer().default(0),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
