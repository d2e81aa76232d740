import Link from "next/link";
import { notFound } from "next/navigation";
import { ResendButton } from "@/components/console/WebhookForms";
import { Badge, PageHeader, Table, Td, when } from "@/components/ui";
import { ApiError } from "@/lib/errors";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { getEvent, listDeliveries, listEndpoints } from "@/lib/services/webhooks";

export const metadata = { title: "Event" };

export default async function EventPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await currentMember();
  const em = await requestEm();
  const event = await getEvent(em, member.shopId, id).catch((err) => {
    if (err instanceof ApiError && err.status === 404) notFound();
    throw err;
  });
  const [deliveries, endpoints] = await Promise.all([
    listDeliveries(em, member.shopId, { event: id }, { limit: 100 }),
    listEndpoints(em, member.shopId, { limit: 100 }),
  ]);
  const url = new Map(endpoints.data.map((e) => [e.id, e.url]));
  const manage = can(member.role, "webhooks:manage");
  return (
    <>
      <p className="mb-1 text-xs">
        <Link href="/console/events" className="text-edge hover:underline">
          ← Events
        </Link>
      </p>
      <PageHeader
        title={event.type}
        lead={
          <span className="font-mono text-xs">
            {event.id} · {when(event.createdAt)} · the webhook-id of every delivery below
          </span>
        }
      />
      <h2 className="mb-2 text-sm font-semibold">Deliveries and their attempts</h2>
      <Table head={["Endpoint", "State", "Attempts (time · answer · latency)"]} empty="This event went to no endpoint.">
        {deliveries.data.map((delivery) => (
          <tr key={delivery.id}>
            <Td mono className="min-w-40 break-all">
              {url.get(delivery.endpointId) ?? delivery.endpointId}
              {delivery.manual ? " (resent or test)" : ""}
              {/* under the endpoint, not in a column of its own: on a phone a last column is out of view */}
              {manage && (
                <div className="mt-1 break-normal font-sans">
                  <ResendButton endpoint={delivery.endpointId} event={event.id} />
                </div>
              )}
            </Td>
            <Td>
              <Badge value={delivery.status} />
            </Td>
            <Td mono>
              {delivery.attemptLog.map((attempt) => (
                <div key={attempt.id}>
                  {when(attempt.attemptedAt)} · {attempt.statusCode ?? attempt.error ?? "no answer"} ·{" "}
                  {attempt.latencyMs} ms
                  {attempt.responseExcerpt ? ` · “${attempt.responseExcerpt.slice(0, 60)}”` : ""}
                </div>
              ))}
              {delivery.nextAttemptAt && <div className="text-ink-muted">next try {when(delivery.nextAttemptAt)}</div>}
            </Td>
          </tr>
        ))}
      </Table>
      <h2 className="mb-2 mt-6 text-sm font-semibold">Payload data</h2>
      <pre tabIndex={0} className="max-h-96 overflow-auto rounded-md bg-scale-100 p-3 text-xs">
        {JSON.stringify(event.data, null, 2)}
      </pre>
    </>
  );
}
