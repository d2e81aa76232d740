/**
 * One delivery attempt per Standard Webhooks: POST `{ type, timestamp, data }` with
 * `webhook-id` (the event id, the same on every retry), `webhook-timestamp` and
 * `webhook-signature` (HMAC-SHA256 by svix; during a secret rotation, one signature per
 * secret). 15 s timeout, redirects not followed, only 2xx counts. Every attempt is logged.
 */
import http from "node:http";
import https from "node:https";
import type { EntityManager } from "@mikro-orm/postgresql";
import { Webhook } from "svix";
import { Delivery, DeliveryAttempt, type DeliveryEntity, type WebhookEndpointEntity } from "../../entities";
import { resolveReceiver } from "./ssrf";
import { delayBefore, disableAfter, MAX_ATTEMPTS, retryAfterMs } from "./schedule";

export const TIMEOUT_MS = 15_000;
const EXCERPT_CHARS = 500;
const USER_AGENT = "Shearwire-Webhooks/1";

export interface HttpResult {
  status: number | null;
  headers: Record<string, string | string[] | undefined>;
  excerpt: string | null;
  error: string | null;
  latencyMs: number;
}

/** Sign a payload with every secret that is currently valid for the endpoint. */
export function signatures(endpoint: Pick<WebhookEndpointEntity, "secret" | "previousSecret" | "previousSecretExpiresAt">, id: string, at: Date, payload: string, now = new Date()): string {
  const secrets = [endpoint.secret];
  if (endpoint.previousSecret && endpoint.previousSecretExpiresAt && endpoint.previousSecretExpiresAt > now) secrets.push(endpoint.previousSecret);
  return secrets.map((s) => new Webhook(s).sign(id, at, payload)).join(" ");
}

/** POST to the receiver at the address that passed the address check. */
export async function post(urlText: string, body: string, headers: Record<string, string>): Promise<HttpResult> {
  const started = performance.now();
  const done = (r: Omit<HttpResult, "latencyMs">): HttpResult => ({ ...r, latencyMs: Math.round((performance.now() - started) * 10) / 10 });
  let url: URL;
  let target: { address: string; family: 4 | 6 };
  try {
    url = new URL(urlText);
    target = await resolveReceiver(url);
  } catch (err) {
    return done({ status: null, headers: {}, excerpt: null, error: (err as Error).message });
  }
  const client = url.protocol === "https:" ? https : http;
  return new Promise((resolve) => {
    const req = client.request(url, {
      method: "POST",
      headers: { ...headers, "content-type": "application/json", "content-length": Buffer.byteLength(body), "user-agent": USER_AGENT },
      lookup: (_host, _opts, cb) => (cb as (e: null, a: string, f: number) => void)(null, target.address, target.family),
      timeout: TIMEOUT_MS,
    });
    const timer = setTimeout(() => req.destroy(new Error(`no answer within ${TIMEOUT_MS / 1000} s`)), TIMEOUT_MS);
    req.on("timeout", () => req.destroy(new Error(`no answer within ${TIMEOUT_MS / 1000} s`)));
    req.on("error", (err) => {
      clearTimeout(timer);
      resolve(done({ status: null, headers: {}, excerpt: null, error: err.message }));
    });
    req.on("response", (res) => {
      let text = "";
      res.setEncoding("utf8");
      res.on("data", (chunk: string) => {
        if (text.length < EXCERPT_CHARS) text += chunk;
      });
      const finish = () => {
        clearTimeout(timer);
        resolve(done({ status: res.statusCode ?? null, headers: res.headers, excerpt: text.slice(0, EXCERPT_CHARS) || null, error: null }));
      };
      res.on("end", finish);
      res.on("error", finish);
    });
    req.end(body);
  });
}

export type AttemptOutcome =
  | { kind: "done"; status: DeliveryEntity["status"] }
  | { kind: "retry"; attempt: number; delayMs: number }
  | { kind: "endpoint-disabled"; endpointId: string; reason: string };

