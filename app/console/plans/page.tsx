import Link from "next/link";
import { Badge, PageHeader, Table, Td, when } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listPlans } from "@/lib/services/plans";

export const metadata = { title: "Plans" };

export default async function Plans() {
  const member = await currentMember();
  const { data } = await listPlans(await requestEm(), member.shopId, { limit: 100 });
  return (
    <>
      <PageHeader title="Plans" lead="Order lines laid out on the stock on hand in patterns your shear can cut, and the draft programs written from them.">
        {can(member.role, "programs:write") && <Link href="/console/plans/new" className="rounded-md bg-ink px-3 py-1.5 text-sm font-medium text-scale-50">New plan</Link>}
      </PageHeader>
      <Table head={["Plan", "Created", "Status", "Sheets", "Patterns", "Blanks", "Stock used", "Programs"]} empty="No plans yet. Send one to POST /api/v1/plans, or start one here.">
        {data.map((p) => (
          <tr key={p.id}>
            <Td><Link href={`/console/plans/${p.id}`} className="text-edge hover:underline">{p.reference ?? p.id}</Link>{p.title ? <span className="text-ink-muted"> · {p.title}</span> : null}</Td>
            <Td className="text-ink-muted">{when(p.createdAt)}</Td>
            <Td>
              {p.status === "complete"
                ? <Badge value={p.coverage === "complete" ? "pass" : "warn"} label={p.coverage === "complete" ? "complete" : "partial"} />
                : <Badge value={p.status === "running" || p.status === "queued" ? "running" : p.status === "failed" ? "fail" : "cancelled"} label={p.status} />}
            </Td>
            <Td mono>{p.summary?.sheets ?? "—"}</Td>
            <Td mono>{p.summary?.patterns ?? (p.progress ? `${p.progress.patterns}…` : "—")}</Td>
            <Td mono>{p.summary ? `${p.summary.blanksPlanned} / ${p.summary.blanksAsked}` : p.progress ? `${p.progress.piecesPlaced} / ${p.progress.piecesWanted}…` : "—"}</Td>
            <Td mono>{p.summary ? `${p.summary.utilisationPct} %` : "—"}</Td>
            <Td>{p.programs.length ? `${p.programs.length} written` : <span className="text-ink-muted">not yet</span>}</Td>
          </tr>
        ))}
      </Table>
    </>
  );
}
