import Link from "next/link";
import { Badge, PageHeader, Table, Td, when } from "@/components/ui";
import { PROGRAM_STATUSES, type ProgramStatus } from "@/entities/Program";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listPrograms } from "@/lib/services/programs";

export const metadata = { title: "Programs" };

export default async function Programs({ searchParams }: { searchParams: Promise<{ status?: string; cursor?: string }> }) {
  const member = await currentMember();
  const q = await searchParams;
  const status = PROGRAM_STATUSES.includes(q.status as ProgramStatus) ? (q.status as ProgramStatus) : undefined;
  const page = await listPrograms(await requestEm(), member.shopId, { limit: 50, status, cursor: q.cursor });
  return (
    <>
      <PageHeader title="Programs" lead="Cut programs your systems sent, newest first." />
      <nav className="mb-3 flex flex-wrap gap-1 text-xs" aria-label="Filter by state">
        <Link href="/console/programs" className={`rounded px-2 py-1 ${!status ? "bg-ink text-scale-50" : "bg-scale-200"}`}>all</Link>
        {PROGRAM_STATUSES.map((s) => (
          <Link key={s} href={`/console/programs?status=${s}`} className={`rounded px-2 py-1 ${status === s ? "bg-ink text-scale-50" : "bg-scale-200"}`}>{s}</Link>
        ))}
      </nav>
      <Table head={["Reference", "Title", "State", "Check", "Findings", "Due", "Updated"]} empty="No programs yet. Send one with POST /api/v1/programs.">
        {page.data.map((p) => (
          <tr key={p.id} className="hover:bg-scale-50">
            <Td mono><Link className="text-edge hover:underline" href={`/console/programs/${p.id}`}>{p.reference}</Link></Td>
            <Td>{p.title ?? "—"}</Td>
            <Td><Badge value={p.status} /></Td>
            <Td><Badge value={p.validation} /></Td>
            <Td mono>{p.check.findings.length}</Td>
            <Td mono>{when(p.dueAt)}</Td>
            <Td mono>{when(p.updatedAt)}</Td>
          </tr>
        ))}
      </Table>
      {page.next_cursor && (
        <Link className="mt-3 inline-block text-sm text-edge hover:underline" href={`/console/programs?${new URLSearchParams({ ...(status ? { status } : {}), cursor: page.next_cursor })}`}>Older programs →</Link>
      )}
    </>
  );
}
