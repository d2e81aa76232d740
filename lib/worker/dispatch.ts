/**
 * The outbox's other half: events not yet fanned out become one delivery per subscribed,
 * enabled endpoint, in one transaction that also marks them dispatched. A sweeper finds
 * pending deliveries whose attempt is overdue (a lost job, a crashed worker) to queue again.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { rawTransaction } from "../db/prepared";
import { newId } from "../ids";
import { subscribesSql } from "../services/events";

/** Events taken in one round; a full round means more may be waiting. */
export const DISPATCH_BATCH = 200;
const OVERDUE_MS = 10_000;

/**
 * Take and mark a round of waiting events (`$1`: when), each paired with its shop's subscribed,
 * enabled endpoints. The waiting events are read through their own partial index
 * (`events_pending_index`), so a round never walks the events already fanned out.
 */
export const TAKE = `with taken as (select id from events where dispatched_at is null order by id limit ${DISPATCH_BATCH} for update skip locked),
  marked as (update events e set dispatched_at = $1 from taken where e.id = taken.id returning e.id, e.shop_id, e.type)
  select m.id, m.shop_id, w.id as endpoint_id
  from marked m left join webhook_endpoints w on w.shop_id = m.shop_id and ${subscribesSql("w", "m.type")}
  order by m.id, w.id`;

/**
 * Fan out one round of undispatched events: how many were taken, and the new deliveries' ids. One
 * statement takes and marks the events (reading only their id, shop and type: their bodies are read
 * when a delivery is attempted) and pairs them with their shops' subscribed, enabled endpoints; one
 * more writes the deliveries, in the same transaction, so an event is marked only with its deliveries.
 * Rounds run many times a second under a stream of changes, so the transaction is a raw one on a
 * pooled connection (`rawTransaction`), not MikroORM's.
 */
export async function dispatchPending(em: EntityManager): Promise<{ taken: number; deliveries: string[] }> {
  return rawTransaction(em, async (query) => {
    const now = new Date();
    const pairs = await query<{ id: string; shop_id: string; endpoint_id: string | null }>("dispatch-take", TAKE, [
      now,
    ]);
    const taken = new Set(pairs.map((pair) => pair.id)).size;
    const made = pairs.filter((pair) => pair.endpoint_id !== null);
    if (!made.length) return { taken, deliveries: [] };
    const rows = made.map((pair) => ({
      id: newId("delivery"),
      shop_id: pair.shop_id,
      event_id: pair.id,
      endpoint_id: pair.endpoint_id,
    }));
    await query(
      "dispatch-deliveries",
      `insert into deliveries (id, shop_id, event_id, endpoint_id, status, attempts, next_attempt_at, manual, created_at, updated_at)
       select id, shop_id, event_id, endpoint_id, 'pending', 0, $1, false, $1, $1
       from json_to_recordset($2::json) as d(id text, shop_id text, event_id text, endpoint_id text)`,
      [now, JSON.stringify(rows)],
    );
    return { taken, deliveries: rows.map((row) => row.id) };
  });
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
