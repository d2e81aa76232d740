import { defineEntity, p } from "@mikro-orm/core";

/** One API request: who, what, how it went. Never secrets or bodies. */
export const RequestLog = defineEntity({
  name: "RequestLog",
  tableName: "request_logs",
  indexes: [{ properties: ["shopId", "createdAt"] }],
  properties: {
    /** the request id returned in the X-Request-Id header */
    id: p.string().primary(),
    shopId: p.string().nullable(),
    keyId: p.string().nullable(),
    method: p.string(),
    /** the route template, e.g. /api/v1/programs/{id} */
    route: p.text(),
    /** the path as called, without the query string */
    path: p.text(),
    status: p.integer(),
    latencyMs: p.float().columnType("double precision"),
    idempotencyKey: p.text().nullable(),
    errorType: p.string().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
