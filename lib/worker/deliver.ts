/**
 * One delivery attempt per Standard Webhooks: POST `{ type, timestamp, data }` with
 * `webhook-id` (the event id, the same on every retry), `webhook-timestamp` and
 * `webhook-signature` (HMAC-SHA256 by svix; during a secret rotation, one signature per
 * secret). 15 s timeout, redirects not followed, only 2xx counts. Every attempt is logged.
 */

import type { EntityManager } from "@mikro-orm/postgresql";

import { Delivery, DeliveryAttempt, type DeliveryEntity, type WebhookEndpointEntity } from "../../entities";
import { newId } from "../ids";
import { eventPayloads } from "../services/events";

import { delayBefore, disableAfter, MAX_ATTEMPTS, retryAfterMs } from "./schedule";
import { signatures, post, keptHeaders, USER_AGENT } from "./post";

export type AttemptOutcome =
  | { kind: "done"; status: DeliveryEntity["status"] }
  | { kind: "retry"; attempt: number; delayMs: number }
  | { kind: "endpoint-disabled"; endpointId: string; reason: string };

/**
 * Make the next attempt of a pending delivery. The attempt number is claimed first, so two
 * workers that got the same job do not both record it.
 */
interface ClaimedRow {
  attempts: number;
  url: string;
  secret: string;
  previous_secret: string | null;
  previous_secret_expires_at: Date | null;
  consecutive_failures: number;
  event_id: string;
}

/**
 * The body of each event's webhook, kept for the last events sent: an event goes to every
 * subscribed endpoint with the same body, so it is read and serialised once, not once per
 * endpoint. Events never change once written.
 */
const bodies = new Map<string, string>();
const BODIES_KEPT = 2000;

async function bodyOf(em: EntityManager, eventId: string): Promise<string> {
  const kept = bodies.get(eventId);
  if (kept !== undefined) return kept;
  const body = (await eventPayloads(em, [eventId])).get(eventId);
  if (body === undefined) throw new Error(`event ${eventId} is gone`);
  bodies.set(eventId, body);
  if (bodies.size > BODIES_KEPT) bodies.delete(bodies.keys().next().value as string);
  return body;
}

/**
 * Make the next attempt of a pending delivery. The attempt number is claimed first (one
 * UPDATE that also reads the endpoint and event), so two workers that got the same job do
 * not both send it; a success is then recorded in one more statement.
 */
