/**
 * Webhook endpoints (secrets shown once, rotation with an overlap), events, deliveries and
 * their attempts, resend and test events. Delivery itself happens in the worker.
 */
import { randomBytes } from "node:crypto";
import type { EntityManager } from "@mikro-orm/postgresql";
import {
  Delivery,
  DeliveryAttempt,
  Event,
  Shop,
  WebhookEndpoint,
  type DeliveryEntity,
  type EventEntity,
  type WebhookEndpointEntity,
} from "../../entities";
import { conflict, invalidRequest, notFound } from "../errors";
import { findPage } from "../db/paging";
import { enqueueAttempt } from "../queue/queue";
import { literalRefusal } from "../network";
import type { DeliveryT, EndpointT } from "../schemas/webhook";
import type { EventType } from "../schemas/enums";
import { recordEvent } from "./events";

export const DEFAULT_OVERLAP_HOURS = 24;

const newSecret = () => `whsec_${randomBytes(24).toString("base64")}`;
const iso = (d: Date | null | undefined) => d?.toISOString() ?? null;

export function viewEndpoint(e: WebhookEndpointEntity, now = new Date()): EndpointT {
  const rotating = e.previousSecret && e.previousSecretExpiresAt && e.previousSecretExpiresAt > now;
  return {
    id: e.id,
    url: e.url,
    description: e.description ?? null,
    eventTypes: e.eventTypes as EventType[],
    enabled: e.enabled,
    disabledReason: e.disabledReason ?? null,
    secretRotation: rotating ? { previousSecretExpiresAt: e.previousSecretExpiresAt!.toISOString() } : null,
    consecutiveFailures: e.consecutiveFailures,
    createdAt: e.createdAt.toISOString(),
    updatedAt: e.updatedAt.toISOString(),
  };
}

/** Refuse, at once, a literal address this install will never send to (names are checked at send time). */
export function checkUrl(url: string) {
  const why = literalRefusal(new URL(url));
  if (why)
    throw invalidRequest(`The URL cannot be used: ${why}.`, [{ location: "body", pointer: "/url", message: why }]);
}

export async function findEndpoint(em: EntityManager, shopId: string, id: string) {
  const e = await em.findOne(WebhookEndpoint, { id, shop: shopId });
  if (!e) throw notFound("webhook endpoint");
  return e;
}

export async function listEndpoints(em: EntityManager, shopId: string, o: { limit: number; cursor?: string }) {
  return findPage(em, WebhookEndpoint, { shop: shopId }, o, (e) => viewEndpoint(e), { order: "asc" });
}

