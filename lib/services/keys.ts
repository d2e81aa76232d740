/**
 * API keys: created with a recognisable prefix, shown once, stored as a SHA-256 digest,
 * scoped, optionally expiring and bound to shears, revocable with effect on the next request.
 */
import { createHash, randomBytes } from "node:crypto";
import type { EntityManager } from "@mikro-orm/postgresql";
import { ApiKey, Shear, Shop, type ApiKeyEntity } from "../../entities";
import type { Scope } from "../../lib/schemas/enums";
import { batchedLookup } from "../db/batched-lookup";
import { runPrepared } from "../db/prepared";
import { invalidRequest, notFound, unauthorized } from "../errors";

/** Every key starts with this; keys made earlier start `swk_live_` and keep working. */
export const KEY_PREFIX = "swk_";
const VISIBLE = KEY_PREFIX.length + 4;
/** last-used is written at most this often per key, so a busy key costs no write per request */
const LAST_USED_RESOLUTION_MS = 30_000;
/**
 * When this process last wrote each key's last use. Requests that arrive together read the same stale
 * time; without this each of them wrote it, and the writes queued on the key's row lock, each holding a
 * pooled connection (32 at once took ~36 ms each under load). Only throttles that write: the key itself
 * is read on every request.
 */
const lastUseWritten = new Map<string, number>();

export interface ApiKeyView {
  id: string;
  name: string;
  prefix: string;
  scopes: Scope[];
  shearIds: string[];
  expiresAt: string | null;
  rateLimitPerMin: number | null;
  revokedAt: string | null;
  lastUsedAt: string | null;
  /** the console member who created it (null for keys made from the shell) */
  createdBy: string | null;
  createdAt: string;
}

export interface NewKey {
  name: string;
  scopes: Scope[];
  shearIds?: string[];
  expiresAt?: Date | null;
  createdBy?: string | null;
  rateLimitPerMin?: number | null;
}

const digest = (secret: string) => createHash("sha256").update(secret).digest("hex");

export function viewKey(apiKey: ApiKeyEntity): ApiKeyView {
  return {
    id: apiKey.id,
    name: apiKey.name,
    prefix: apiKey.prefix,
    scopes: apiKey.scopes,
    shearIds: apiKey.shearIds,
    expiresAt: apiKey.expiresAt?.toISOString() ?? null,
    rateLimitPerMin: apiKey.rateLimitPerMin ?? null,
    revokedAt: apiKey.revokedAt?.toISOString() ?? null,
    lastUsedAt: apiKey.lastUsedAt?.toISOString() ?? null,
    createdBy: apiKey.createdBy ?? null,
    createdAt: apiKey.createdAt.toISOString(),
  };
}

/** A key may be bound only to this shop's shears that are in use. */
async function checkShears(em: EntityManager, shopId: string, shearIds: string[]) {
  if (!shearIds.length) return;
  const found = await em.find(Shear, { id: { $in: shearIds }, shop: shopId, archivedAt: null }, { fields: ["id"] });
  const known = new Set(found.map((s) => s.id));
  const index = shearIds.findIndex((id) => !known.has(id));
  if (index >= 0) {
    const message = "no shear in use with that id in this shop";
    throw invalidRequest(`The key cannot be bound to ${shearIds[index]}: ${message}.`, [
      { location: "body", pointer: `/shears/${index}`, message },
    ]);
  }
}

export async function createKey(em: EntityManager, shopId: string, input: NewKey) {
  await checkShears(em, shopId, input.shearIds ?? []);
  const secret = `${KEY_PREFIX}${randomBytes(24).toString("base64url")}`;
  const key = em.create(ApiKey, {
    shop: em.getReference(Shop, shopId),
    name: input.name,
    prefix: secret.slice(0, VISIBLE),
    hash: digest(secret),
    scopes: [...new Set(input.scopes)],
    shearIds: input.shearIds ?? [],
    expiresAt: input.expiresAt ?? null,
    rateLimitPerMin: input.rateLimitPerMin ?? null,
    createdBy: input.createdBy ?? null,
  });
  await em.flush();
  return { key: viewKey(key), secret };
}

