/** How the API shows webhook endpoints, events and deliveries (with each delivery's attempts). */
import type { DeliveryEntity, EventEntity, WebhookEndpointEntity } from "../../entities";
import type { DeliveryT, EndpointT } from "../schemas/webhook";

const iso = (d: Date | null | undefined) => d?.toISOString() ?? null;

export function viewEndpoint(endpoint: WebhookEndpointEntity, now = new Date()): EndpointT {
  const rotating =
    endpoint.previousSecret && endpoint.previousSecretExpiresAt && endpoint.previousSecretExpiresAt > now;
  return {
    id: endpoint.id,
    url: endpoint.url,
    description: endpoint.description ?? null,
    eventTypes: endpoint.eventTypes,
    enabled: endpoint.enabled,
    disabledReason: endpoint.disabledReason ?? null,
    secretRotation: rotating ? { previousSecretExpiresAt: endpoint.previousSecretExpiresAt!.toISOString() } : null,
    consecutiveFailures: endpoint.consecutiveFailures,
    createdAt: endpoint.createdAt.toISOString(),
    updatedAt: endpoint.updatedAt.toISOString(),
  };
}

/** Refuse, at once, a literal address this install will never send to (names are checked at send time). */
/** An event as the API shows it; `data` is its whole body (`borrowedBodies` in `./event-bodies`) when it borrows a check. */
export function viewEvent(stored: EventEntity, data: Record<string, unknown> = stored.data) {
  return {
    id: stored.id,
    type: stored.type,
    subjectId: stored.subjectId,
    data,
    createdAt: stored.createdAt.toISOString(),
  };
}

export type AttemptRow = {
  id: string;
  attemptedAt: Date;
  statusCode?: number | null;
  latencyMs: number;
  responseExcerpt?: string | null;
  error?: string | null;
  requestHeaders?: Record<string, string> | null;
  responseHeaders?: Record<string, string> | null;
};

export function viewDelivery(delivery: DeliveryEntity, attempts: AttemptRow[] = []): DeliveryT {
  return {
    id: delivery.id,
    eventId: delivery.event.id,
    eventType: delivery.event.type,
    endpointId: delivery.endpoint.id,
    status: delivery.status,
    attempts: delivery.attempts,
    nextAttemptAt: iso(delivery.nextAttemptAt),
    lastStatusCode: delivery.lastStatusCode ?? null,
    lastError: delivery.lastError ?? null,
    manual: delivery.manual,
    attemptLog: attempts.map((attempt) => ({
      id: attempt.id,
      attemptedAt: attempt.attemptedAt.toISOString(),
      requestHeaders: attempt.requestHeaders ?? null,
      statusCode: attempt.statusCode ?? null,
      responseHeaders: attempt.responseHeaders ?? null,
      latencyMs: attempt.latencyMs,
      responseExcerpt: attempt.responseExcerpt ?? null,
      error: attempt.error ?? null,
    })),
    createdAt: delivery.createdAt.toISOString(),
    updatedAt: delivery.updatedAt.toISOString(),
  };
}