export async function createEndpoint(
  em: EntityManager,
  shopId: string,
  input: { url: string; description?: string; eventTypes?: string[]; enabled?: boolean },
) {
  checkUrl(input.url);
  const secret = newSecret();
  const e = em.create(WebhookEndpoint, {
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
  return { endpoint: viewEndpoint(e), secret };
}

export async function updateEndpoint(
  em: EntityManager,
  shopId: string,
  id: string,
  patch: { url?: string; description?: string; eventTypes?: string[]; enabled?: boolean },
) {
  const e = await findEndpoint(em, shopId, id);
  if (patch.url !== undefined) {
    checkUrl(patch.url);
    e.url = patch.url;
  }
  if (patch.description !== undefined) e.description = patch.description;
  if (patch.eventTypes !== undefined) e.eventTypes = [...new Set(patch.eventTypes)];
  if (patch.enabled !== undefined && patch.enabled !== e.enabled) {
    e.enabled = patch.enabled;
    e.disabledReason = patch.enabled ? null : "disabled by a person";
    if (patch.enabled) e.consecutiveFailures = 0;
  }
  await em.flush();
  return viewEndpoint(e);
}

export async function deleteEndpoint(em: EntityManager, shopId: string, id: string) {
  const e = await findEndpoint(em, shopId, id);
  await em.remove(e).flush();
}

/** A new secret; the previous one keeps signing too until the overlap ends. */
export async function rotateSecret(
  em: EntityManager,
  shopId: string,
  id: string,
  overlapHours = DEFAULT_OVERLAP_HOURS,
) {
  const e = await findEndpoint(em, shopId, id);
  const secret = newSecret();
  e.previousSecret = overlapHours > 0 ? e.secret : null;
  e.previousSecretExpiresAt = overlapHours > 0 ? new Date(Date.now() + overlapHours * 3_600_000) : null;
  e.secret = secret;
  await em.flush();
  return { endpoint: viewEndpoint(e), secret };
}

/** Queue a delivery right away (the worker's sweeper would find it too, a little later). */
async function queueNow(d: DeliveryEntity) {
  await enqueueAttempt(d.id, 1, 0, 2_000).catch((err) =>
    console.error(`[webhooks] queueing ${d.id} failed; the sweeper will:`, err.message),
  );
}

export async function sendTestEvent(em: EntityManager, shopId: string, id: string) {
  const e = await findEndpoint(em, shopId, id);
  if (!e.enabled) throw conflict("The endpoint is disabled; enable it first.", { enabled: false });
  const delivery = await em.transactional(async (tx) => {
    const event = await recordEvent(tx, shopId, "endpoint.test", e.id, {
      endpoint: { id: e.id, url: e.url },
      message: "A test event from Shearwire. If you can read this, your receiver works.",
    });
    event.dispatchedAt = new Date(); // goes to this endpoint only
    const d = tx.create(Delivery, {
      shop: tx.getReference(Shop, shopId),
      event,
      endpoint: tx.getReference(WebhookEndpoint, e.id),
      nextAttemptAt: new Date(),
      manual: true,
    });
    await tx.flush();
    return d;
  });
  await queueNow(delivery);
  return viewDelivery(await findDelivery(em.fork(), shopId, delivery.id));
}

export async function resend(em: EntityManager, shopId: string, eventId: string, endpointId: string) {
  const event = await em.findOne(Event, { id: eventId, shop: shopId });
  if (!event) throw notFound("event");
  const e = await findEndpoint(em, shopId, endpointId);
  if (!e.enabled) throw conflict("The endpoint is disabled; enable it first.", { enabled: false });
  const d = em.create(Delivery, {
    shop: em.getReference(Shop, shopId),
    event,
    endpoint: e,
    nextAttemptAt: new Date(),
    manual: true,
  });
  await em.flush();
  await queueNow(d);
  return viewDelivery(await findDelivery(em.fork(), shopId, d.id));
}

/** Send again every event whose delivery to this endpoint failed (once per event, newest 500). */
export async function resendFailed(em: EntityManager, shopId: string, endpointId: string): Promise<number> {
  const e = await findEndpoint(em, shopId, endpointId);
  if (!e.enabled) throw conflict("The endpoint is disabled; enable it first.", { enabled: false });
  const rows = await em.getConnection().execute<{ event_id: string }[]>(
    `select distinct event_id from deliveries d where d.endpoint_id = ? and d.status = 'failed'
       and not exists (select 1 from deliveries n where n.endpoint_id = d.endpoint_id and n.event_id = d.event_id and n.status in ('pending', 'succeeded'))
     order by event_id desc limit 500`,
    [e.id],
  );
  const created = rows.map((r) =>
    em.create(Delivery, {
      shop: em.getReference(Shop, shopId),
      event: em.getReference(Event, r.event_id),
      endpoint: e,
      nextAttemptAt: new Date(),
      manual: true,
    }),
  );
  await em.flush();
  for (const d of created) await queueNow(d);
  return created.length;
}

// ---------------------------------------------------------------- events and deliveries

export function viewEvent(e: EventEntity) {
  return {
    id: e.id,
    type: e.type as EventType,
    subjectId: e.subjectId,
    data: e.data,
    createdAt: e.createdAt.toISOString(),
  };
}

export async function listEvents(
  em: EntityManager,
  shopId: string,
  o: { limit: number; cursor?: string; type?: string; subject?: string },
) {
  const where = { shop: shopId, ...(o.type ? { type: o.type } : {}), ...(o.subject ? { subjectId: o.subject } : {}) };
  return findPage(em, Event, where, o, viewEvent);
}

export async function getEvent(em: EntityManager, shopId: string, id: string) {
  const e = await em.findOne(Event, { id, shop: shopId });
  if (!e) throw notFound("event");
  return viewEvent(e);
}

async function findDelivery(em: EntityManager, shopId: string, id: string) {
  const d = await em.findOne(Delivery, { id, shop: shopId }, { populate: ["event"] });
  if (!d) throw notFound("delivery");
  return d;
}

async function attemptsOf(em: EntityManager, ids: string[]) {
  const attempts = ids.length
    ? await em.find(DeliveryAttempt, { delivery: { $in: ids } }, { orderBy: { id: "asc" } })
    : [];
  const by = new Map<string, typeof attempts>();
  for (const a of attempts) by.set(a.delivery.id, [...(by.get(a.delivery.id) ?? []), a]);
  return by;
}

type AttemptRow = {
  id: string;
  attemptedAt: Date;
  statusCode?: number | null;
  latencyMs: number;
  responseExcerpt?: string | null;
  error?: string | null;
  requestHeaders?: Record<string, string> | null;
  responseHeaders?: Record<string, string> | null;
};

export function viewDelivery(d: DeliveryEntity, attempts: AttemptRow[] = []): DeliveryT {
  return {
    id: d.id,
    eventId: d.event.id,
    eventType: d.event.type as EventType,
    endpointId: d.endpoint.id,
    status: d.status,
    attempts: d.attempts,
    nextAttemptAt: iso(d.nextAttemptAt),
    lastStatusCode: d.lastStatusCode ?? null,
    lastError: d.lastError ?? null,
    manual: d.manual,
    attemptLog: attempts.map((a) => ({
      id: a.id,
      attemptedAt: a.attemptedAt.toISOString(),
      requestHeaders: a.requestHeaders ?? null,
      statusCode: a.statusCode ?? null,
      responseHeaders: a.responseHeaders ?? null,
      latencyMs: a.latencyMs,
      responseExcerpt: a.responseExcerpt ?? null,
      error: a.error ?? null,
    })),
    createdAt: d.createdAt.toISOString(),
    updatedAt: d.updatedAt.toISOString(),
  };
}

export async function listDeliveries(
  em: EntityManager,
  shopId: string,
  by: { event?: string; endpoint?: string },
  o: { limit: number; cursor?: string; status?: DeliveryEntity["status"]; eventType?: string },
) {
  if (by.event) await getEvent(em, shopId, by.event);
  if (by.endpoint) await findEndpoint(em, shopId, by.endpoint);
  const where = {
    shop: shopId,
    ...(by.event ? { event: by.event } : {}),
    ...(by.endpoint ? { endpoint: by.endpoint } : {}),
    ...(o.status ? { status: o.status } : {}),
    ...(o.eventType ? { event: { type: o.eventType } } : {}),
  };
  const page = await findPage(em, Delivery, where, o, (d) => d, { populate: ["event"] });
  const attempts = await attemptsOf(
    em,
    page.data.map((d) => d.id),
  );
  return { data: page.data.map((d) => viewDelivery(d, attempts.get(d.id))), next_cursor: page.next_cursor };
}
