/**
 * Cursor pagination over ids. Ids are ULID-based, so ordering by id is ordering by
 * creation; the cursor is the last id of the page, wrapped so clients treat it as opaque.
 */
import type { AutoPath, EntityManager, EntityName, FilterQuery, Loaded, OrderDefinition } from "@mikro-orm/postgresql";
import { badRequest } from "../errors";

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

/** What a list is asked for: how many, and from where. */
export interface PageQuery {
  limit: number;
  cursor?: string;
}

/**
 * One page of rows in id order (`desc`: newest first, the default), and the cursor of the next:
 * the cursor decoded and checked, one row more than asked fetched to know whether more exist,
 * each row shown with `view`. The one way lists page.
 */
export async function findPage<E extends { id: string }, V, P extends string = never>(
  em: EntityManager,
  entity: EntityName<E>,
  where: FilterQuery<E>,
  query: PageQuery,
  view: (row: Loaded<E, P>) => V,
  options: { order?: "asc" | "desc"; populate?: readonly AutoPath<E, P>[] } = {},
): Promise<{ data: V[]; next_cursor: string | null }> {
  const order = options.order ?? "desc";
  const from = decodeCursor(query.cursor);
  const after = from ? { id: order === "desc" ? { $lt: from } : { $gt: from } } : {};
  const rows = (await em.find(entity, { $and: [where, after] } as FilterQuery<E>, {
    orderBy: { id: order } as OrderDefinition<E>,
    limit: query.limit + 1,
    populate: options.populate as never,
  })) as Loaded<E, P>[];
  const { data, next_cursor } = page(rows, query.limit);
  return { data: data.map(view), next_cursor };
}

/** `text` as a LIKE pattern that matches it literally anywhere. */
export function containing(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
