/**
 * The outbox's other half: events not yet fanned out become one delivery per subscribed,
 * enabled endpoint, in one transaction that also marks them dispatched. A sweeper finds
 * pending deliveries whose attempt is overdue (a lost job, a crashed worker) to queue again.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { Delivery, Event, WebhookEndpoint } from "../../entities";
import type { EventType } from "../schemas/enums";

/** Events taken in one round; a full round means more may be waiting. */
export const DISPATCH_BATCH = 200;
const OVERDUE_MS = 10_000;

/**
 * Fan out one round of undispatched events: how many were taken, and the new deliveries' ids. The
 * events are taken and marked in one statement that reads only their id, shop and type: their
 * bodies are read when a delivery is attempted.
 */
export async function dispatchPending(em: EntityManager): Promise<{ taken: number; deliveries: string[] }> {
  return em.transactional(async (tx) => {
    const now = new Date();
    const rows = await tx.execute<{ id: string; shop_id: string; type: EventType }[]>(
      `with taken as (select id from events where dispatched_at is null order by id limit ${DISPATCH_BATCH} for update skip locked)
       update events e set dispatched_at = ? from taken where e.id = taken.id returning e.id, e.shop_id, e.type`,
      [now],
    );
    if (!rows.length) return { taken: 0, deliveries: [] };
    rows.sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
    const shopIds = [...new Set(rows.map((e) => e.shop_id))];
    const endpoints = await tx.find(WebhookEndpoint, { shop: { $in: shopIds }, enabled: true });
    if (!endpoints.length) return { taken: rows.length, deliveries: [] };
    const created: { id: string }[] = [];
    for (const event of rows) {
      if (event.type === "endpoint.test") continue; // test events go only to the endpoint that asked
      for (const ep of endpoints) {
        if (ep.shop.id !== event.shop_id) continue;
        if (ep.eventTypes.length && !ep.eventTypes.includes(event.type)) continue;
        created.push(
          tx.create(Delivery, {
            shop: ep.shop,
            event: tx.getReference(Event, event.id),
            endpoint: ep,
            nextAttemptAt: now,
          }),
        );
      }
    }
    await tx.flush();
    return { taken: rows.length, deliveries: created.map((d) => d.id) }; // ids are assigned at flush
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
