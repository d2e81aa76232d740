import { defineEntity, p } from "@mikro-orm/core";

/**
 * The stored outcome of a POST sent with an Idempotency-Key, per API key. A record without
 * a response is in flight; a concurrent duplicate then answers 409.
 */
export const IdempotencyRecord = defineEntity({
  name: "IdempotencyRecord",
  tableName: "idempotency_records",
  primaryKeys: ["keyId", "idempotencyKey"],
  indexes: [{ properties: ["expiresAt"] }],
  properties: {
    keyId: p.string().primary(),
    idempotencyKey: p.string().primary(),
    method: p.string(),
    path: p.text(),
    /** SHA-256 of method, path and body: the same key with another request is refused */
    fingerprint: p.string(),
    responseStatus: p.integer().nullable(),
    responseBody: p.json<unknown>().nullable(),
    responseHeaders: p.json<Record<string, string>>().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    expiresAt: p.datetime(),
  },
});
