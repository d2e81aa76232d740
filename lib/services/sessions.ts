/**
 * Console sessions, kept on the server: the signed cookie only names a row here, so a
 * session ends for real when the person signs out, or when their role, membership or
 * password changes (every session of theirs then ends).
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { ConsoleSession, User } from "../../entities";

export type SessionEnd = "signed-out" | "role-changed" | "removed" | "password-changed";

export async function startSession(em: EntityManager, userId: string, maxAgeSeconds: number): Promise<string> {
  const session = em.create(ConsoleSession, {
    user: em.getReference(User, userId),
    expiresAt: new Date(Date.now() + maxAgeSeconds * 1000),
    revokedAt: null,
    revokedReason: null,
  });
  await em.flush();
  return session.id;
}

/** True while the session exists, belongs to this person, and has neither ended nor expired. */
export async function sessionActive(em: EntityManager, sessionId: string, userId: string): Promise<boolean> {
  const [row] = await em
    .getConnection()
    .execute<{ id: string }[]>(
      "select id from console_sessions where id = ? and user_id = ? and revoked_at is null and expires_at > now()",
      [sessionId, userId],
    );
  return Boolean(row);
}

export async function endSession(em: EntityManager, sessionId: string, reason: SessionEnd = "signed-out") {
  await em.nativeUpdate(
    ConsoleSession,
    { id: sessionId, revokedAt: null },
    { revokedAt: new Date(), revokedReason: reason },
  );
}

/** End every session of a person (their access changed: they must sign in again to get the new one). */
export async function endUserSessions(em: EntityManager, userId: string, reason: SessionEnd): Promise<number> {
  return em.nativeUpdate(
    ConsoleSession,
    { user: userId, revokedAt: null },
    { revokedAt: new Date(), revokedReason: reason },
  );
}