export async function attemptDelivery(
  em: EntityManager,
  deliveryId: string,
  expectedAttempt?: number,
): Promise<AttemptOutcome> {
  const conn = em.getConnection();
  const [row] = await conn.execute<ClaimedRow[]>(
    `update deliveries d set attempts = d.attempts + 1, updated_at = now()
     from webhook_endpoints e
     where d.id = ? and d.status = 'pending' and e.id = d.endpoint_id and e.enabled
       ${expectedAttempt !== undefined ? "and d.attempts = ?" : ""}
     returning d.attempts, e.url, e.secret, e.previous_secret, e.previous_secret_expires_at, e.consecutive_failures, d.event_id`,
    expectedAttempt !== undefined ? [deliveryId, expectedAttempt - 1] : [deliveryId],
  );
  if (!row) return skipOrNothing(em, deliveryId);
  const attempt = row.attempts;

  const sentAt = new Date();
  const payload = await bodyOf(em, row.event_id);
  const endpoint = {
    secret: row.secret,
    previousSecret: row.previous_secret,
    previousSecretExpiresAt: row.previous_secret_expires_at ? new Date(row.previous_secret_expires_at) : null,
  };
  const sent = {
    "webhook-id": row.event_id,
    "webhook-timestamp": String(Math.floor(sentAt.getTime() / 1000)),
    "webhook-signature": signatures(endpoint, row.event_id, sentAt, payload),
  };
  const result = await post(row.url, payload, sent);
  const requestHeaders = JSON.stringify({
    ...sent,
    "content-type": "application/json",
    "content-length": String(Buffer.byteLength(payload)),
    "user-agent": USER_AGENT,
  });
  const responseHeaders = result.status === null ? null : JSON.stringify(keptHeaders(result.headers));
  const ok = result.status !== null && result.status >= 200 && result.status <= 299;

  if (ok) {
    // The common case, in one statement: the attempt row, the delivery, and the endpoint's failure count.
    await conn.execute(
      `with attempt as (
         insert into delivery_attempts (id, delivery_id, attempted_at, request_headers, status_code, response_headers, latency_ms, response_excerpt, error)
         values (?, ?, ?, ?, ?, ?, ?, ?, null)),
       endpoint as (
         update webhook_endpoints set consecutive_failures = 0 where id = (select endpoint_id from deliveries where id = ?) and consecutive_failures <> 0)
       update deliveries set status = 'succeeded', next_attempt_at = null, last_status_code = ?, last_error = null, updated_at = now() where id = ?`,
      [
        newId("attempt"),
        deliveryId,
        sentAt,
        requestHeaders,
        result.status,
        responseHeaders,
        result.latencyMs,
        result.excerpt,
        deliveryId,
        result.status,
        deliveryId,
      ],
    );
    return { kind: "done", status: "succeeded" };
  }

  return em.transactional(async (tx) => {
    const delivery = await tx.findOneOrFail(Delivery, { id: deliveryId }, { populate: ["endpoint"] });
    const ep = delivery.endpoint;
    tx.create(DeliveryAttempt, {
      delivery: delivery,
      attemptedAt: sentAt,
      statusCode: result.status,
      latencyMs: result.latencyMs,
      requestHeaders: JSON.parse(requestHeaders),
      responseHeaders: responseHeaders === null ? null : JSON.parse(responseHeaders),
      responseExcerpt: result.excerpt,
      error: result.error,
    });
    delivery.attempts = attempt;
    delivery.lastStatusCode = result.status;
    delivery.lastError = result.error ?? `HTTP ${result.status}`;
    ep.consecutiveFailures += 1;
    if (result.status === 410) {
      // The receiver says it is gone for good: stop sending to it.
      delivery.status = "failed";
      delivery.nextAttemptAt = null;
      return disable(ep, "the receiver answered 410 Gone");
    }
    if (ep.consecutiveFailures >= disableAfter()) {
      delivery.status = "failed";
      delivery.nextAttemptAt = null;
      return disable(ep, `${ep.consecutiveFailures} failed attempts in a row`);
    }
    const scheduled = delayBefore(attempt + 1);
    if (scheduled === null || attempt >= MAX_ATTEMPTS) {
      delivery.status = "failed";
      delivery.nextAttemptAt = null;
      return { kind: "done", status: "failed" } as const;
    }
    const header = result.headers["retry-after"];
    const asked = retryAfterMs(Array.isArray(header) ? header[0] : (header ?? null));
    const delayMs = Math.max(scheduled, asked ?? 0);
    delivery.nextAttemptAt = new Date(Date.now() + delayMs);
    return { kind: "retry", attempt: attempt + 1, delayMs } as const;
  });
}

/** Nothing was claimed: the delivery is done, already taken, or its endpoint is disabled (then it is skipped). */
async function skipOrNothing(em: EntityManager, deliveryId: string): Promise<AttemptOutcome> {
  const delivery = await em.findOne(Delivery, { id: deliveryId }, { populate: ["endpoint"] });
  if (!delivery) return { kind: "done", status: "skipped" };
  if (delivery.status === "pending" && !delivery.endpoint.enabled) {
    delivery.status = "skipped";
    delivery.lastError = `endpoint disabled: ${delivery.endpoint.disabledReason ?? "disabled"}`;
    delivery.nextAttemptAt = null;
    await em.flush();
    return { kind: "done", status: "skipped" };
  }
  return { kind: "done", status: delivery.status };
}

function disable(ep: WebhookEndpointEntity, reason: string): AttemptOutcome {
  ep.enabled = false;
  ep.disabledReason = reason;
  return { kind: "endpoint-disabled", endpointId: ep.id, reason };
}
