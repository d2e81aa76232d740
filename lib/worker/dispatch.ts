/**
 * The outbox's other half: events not yet fanned out become one delivery per subscribed,
 * enabled endpoint, in one transaction that also marks them dispatched. A sweeper finds
 * pending deliveries whose attempt is overdue (a lost job, a crashed worker) to queue again.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { Delivery, Event, WebhookEndpoint } from "../../entities";

const BATCH = 200;
const OVERDUE_MS = 10_000;

/** Fan out undispatched events; returns the new deliveries' ids. */
export async function dispatchPending(em: EntityManager): Promise<string[]> {
  return em.transactional(async (tx) => {
    const rows = await tx.execute<{ id: string }[]>(
      `select id from events where dispatched_at is null order by id limit ${BATCH} for update skip locked`,
    );
    if (!rows.length) return [];
    const events = await tx.find(Event, { id: { $in: rows.map((r) => r.id) } }, { orderBy: { id: "asc" } });
    const shopIds = [...new Set(events.map((e) => e.shop.id))];
    const endpoints = await tx.find(WebhookEndpoint, { shop: { $in: shopIds }, enabled: true });
    const created: { id: string }[] = [];
    const now = new Date();
    for (const event of events) {
      event.dispatchedAt = now;
      if (event.type === "endpoint.test") continue; // test events go only to the endpoint that asked
      for (const ep of endpoints) {
        if (ep.shop.id !== event.shop.id) continue;
        if (ep.eventTypes.length && !ep.eventTypes.includes(event.type)) continue;
        created.push(tx.create(Delivery, { shop: event.shop, event, endpoint: ep, nextAttemptAt: now }));
      }
    }
    await tx.flush();
    return created.map((d) => d.id); // ids are assigned at flush
  });
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
