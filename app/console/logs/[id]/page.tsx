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
  const r = await getRequest(await requestEm(), member.shopId, id);
  if (!r) notFound();
  const rows: [string, string][] = [
    ["Request id", r.id],
    ["When", when(r.createdAt)],
    ["Method", r.method],
    ["Route", r.route],
    ["Path", r.path],
    ["Status", String(r.status)],
    ["Problem type", r.errorType ? `/problems/${r.errorType}` : "—"],
    ["Latency", `${r.latencyMs} ms`],
    ["API key", r.key ? `${r.key.name} (${r.key.prefix}…, ${r.key.id})` : (r.keyId ?? "—")],
    ["Idempotency-Key", r.idempotencyKey ?? "—"],
  ];
  return (
    <>
      <p className="mb-1 text-xs">
        <Link href="/console/logs" className="text-edge hover:underline">
          ← Request log
        </Link>
      </p>
      <PageHeader title={`${r.method} ${r.path}`} lead="Bodies and secrets are never logged." />
      <dl className="grid max-w-2xl grid-cols-[minmax(0,9rem)_minmax(0,1fr)] gap-x-3 gap-y-1 rounded-md border border-scale-200 bg-white p-4 text-sm">
        {rows.map(([k, v]) => (
          <Fragment key={k}>
            <dt className="text-ink-muted">{k}</dt>
            <dd className="break-all font-mono">{v}</dd>
          </Fragment>
        ))}
      </dl>
    </>
  );
}
