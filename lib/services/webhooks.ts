/**
 * Webhook endpoints (secrets shown once, rotation with an overlap), events, deliveries and
 * their attempts, resend and test events. Delivery itself happens in the worker.
 */
import { randomBytes } from "node:crypto";
import type { EntityManager } from "@mikro-orm/postgresql";
import { Delivery, DeliveryAttempt, Event, Shop, WebhookEndpoint, type DeliveryEntity } from "../../entities";
import { conflict, invalidRequest, notFound } from "../errors";
import { findPage } from "../db/paging";
import { enqueueAttempt } from "../queue/queue";
import { literalRefusal } from "../network";
import type { EndpointT } from "../schemas/webhook";
import type { EventType } from "../schemas/enums";
import { recordEvent } from "./events";
import { borrowedBodies } from "./event-bodies";
import { viewDelivery, viewEndpoint, viewEvent } from "./webhook-views";

export const DEFAULT_OVERLAP_HOURS = 24;

const newSecret = () => `whsec_${randomBytes(24).toString("base64")}`;

export function checkUrl(url: string) {
  const why = literalRefusal(new URL(url));
  if (why)
    throw invalidRequest(`The URL cannot be used: ${why}.`, [{ location: "body", pointer: "/url", message: why }]);
}

export async function findEndpoint(em: EntityManager, shopId: string, id: string) {
  const endpoint = await em.findOne(WebhookEndpoint, { id, shop: shopId });
  if (!endpoint) throw notFound("webhook endpoint");
  return endpoint;
}

export async function getEndpoint(em: EntityManager, shopId: string, id: string): Promise<EndpointT> {
  return viewEndpoint(await findEndpoint(em, shopId, id));
}

export async function listEndpoints(em: EntityManager, shopId: string, options: { limit: number; cursor?: string }) {
  return findPage(em, WebhookEndpoint, { shop: shopId }, options, (e) => viewEndpoint(e), { order: "asc" });
}

export async function createEndpoint(
  em: EntityManager,
  shopId: string,
  input: { url: string; description?: string; eventTypes?: EventType[]; enabled?: boolean },
) {
  checkUrl(input.url);
  const secret = newSecret();
  const endpoint = em.create(WebhookEndpoint, {
    shop: em.getReference(Shop, shopId),
    url: input.url,
    description: input.description ?? null,
    eventTypes: [...new Set(input.eventTypes ?? [])],
    enabled: input.enabled ?? true,
    secret,
    disabledReason: input.enabled === false ? "disabled when created" : null,
    previousSecret: null,
  });
  await em.flush();
  return { endpoint: viewEndpoint(endpoint), secret };
}

export async function updateEndpoint(
  em: EntityManager,
  shopId: string,
  id: string,
  patch: { url?: string; description?: string; eventTypes?: EventType[]; enabled?: boolean },
) {
  const endpoint = await findEndpoint(em, shopId, id);
  if (patch.url !== undefined) {
    checkUrl(patch.url);
    endpoint.url = patch.url;
  }
  if (patch.description !== undefined) endpoint.description = patch.description;
  if (patch.eventTypes !== undefined) endpoint.eventTypes = [...new Set(patch.eventTypes)];
  if (patch.enabled !== undefined && patch.enabled !== endpoint.enabled) {
    endpoint.enabled = patch.enabled;
    endpoint.disabledReason = patch.enabled ? null : "disabled by a person";
    if (patch.enabled) endpoint.consecutiveFailures = 0;
  }
  await em.flush();
  return viewEndpoint(endpoint);
}

export async function deleteEndpoint(em: EntityManager, shopId: string, id: string) {
  const endpoint = await findEndpoint(em, shopId, id);
  await em.remove(endpoint).flush();
}

/** A new secret; the previous one keeps signing too until the overlap ends. */
export async function rotateSecret(
  em: EntityManager,
  shopId: string,
  id: string,
  overlapHours = DEFAULT_OVERLAP_HOURS,
) {
  const endpoint = await findEndpoint(em, shopId, id);
  const secret = newSecret();
  endpoint.previousSecret = overlapHours > 0 ? endpoint.secret : null;
  endpoint.previousSecretExpiresAt = overlapHours > 0 ? new Date(Date.now() + overlapHours * 3_600_000) : null;
  endpoint.secret = secret;
  await em.flush();
  return { endpoint: viewEndpoint(endpoint), secret };
}

/** Queue a delivery right away (the worker's sweeper would find it too, a little later). */
async function queueNow(delivery: DeliveryEntity) {
  await enqueueAttempt(delivery.id, 1, 0, 2_000).catch((err) =>
    console.error(`[webhooks] queueing ${delivery.id} failed; the sweeper will:`, err.message),
  );
}

