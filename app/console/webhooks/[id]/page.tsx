import Link from "next/link";
import { notFound } from "next/navigation";
import { ActionForm } from "@/components/console/ActionForm";
import { DeliveryDetails } from "@/components/console/DeliveryDetails";
import { EditEndpointForm, EndpointButtons } from "@/components/console/WebhookForms";
import { Badge, PageHeader, Table, Td, when } from "@/components/ui";
import { ApiError } from "@/lib/errors";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { EVENT_TYPES, EVENT_TYPE_WORDS } from "@/lib/schemas/enums";
import { eventPayloads } from "@/lib/services/events";
import { findEndpoint, listDeliveries } from "@/lib/services/webhooks";
import { viewEndpoint } from "@/lib/services/webhook-views";
import { deleteEndpointAction, resendFailedAction } from "../actions";

export const metadata = { title: "Webhook endpoint" };

const STATES = ["pending", "succeeded", "failed", "skipped"] as const;

export default async function EndpointPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ status?: string; type?: string; cursor?: string }>;
}) {
  const { id } = await params;
  const query = await searchParams;
  const member = await currentMember();
  const em = await requestEm();
  const entity = await findEndpoint(em, member.shopId, id).catch((err) => {
    if (err instanceof ApiError && err.status === 404) notFound();
    throw err;
  });
  const endpoint = viewEndpoint(entity);
  const status = STATES.find((s) => s === query.status);
  const type = EVENT_TYPES.find((t) => t === query.type);
  const page = await listDeliveries(
    em,
    member.shopId,
    { endpoint: id },
    { limit: 25, cursor: query.cursor, status, eventType: type },
  ).catch(() => ({ data: [], next_cursor: null }));
  const payloads = await eventPayloads(
    em,
    page.data.map((d) => d.eventId),
  );
  const manage = can(member.role, "webhooks:manage");
  const test = can(member.role, "webhooks:test");
  const filterQuery = (extra: Record<string, string | undefined>) => {
    const entries: [string, string | undefined][] = Object.entries({ status, type, ...extra });
    const params = new URLSearchParams(entries.filter((e): e is [string, string] => Boolean(e[1])));
    return params.size ? `?${params}` : "";
  };
  return (
    <>
      <p className="mb-1 text-xs">
        <Link href="/console/webhooks" className="text-edge hover:underline">
          ← Webhooks
        </Link>
      </p>
      <PageHeader
        title={endpoint.description || endpoint.url}
        lead={
          <span className="break-all font-mono text-xs">
            {endpoint.url} · {endpoint.id}
          </span>
        }
      >
        <Badge value={endpoint.enabled ? "enabled" : "disabled"} />
      </PageHeader>
      {endpoint.disabledReason && <p className="mb-3 text-sm text-fault">Disabled: {endpoint.disabledReason}</p>}
      <div className="grid gap-6 xl:grid-cols-[1fr_24rem]">
        <div className="space-y-4">
          <div className="flex flex-wrap items-start gap-2">
            <EndpointButtons id={endpoint.id} enabled={endpoint.enabled} manage={manage} test={test} />
            {manage && endpoint.enabled && (
              <ActionForm
                action={resendFailedAction}
                fields={{ id: endpoint.id }}
                confirm="Send every event whose delivery here failed once more?"
                buttonClassName="rounded border border-scale-300 px-2 py-1 text-xs hover:border-ink"
              >
                Resend all failed
              </ActionForm>
            )}
          </div>
          <section>
            <h2 className="mb-2 text-sm font-semibold">Deliveries</h2>
            <form className="mb-2 flex flex-wrap items-end gap-2 text-xs" method="get">
              <label className="grid gap-0.5">
                State
                <select
                  name="status"
                  defaultValue={status ?? ""}
                  className="rounded border border-scale-300 bg-white px-1 py-1"
                >
                  <option value="">any</option>
                  {STATES.map((s) => (
                    <option key={s}>{s}</option>
                  ))}
                </select>
              </label>
              <label className="grid gap-0.5">
                Event
                <select
                  name="type"
                  defaultValue={type ?? ""}
                  className="rounded border border-scale-300 bg-white px-1 py-1"
                >
                  <option value="">any</option>
                  {EVENT_TYPES.map((t) => (
                    <option key={t}>{t}</option>
                  ))}
                </select>
              </label>
              <button className="rounded border border-scale-300 bg-white px-2 py-1">Show</button>
            </form>
            <Table
              head={["Event", "State", "Attempts and what was sent and received"]}
              empty="No deliveries match. Send a test event to see one."
            >
              {page.data.map((delivery) => (
                <tr key={delivery.id} data-testid="delivery">
                  <Td>
                    <span className="font-mono text-xs">{delivery.eventType}</span>
                    <br />
                    <Link className="text-xs text-edge hover:underline" href={`/console/events/${delivery.eventId}`}>
                      {delivery.eventId}
                    </Link>
                    {delivery.manual ? <span className="text-xs text-ink-muted"> · sent by hand</span> : null}
                  </Td>
                  <Td>
                    <Badge value={delivery.status} />
                    {delivery.nextAttemptAt && (
                      <div className="text-xs text-ink-muted">next try {when(delivery.nextAttemptAt)}</div>
                    )}
                  </Td>
                  <Td>
                    <DeliveryDetails delivery={delivery} payload={payloads.get(delivery.eventId) ?? ""} />
                  </Td>
                </tr>
              ))}
            </Table>
            <p className="mt-2 flex gap-3 text-xs">
              {query.cursor && (
                <Link className="text-edge" href={`/console/webhooks/${id}${filterQuery({})}`}>
                  Newest
                </Link>
              )}
              {page.next_cursor && (
                <Link
                  className="text-edge"
                  href={`/console/webhooks/${id}${filterQuery({ cursor: page.next_cursor })}`}
                >
                  Older deliveries →
                </Link>
              )}
            </p>
          </section>
        </div>
        <aside className="space-y-4">
          {manage ? <EditEndpointForm endpoint={endpoint} types={EVENT_TYPES} words={EVENT_TYPE_WORDS} /> : null}
          {manage && (
            <ActionForm
              action={deleteEndpointAction}
              fields={{ id: endpoint.id }}
              confirm={`Delete the endpoint ${endpoint.url}? It receives nothing more, and its delivery log goes with it.`}
              buttonClassName="rounded-md border border-fault/50 px-3 py-1.5 text-sm text-fault hover:bg-fault-light"
            >
              Delete endpoint
            </ActionForm>
          )}
        </aside>
      </div>
    </>
  );
}
