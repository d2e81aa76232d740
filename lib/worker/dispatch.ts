/**
 * The outbox's other half: events not yet fanned out become one delivery per subscribed,
 * enabled endpoint, in one statement that also marks them dispatched. A sweeper finds
 * pending deliveries whose attempt is overdue (a lost job, a crashed worker) to queue again.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { runPrepared } from "../db/prepared";
import { ID_PREFIXES } from "../ids";

const DELIVERY_PREFIX = ID_PREFIXES.delivery;

/** Events taken in one round; a full round means more may be waiting. */
export const DISPATCH_BATCH = 200;
const OVERDUE_MS = 10_000;

/**
 * Fan out one round of undispatched events: how many were taken, and the new deliveries' ids. One
 * statement (so one transaction, with no round trips to open and close it) takes and marks the
 * events, reading only their id, shop and type (bodies are read when a delivery is attempted), and
 * writes a delivery for each subscribed, enabled endpoint of their shops: an event is marked only
 * with its deliveries. A fanned-out delivery's id is a ULID made in the statement: the event's time,
 * then 64 bits of the MD5 of the event and endpoint ids (hex digits are base-32 digits too), so it
 * sorts with its event and differs for every pair.
 */
export async function dispatchPending(em: EntityManager): Promise<{ taken: number; deliveries: string[] }> {
  const now = new Date();
  const [round] = await runPrepared<{ taken: number; deliveries: string[] }>(
    em,
    "dispatch-round",
    `with taken as (select id from events where dispatched_at is null order by id limit ${DISPATCH_BATCH} for update skip locked),
     marked as (update events e set dispatched_at = ? from taken where e.id = taken.id returning e.id, e.shop_id, e.type),
     made as (
       insert into deliveries (id, shop_id, event_id, endpoint_id, status, attempts, next_attempt_at, manual, created_at, updated_at)
       select '${DELIVERY_PREFIX}_' || substr(split_part(m.id, '_', 2), 1, 10) || upper(substr(md5(m.id || ' ' || w.id), 1, 16)),
              m.shop_id, m.id, w.id, 'pending', 0, ?, false, ?, ?
       from marked m join webhook_endpoints w on w.shop_id = m.shop_id and w.enabled
         and m.type <> 'endpoint.test' -- test events go only to the endpoint that asked
         and (jsonb_array_length(w.event_types) = 0 or w.event_types @> jsonb_build_array(m.type))
       returning id)
     select (select count(*) from marked)::int as taken, coalesce((select json_agg(id order by id) from made), '[]') as deliveries`,
    [now, now, now, now],
  );
  return round;
}

/**
 * Fan out round after round until a round takes less than a full batch of events (so a burst of
 * events that make few deliveries, e.g. a shop without endpoints, is not left for the next wake-up);
 * each round's deliveries go to `onDeliveries` as soon as they are written. Returns the events taken.
 */
export async function dispatchAll(fork: () => EntityManager, onDeliveries: (ids: string[]) => void): Promise<number> {
  let taken = 0;
  for (;;) {
    const round = await dispatchPending(fork());
    taken += round.taken;
    if (round.deliveries.length) onDeliveries(round.deliveries);
    if (round.taken < DISPATCH_BATCH) return taken;
  }
}

/** Pending deliveries whose next attempt is overdue: their job was lost; queue them again. */
export async function overdueDeliveries(em: EntityManager): Promise<{ id: string; attempt: number }[]> {
  const rows = await em
    .getConnection()
    .execute<{ id: string; attempts: number }[]>(
      `select id, attempts from deliveries where status = 'pending' and next_attempt_at < ? order by next_attempt_at limit 500`,
      [new Date(Date.now() - OVERDUE_MS)],
    );
  return rows.map((r) => ({ id: r.id, attempt: r.attempts + 1 }));
}