/**
 * Make the next attempt of a pending delivery. The attempt number is claimed first, so two
 * workers that got the same job do not both record it.
 */
export async function attemptDelivery(em: EntityManager, deliveryId: string, expectedAttempt?: number): Promise<AttemptOutcome> {
  const delivery = await em.findOne(Delivery, { id: deliveryId }, { populate: ["endpoint", "event"] });
  if (!delivery || delivery.status !== "pending") return { kind: "done", status: delivery?.status ?? "skipped" };
  if (expectedAttempt !== undefined && delivery.attempts + 1 !== expectedAttempt) return { kind: "done", status: delivery.status };
  const endpoint = delivery.endpoint;
  if (!endpoint.enabled) {
    delivery.status = "skipped";
    delivery.lastError = `endpoint disabled: ${endpoint.disabledReason ?? "disabled"}`;
    delivery.nextAttemptAt = null;
    await em.flush();
    return { kind: "done", status: "skipped" };
  }
  const attempt = delivery.attempts + 1;
  const claimed = await em.nativeUpdate(Delivery, { id: deliveryId, attempts: delivery.attempts, status: "pending" }, { attempts: attempt });
  if (claimed === 0) return { kind: "done", status: delivery.status };

  const event = delivery.event;
  const sentAt = new Date();
  const payload = JSON.stringify({ type: event.type, timestamp: event.createdAt.toISOString(), data: event.data });
  const result = await post(endpoint.url, payload, {
    "webhook-id": event.id,
    "webhook-timestamp": String(Math.floor(sentAt.getTime() / 1000)),
    "webhook-signature": signatures(endpoint, event.id, sentAt, payload),
  });

  return em.transactional(async (tx) => {
    const d = await tx.findOneOrFail(Delivery, { id: deliveryId }, { populate: ["endpoint"] });
    const ep = d.endpoint;
    tx.create(DeliveryAttempt, {
      delivery: d, attemptedAt: sentAt, statusCode: result.status, latencyMs: result.latencyMs,
      responseExcerpt: result.excerpt, error: result.error,
    });
    d.attempts = attempt;
    d.lastStatusCode = result.status;
    d.lastError = result.error ?? (result.status !== null && (result.status < 200 || result.status > 299) ? `HTTP ${result.status}` : null);
    const ok = result.status !== null && result.status >= 200 && result.status <= 299;
    if (ok) {
      d.status = "succeeded";
      d.nextAttemptAt = null;
      ep.consecutiveFailures = 0;
      return { kind: "done", status: "succeeded" } as const;
    }
    ep.consecutiveFailures += 1;
    if (result.status === 410) {
      // The receiver says it is gone for good: stop sending to it.
      d.status = "failed";
      d.nextAttemptAt = null;
      return disable(ep, "the receiver answered 410 Gone");
    }
    if (ep.consecutiveFailures >= disableAfter()) {
      d.status = "failed";
      d.nextAttemptAt = null;
      return disable(ep, `${ep.consecutiveFailures} failed attempts in a row`);
    }
    const scheduled = delayBefore(attempt + 1);
    if (scheduled === null || attempt >= MAX_ATTEMPTS) {
      d.status = "failed";
      d.nextAttemptAt = null;
      return { kind: "done", status: "failed" } as const;
    }
    const header = result.headers["retry-after"];
    const asked = retryAfterMs(Array.isArray(header) ? header[0] : (header ?? null));
    const delayMs = Math.max(scheduled, asked ?? 0);
    d.nextAttemptAt = new Date(Date.now() + delayMs);
    return { kind: "retry", attempt: attempt + 1, delayMs } as const;
  });
}

function disable(ep: WebhookEndpointEntity, reason: string): AttemptOutcome {
  ep.enabled = false;
  ep.disabledReason = reason;
  return { kind: "endpoint-disabled", endpointId: ep.id, reason };
}
