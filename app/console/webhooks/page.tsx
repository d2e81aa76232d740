import Link from "next/link";
import { EndpointButtons, FilterForm, NewEndpointForm, ResendButton } from "@/components/console/WebhookForms";
import { Badge, PageHeader, Table, Td, when } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { EVENT_TYPES } from "@/lib/services/event-types";
import { listDeliveries, listEndpoints } from "@/lib/services/webhooks";

export const metadata = { title: "Webhooks" };

export default async function Webhooks() {
  const member = await currentMember();
  const em = await requestEm();
  const endpoints = await listEndpoints(em, member.shopId, { limit: 100 });
  const manage = can(member.role, "webhooks:manage");
  const test = can(member.role, "webhooks:test");
  const deliveries = await Promise.all(endpoints.data.map((e) => listDeliveries(em, member.shopId, { endpoint: e.id }, { limit: 10 })));
  return (
    <>
      <PageHeader title="Webhooks" lead="Where Shearwire sends events, signed per Standard Webhooks, retried for a day, every attempt logged." />
      <div className="grid gap-6 xl:grid-cols-[1fr_24rem]">
        <div className="space-y-6">
          {endpoints.data.length === 0 && <p className="rounded-md border border-dashed border-scale-300 p-6 text-center text-sm text-ink-muted">No endpoints yet.</p>}
          {endpoints.data.map((e, i) => (
            <section key={e.id} className="rounded-md border border-scale-200 bg-white p-4" data-testid="endpoint">
              <div className="flex flex-wrap items-start justify-between gap-2">
                <div>
                  <p className="font-mono text-sm">{e.url}</p>
                  <p className="text-xs text-ink-muted">{e.description || "—"} · {e.eventTypes.length ? e.eventTypes.join(", ") : "all events"} · {e.id}</p>
                  {e.disabledReason && <p className="text-xs text-fault">Disabled: {e.disabledReason}</p>}
                  {e.secretRotation && <p className="text-xs text-caution-dark">Previous secret signs too until {when(e.secretRotation.previousSecretExpiresAt)}</p>}
                </div>
                <Badge value={e.enabled ? "enabled" : "disabled"} />
              </div>
              <div className="mt-2"><EndpointButtons id={e.id} enabled={e.enabled} manage={manage} test={test} /></div>
              {manage && <FilterForm id={e.id} types={EVENT_TYPES} chosen={e.eventTypes} />}
              <h3 className="mb-1 mt-4 text-xs font-semibold uppercase tracking-wide text-ink-muted">Recent deliveries</h3>
              <Table head={["Event", "State", "Attempts", "Last answer", "Next try", ""]} empty="Nothing sent yet.">
                {deliveries[i].data.map((d) => (
                  <tr key={d.id} data-testid="delivery">
                    <Td mono>{d.eventType}<br /><Link className="text-edge hover:underline" href={`/console/events/${d.eventId}`}>{d.eventId}</Link></Td>
                    <Td><Badge value={d.status} /></Td>
                    <Td mono>
                      {d.attemptLog.map((a) => (
                        <span key={a.id} title={`${when(a.attemptedAt)} · ${a.latencyMs} ms${a.error ? ` · ${a.error}` : ""}${a.responseExcerpt ? ` · ${a.responseExcerpt}` : ""}`} className="mr-1">
                          {a.statusCode ?? "×"}
                        </span>
                      ))}
                    </Td>
                    <Td mono>{d.lastError ?? (d.lastStatusCode ? `HTTP ${d.lastStatusCode}` : "—")}</Td>
                    <Td mono>{when(d.nextAttemptAt)}</Td>
                    <Td>{manage && e.enabled && <ResendButton endpoint={e.id} event={d.eventId} />}</Td>
                  </tr>
                ))}
              </Table>
            </section>
          ))}
        </div>
        {manage ? <NewEndpointForm types={EVENT_TYPES} /> : <p className="text-sm text-ink-muted">Your role ({member.role}) can read endpoints and deliveries{test ? " and send test events" : ""}; admins and owners change them.</p>}
      </div>
    </>
  );
}
