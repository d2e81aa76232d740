/**
 * Idempotency-Key on POST: the same key and request replays the stored response; the same
 * key with another request is 422; a duplicate while the first is still running is 409.
 * Records are kept 24 h per API key. A record left in flight by a crash is taken over
 * after a short time so a retry is not refused for a day.
 */
import { createHash } from "node:crypto";
import type { EntityManager } from "@mikro-orm/postgresql";
import { IdempotencyRecord } from "../../entities";
import { ApiError, conflict } from "../errors";

export const IDEMPOTENCY_TTL_MS = 24 * 60 * 60 * 1000;
const ABANDONED_AFTER_MS = 60_000;
const KEY_PATTERN = /^[\x21-\x7e]{1,255}$/;

export interface StoredResponse {
  status: number;
  body: unknown;
  headers: Record<string, string>;
}

export type Claim = { kind: "new" } | { kind: "replay"; response: StoredResponse };

export function fingerprint(method: string, path: string, body: string): string {
  return createHash("sha256").update(`${method}\n${path}\n${body}`).digest("hex");
}

export function checkKeyFormat(key: string) {
  if (!KEY_PATTERN.test(key)) {
    throw new ApiError(
      400,
      "bad-idempotency-key",
      "Idempotency-Key is malformed",
      "Use 1 to 255 visible ASCII characters, e.g. a UUID.",
    );
  }
}

export async function claim(
  em: EntityManager,
  keyId: string,
  idemKey: string,
  method: string,
  path: string,
  print: string,
): Promise<Claim> {
  const conn = em.getConnection();
  for (let attempt = 0; attempt < 3; attempt++) {
    const now = new Date();
    const inserted = await conn.execute(
      `insert into idempotency_records (key_id, idempotency_key, method, path, fingerprint, created_at, expires_at)
       values (?, ?, ?, ?, ?, ?, ?) on conflict do nothing returning key_id`,
      [keyId, idemKey, method, path, print, now, new Date(now.getTime() + IDEMPOTENCY_TTL_MS)],
    );
    if (inserted.length === 1) return { kind: "new" };
    const existing = await em.findOne(
      IdempotencyRecord,
      { keyId, idempotencyKey: idemKey },
      { disableIdentityMap: true },
    );
    if (!existing) continue; // removed meanwhile: try again
    const abandoned =
      existing.responseStatus == null && now.getTime() - existing.createdAt.getTime() > ABANDONED_AFTER_MS;
    if (existing.expiresAt <= now || abandoned) {
      await em.nativeDelete(IdempotencyRecord, { keyId, idempotencyKey: idemKey, createdAt: existing.createdAt });
      continue;
    }
    if (existing.fingerprint !== print) {
      throw new ApiError(
        422,
        "idempotency-key-reused",
        "Idempotency-Key reused with another request",
        "This Idempotency-Key was already used with a different method, path or body. Use a new key for a new request.",
      );
    }
    if (existing.responseStatus == null) {
      throw conflict("A request with this Idempotency-Key is still being processed; retry shortly.");
    }
    return {
      kind: "replay",
      response: {
        status: existing.responseStatus,
        body: existing.responseBody,
        headers: existing.responseHeaders ?? {},
      },
    };
  }
  throw conflict("Could not reserve the Idempotency-Key; retry shortly.");
}

export async function complete(em: EntityManager, keyId: string, idemKey: string, response: StoredResponse) {
  await em.nativeUpdate(
    IdempotencyRecord,
    { keyId, idempotencyKey: idemKey },
    {
      responseStatus: response.status,
      responseBody: response.body as object,
      responseHeaders: response.headers,
    },
  );
}

/** Forget a reservation whose request failed on our side, so a retry runs again. */
export async function release(em: EntityManager, keyId: string, idemKey: string) {
  await em.nativeDelete(IdempotencyRecord, { keyId, idempotencyKey: idemKey, responseStatus: null });
}

export async function purgeExpired(em: EntityManager): Promise<number> {
  return em.nativeDelete(IdempotencyRecord, { expiresAt: { $lte: new Date() } });
}
