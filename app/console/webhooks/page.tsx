import Link from "next/link";
import { EndpointButtons, NewEndpointForm } from "@/components/console/WebhookForms";
import { Badge, PageHeader, when } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { EVENT_TYPES, EVENT_TYPE_WORDS } from "@/lib/schemas/enums";
import { listDeliveries, listEndpoints } from "@/lib/services/webhooks";

export const metadata = { title: "Webhooks" };

export default async function Webhooks() {
  const member = await currentMember();
  const em = await requestEm();
  const endpoints = await listEndpoints(em, member.shopId, { limit: 100 });
  const manage = can(member.role, "webhooks:manage");
  const test = can(member.role, "webhooks:test");
  const recent = await Promise.all(
    endpoints.data.map((e) => listDeliveries(em, member.shopId, { endpoint: e.id }, { limit: 5 })),
  );
  return (
    <>
      <PageHeader
        title="Webhooks"
        lead="Where Shearwire sends events, signed per Standard Webhooks, retried for a day, every attempt logged."
      />
      <div className="grid gap-6 xl:grid-cols-[1fr_24rem]">
        <div className="space-y-4">
          {endpoints.data.length === 0 && (
            <div className="rounded-md border border-dashed border-scale-300 p-6 text-sm text-ink-muted">
              <p className="font-medium text-ink">No endpoints yet.</p>
              <p className="mt-1">
                Add the URL of the system that should hear about programs and plans (your ERP, say) with the form; then
                send it a test event and verify the signature with the secret it is given. The API reference shows how.
              </p>
            </div>
          )}
          {endpoints.data.map((endpoint, index) => (
            <section
              key={endpoint.id}
              className="rounded-md border border-scale-200 bg-white p-4"
              data-testid="endpoint"
            >
              <div className="flex flex-wrap items-start justify-between gap-2">
                <div className="min-w-0">
                  <p className="break-all font-mono text-sm">{endpoint.url}</p>
                  <p className="text-xs text-ink-muted">
                    {endpoint.description || "—"} ·{" "}
                    {endpoint.eventTypes.length ? endpoint.eventTypes.join(", ") : "every event"}
                  </p>
                  {endpoint.disabledReason && <p className="text-xs text-fault">Disabled: {endpoint.disabledReason}</p>}
                  {endpoint.secretRotation && (
                    <p className="text-xs text-caution-dark">
                      The previous secret signs too until {when(endpoint.secretRotation.previousSecretExpiresAt)}
                    </p>
                  )}
                </div>
                <Badge value={endpoint.enabled ? "enabled" : "disabled"} />
              </div>
              <div className="mt-2">
                <EndpointButtons id={endpoint.id} enabled={endpoint.enabled} manage={manage} test={test} />
              </div>
              <h3 className="mb-1 mt-3 text-xs font-semibold uppercase tracking-wide text-ink-muted">
                Latest deliveries
              </h3>
              <ul className="space-y-0.5 text-xs">
                {recent[index].data.length === 0 && <li className="text-ink-muted">Nothing sent yet.</li>}
                {recent[index].data.map((delivery) => (
                  <li key={delivery.id} data-testid="delivery" className="flex flex-wrap items-center gap-2">
                    <Badge value={delivery.status} /> <span className="font-mono">{delivery.eventType}</span>
                    <span className="text-ink-muted">
                      {delivery.attempts} attempt{delivery.attempts === 1 ? "" : "s"}
                      {delivery.lastStatusCode
                        ? ` · HTTP ${delivery.lastStatusCode}`
                        : delivery.lastError
                          ? ` · ${delivery.lastError}`
                          : ""}{" "}
                      · {when(delivery.updatedAt)}
                    </span>
                  </li>
                ))}
              </ul>
              <p className="mt-2 text-xs">
                <Link className="text-edge" href={`/console/webhooks/${endpoint.id}`}>
                  Deliveries and settings of {endpoint.description || endpoint.url} →
                </Link>
              </p>
            </section>
          ))}
        </div>
        {manage ? (
          <NewEndpointForm types={EVENT_TYPES} words={EVENT_TYPE_WORDS} />
        ) : (
          <p className="text-sm text-ink-muted">
            Your role ({member.role}) can read endpoints and deliveries{test ? " and send test events" : ""}; admins and
            owners change them.
          </p>
        )}
      </div>
    </>
  );
}
