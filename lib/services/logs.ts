/** The request log of a shop: filters by key, route, status class and time. */
import type { EntityManager, FilterQuery, InferEntity } from "@mikro-orm/postgresql";
import { ApiKey, RequestLog } from "../../entities";
import { findPage } from "../db/paging";

export interface LogFilter {
  /** one request, by the id it answered with (X-Request-Id) */
  id?: string;
  keyId?: string;
  route?: string;
  statusClass?: "2xx" | "3xx" | "4xx" | "5xx";
  from?: Date;
  to?: Date;
  limit: number;
  cursor?: string;
}

export async function listRequests(em: EntityManager, shopId: string, logFilter: LogFilter) {
  const cls = logFilter.statusClass ? Number(logFilter.statusClass[0]) * 100 : null;
  const where: FilterQuery<InferEntity<typeof RequestLog>> = {
    shopId,
    ...(logFilter.id ? { id: logFilter.id } : {}),
    ...(logFilter.keyId ? { keyId: logFilter.keyId } : {}),
    ...(logFilter.route ? { route: logFilter.route } : {}),
    ...(cls ? { status: { $gte: cls, $lt: cls + 100 } } : {}),
    ...(logFilter.from || logFilter.to
      ? {
          createdAt: {
            ...(logFilter.from ? { $gte: logFilter.from } : {}),
            ...(logFilter.to ? { $lte: logFilter.to } : {}),
          },
        }
      : {}),
  };
  return findPage(em, RequestLog, where, logFilter, (row) => row);
}

/** One logged request, with the name of the key that made it. */
export async function getRequest(em: EntityManager, shopId: string, id: string) {
  const row = await em.findOne(RequestLog, { id, shopId });
  if (!row) return null;
  const key = row.keyId
    ? await em.findOne(ApiKey, { id: row.keyId, shop: shopId }, { fields: ["id", "name", "prefix"] })
    : null;
  return { ...row, key: key ? { id: key.id, name: key.name, prefix: key.prefix } : null };
}

/** Routes seen in the shop's log, for the filter. */
export async function routesSeen(em: EntityManager, shopId: string): Promise<string[]> {
  const rows = await em
    .getConnection()
    .execute<{ route: string }[]>("select distinct route from request_logs where shop_id = ? order by route", [shopId]);
  return rows.map((r) => r.route);
}