export async function sendTestEvent(em: EntityManager, shopId: string, id: string) {
  const endpoint = await findEndpoint(em, shopId, id);
  if (!endpoint.enabled) throw conflict("The endpoint is disabled; enable it first.", { enabled: false });
  const delivery = await em.transactional(async (tx) => {
    const event = await recordEvent(tx, shopId, "endpoint.test", endpoint.id, {
      endpoint: { id: endpoint.id, url: endpoint.url },
      message: "A test event from Shearwire. If you can read this, your receiver works.",
    });
    event.dispatchedAt = new Date(); // goes to this endpoint only
    const created = tx.create(Delivery, {
      shop: tx.getReference(Shop, shopId),
      event,
      endpoint: tx.getReference(WebhookEndpoint, endpoint.id),
      nextAttemptAt: new Date(),
      manual: true,
    });
    await tx.flush();
    return created;
  });
  await queueNow(delivery);
  return viewDelivery(await findDelivery(em.fork(), shopId, delivery.id));
}

export async function resend(em: EntityManager, shopId: string, eventId: string, endpointId: string) {
  const event = await em.findOne(Event, { id: eventId, shop: shopId });
  if (!event) throw notFound("event");
  const endpoint = await findEndpoint(em, shopId, endpointId);
  if (!endpoint.enabled) throw conflict("The endpoint is disabled; enable it first.", { enabled: false });
  const delivery = em.create(Delivery, {
    shop: em.getReference(Shop, shopId),
    event,
    endpoint: endpoint,
    nextAttemptAt: new Date(),
    manual: true,
  });
  await em.flush();
  await queueNow(delivery);
  return viewDelivery(await findDelivery(em.fork(), shopId, delivery.id));
}

/** Send again every event whose delivery to this endpoint failed (once per event, newest 500). */
export async function resendFailed(em: EntityManager, shopId: string, endpointId: string): Promise<number> {
  const endpoint = await findEndpoint(em, shopId, endpointId);
  if (!endpoint.enabled) throw conflict("The endpoint is disabled; enable it first.", { enabled: false });
  const rows = await em.getConnection().execute<{ event_id: string }[]>(
    `select distinct event_id from deliveries d where d.endpoint_id = ? and d.status = 'failed'
       and not exists (select 1 from deliveries n where n.endpoint_id = d.endpoint_id and n.event_id = d.event_id and n.status in ('pending', 'succeeded'))
     order by event_id desc limit 500`,
    [endpoint.id],
  );
  const created = rows.map((row) =>
    em.create(Delivery, {
      shop: em.getReference(Shop, shopId),
      event: em.getReference(Event, row.event_id),
      endpoint: endpoint,
      nextAttemptAt: new Date(),
      manual: true,
    }),
  );
  await em.flush();
  for (const d of created) await queueNow(d);
  return created.length;
}

// ---------------------------------------------------------------- events and deliveries

export async function listEvents(
  em: EntityManager,
  shopId: string,
  options: { limit: number; cursor?: string; type?: EventType; subject?: string },
) {
  const where = {
    shop: shopId,
    ...(options.type ? { type: options.type } : {}),
    ...(options.subject ? { subjectId: options.subject } : {}),
  };
  const page = await findPage(em, Event, where, options, (stored) => stored);
  const whole = await borrowedBodies(em, page.data);
  return { data: page.data.map((stored) => viewEvent(stored, whole.get(stored.id))), next_cursor: page.next_cursor };
}

export async function getEvent(em: EntityManager, shopId: string, id: string) {
  const stored = await em.findOne(Event, { id, shop: shopId });
  if (!stored) throw notFound("event");
  const whole = await borrowedBodies(em, [stored]);
  return viewEvent(stored, whole.get(stored.id));
}

async function findDelivery(em: EntityManager, shopId: string, id: string) {
  const delivery = await em.findOne(Delivery, { id, shop: shopId }, { populate: ["event"] });
  if (!delivery) throw notFound("delivery");
  return delivery;
}

async function attemptsOf(em: EntityManager, ids: string[]) {
  const attempts = ids.length
    ? await em.find(DeliveryAttempt, { delivery: { $in: ids } }, { orderBy: { id: "asc" } })
    : [];
  const by = new Map<string, typeof attempts>();
  for (const a of attempts) by.set(a.delivery.id, [...(by.get(a.delivery.id) ?? []), a]);
  return by;
}

export async function listDeliveries(
  em: EntityManager,
  shopId: string,
  by: { event?: string; endpoint?: string },
  options: { limit: number; cursor?: string; status?: DeliveryEntity["status"]; eventType?: EventType },
) {
  if (by.event) await getEvent(em, shopId, by.event);
  if (by.endpoint) await findEndpoint(em, shopId, by.endpoint);
  const where = {
    shop: shopId,
    ...(by.event ? { event: by.event } : {}),
    ...(by.endpoint ? { endpoint: by.endpoint } : {}),
    ...(options.status ? { status: options.status } : {}),
    ...(options.eventType ? { event: { type: options.eventType } } : {}),
  };
  const page = await findPage(em, Delivery, where, options, (d) => d, { populate: ["event"] });
  const attempts = await attemptsOf(
    em,
    page.data.map((d) => d.id),
  );
  return { data: page.data.map((d) => viewDelivery(d, attempts.get(d.id))), next_cursor: page.next_cursor };
}
