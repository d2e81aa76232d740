/**
 * Cursor pagination over ids. Ids are ULID-based, so ordering by id is ordering by
 * creation; the cursor is the last id of the page, wrapped so clients treat it as opaque.
 */
import { badRequest } from "./errors";

export function encodeCursor(lastId: string): string {
  return Buffer.from(JSON.stringify({ after: lastId })).toString("base64url");
}

export function decodeCursor(cursor: string | undefined): string | null {
  if (!cursor) return null;
  try {
    const value = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8"));
    // Only an id of ours (a short prefix and a ULID) can come back: nothing else reaches the database.
    if (typeof value?.after === "string" && /^[a-z]{2,5}_[0-9A-HJKMNP-TV-Z]{26}$/.test(value.after)) return value.after;
  } catch {
    /* fall through */
  }
  throw badRequest("The cursor is not one this API gave out; start again without it.");
}

/** Fetch one more than asked to know whether another page exists. */
export function page<T extends { id: string }>(rows: T[], limit: number) {
  const more = rows.length > limit;
  const data = more ? rows.slice(0, limit) : rows;
  return { data, next_cursor: more ? encodeCursor(data[data.length - 1].id) : null };
}
