import Link from "next/link";
import { Fragment } from "react";
import { notFound } from "next/navigation";
import { PageHeader, when } from "@/components/ui";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { getRequest } from "@/lib/services/logs";

export const metadata = { title: "Request" };

export default async function RequestDetail({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await currentMember();
  const request = await getRequest(await requestEm(), member.shopId, id);
  if (!request) notFound();
  const rows: [string, string][] = [
    ["Request id", request.id],
    ["When", when(request.createdAt)],
    ["Method", request.method],
    ["Route", request.route],
    ["Path", request.path],
    ["Status", String(request.status)],
    ["Problem type", request.errorType ? `/problems/${request.errorType}` : "—"],
    ["Latency", `${request.latencyMs} ms`],
    [
      "API key",
      request.key ? `${request.key.name} (${request.key.prefix}…, ${request.key.id})` : (request.keyId ?? "—"),
    ],
    ["Idempotency-Key", request.idempotencyKey ?? "—"],
  ];
  return (
    <>
      <p className="mb-1 text-xs">
        <Link href="/console/logs" className="text-edge hover:underline">
          ← Request log
        </Link>
      </p>
      <PageHeader title={`${request.method} ${request.path}`} lead="Bodies and secrets are never logged." />
      <dl className="grid max-w-2xl grid-cols-[minmax(0,9rem)_minmax(0,1fr)] gap-x-3 gap-y-1 rounded-md border border-scale-200 bg-white p-4 text-sm">
        {rows.map(([field, value]) => (
          <Fragment key={field}>
            <dt className="text-ink-muted">{field}</dt>
            <dd className="break-all font-mono">{value}</dd>
          </Fragment>
        ))}
      </dl>
    </>
  );
}
