import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import { Delivery } from "./Delivery";

/** One HTTP attempt of a delivery: when, the headers sent (signature included), what came back, how long it took. */
export const DeliveryAttempt = defineEntity({
  name: "DeliveryAttempt",
  tableName: "delivery_attempts",
  indexes: [{ properties: ["delivery", "id"] }],
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("attempt")),
    delivery: () => p.manyToOne(Delivery).deleteRule("cascade"),
    attemptedAt: p.datetime(),
    statusCode: p.integer().nullable(),
    latencyMs: p.float().columnType("double precision"),
    /** the request's headers as sent (webhook-id, webhook-timestamp, webhook-signature, …); the body is the event's */
    requestHeaders: p.json<Record<string, string>>().nullable(),
    /** the response's headers, as received (a bounded number of them) */
    responseHeaders: p.json<Record<string, string>>().nullable(),
    /** the first characters of the response body */
    responseExcerpt: p.text().nullable(),
    error: p.text().nullable(),
  },
});
