import { defineEntity, p } from "@mikro-orm/core";
import { newId } from "../lib/ids";
import type { Scope } from "../lib/schemas/enums";
import { Shop } from "./Shop";

/**
 * An API key of one shop. The secret is shown once; only its SHA-256 digest is stored,
 * with a short visible prefix so people can tell keys apart.
 */
export const ApiKey = defineEntity({
  name: "ApiKey",
  tableName: "api_keys",
  properties: {
    id: p
      .string()
      .primary()
      .onCreate(() => newId("apiKey")),
    shop: () => p.manyToOne(Shop).deleteRule("cascade"),
    name: p.text(),
    /** the first characters of the secret, safe to show (e.g. "swk_7KQ2"; keys made before 2026-12 start "swk_live_") */
    prefix: p.string(),
    /** hex SHA-256 of the whole secret */
    hash: p.string().unique().hidden(),
    scopes: p.json<Scope[]>(),
    /** gateway keys may be bound to some shears; empty = every shear of the shop */
    shearIds: p.json<string[]>().default("[]"),
    /** requests per minute for this key; null = the server's default */
    rateLimitPerMin: p.integer().nullable(),
    expiresAt: p.datetime().nullable(),
    revokedAt: p.datetime().nullable(),
    lastUsedAt: p.datetime().nullable(),
    createdBy: p.string().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