export interface Principal {
  keyId: string;
  shopId: string;
  scopes: Scope[];
  shearIds: string[];
  rateLimitPerMin: number | null;
}

/** Resolve an `Authorization: Bearer swk_…` header to its key, or throw 401. */
export async function authenticate(em: EntityManager, header: string | null): Promise<Principal> {
  const match = header?.match(/^Bearer\s+(\S+)$/i);
  if (!match) throw unauthorized("Send an API key as `Authorization: Bearer swk_…`.");
  const secret = match[1];
  if (!secret.startsWith(KEY_PREFIX)) throw unauthorized("That is not a Shearwire API key.");
  // An indexed lookup without hydrating an entity, shared by the requests that arrive together: this runs before every call.
  const key = await keysByDigest(em)(digest(secret));
  const now = new Date();
  if (!key) throw unauthorized("The API key is not valid.");
  if (key.revoked_at) throw unauthorized("The API key was revoked.");
  if (key.expires_at && new Date(key.expires_at) <= now) throw unauthorized("The API key has expired.");
  const lastUse = Math.max(
    key.last_used_at ? new Date(key.last_used_at).getTime() : 0,
    lastUseWritten.get(key.id) ?? 0,
  );
  if (now.getTime() - lastUse > LAST_USED_RESOLUTION_MS) {
    lastUseWritten.set(key.id, now.getTime());
    // Not awaited: recording the time must not slow the request down.
    // Never backwards: another process may have written a later time meanwhile.
    em.getConnection()
      .execute("update api_keys set last_used_at = ? where id = ? and (last_used_at is null or last_used_at < ?)", [
        now,
        key.id,
        now,
      ])
      .catch((err) => {
        if (lastUseWritten.get(key.id) === now.getTime()) lastUseWritten.delete(key.id); // the next request tries again
        console.error("[keys] could not record last use:", err);
      });
  }
  return {
    keyId: key.id,
    shopId: key.shop_id,
    scopes: key.scopes,
    shearIds: key.shear_ids,
    rateLimitPerMin: key.rate_limit_per_min,
  };
}

/**
 * Keys by digest, looked up by the requests that arrive while another lookup runs in one query
 * (never from a cache: each answer is read after its request arrived, so revocation holds on the next request).
 */
const lookups = new WeakMap<object, (digest: string) => Promise<KeyRow | undefined>>();
function keysByDigest(em: EntityManager) {
  const connection = em.getConnection();
  let lookup = lookups.get(connection);
  if (lookup) return lookup;
  const knex = connection.getKnex();
  lookup = batchedLookup(async (digests: string[]) => {
    const rows = await runPrepared<KeyRow & { hash: string }>(
      knex,
      "lookup-keys",
      "select id, hash, shop_id, scopes, shear_ids, rate_limit_per_min, expires_at, revoked_at, last_used_at from api_keys where hash = any($1::text[])",
      [digests],
    );
    return new Map(rows.map((r) => [r.hash, r]));
  });
  lookups.set(connection, lookup);
  return lookup;
}

interface KeyRow {
  id: string;
  shop_id: string;
  scopes: Scope[];
  shear_ids: string[];
  rate_limit_per_min: number | null;
  expires_at: Date | null;
  revoked_at: Date | null;
  last_used_at: Date | null;
}

export async function listKeys(em: EntityManager, shopId: string): Promise<ApiKeyView[]> {
  const keys = await em.find(ApiKey, { shop: shopId }, { orderBy: { createdAt: "desc" } });
  return keys.map(viewKey);
}

export async function revokeKey(em: EntityManager, shopId: string, keyId: string): Promise<ApiKeyView> {
  const key = await em.findOne(ApiKey, { id: keyId, shop: shopId });
  if (!key) throw notFound("API key");
  key.revokedAt ??= new Date();
  await em.flush();
  return viewKey(key);
}
