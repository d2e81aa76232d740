import Link from "next/link";
import { ProgramsTable } from "@/components/console/ProgramsTable";
import { PageHeader } from "@/components/ui";
import { PROGRAM_STATUSES, type ProgramStatus } from "@/lib/schemas/enums";
import { currentMember } from "@/lib/auth/session";

export const metadata = { title: "Programs" };

export default async function Programs({ searchParams }: { searchParams: Promise<{ status?: string }> }) {
  await currentMember();
  const q = await searchParams;
  const status = PROGRAM_STATUSES.includes(q.status as ProgramStatus) ? (q.status as ProgramStatus) : undefined;
  return (
    <>
      <PageHeader title="Programs" lead="Cut programs your systems sent, newest first.">
        <Link href="/console/upload" className="rounded-md border border-scale-300 px-3 py-1.5 text-sm hover:border-ink">Upload a cut list</Link>
      </PageHeader>
      <nav className="mb-3 flex flex-wrap gap-1 text-xs" aria-label="Filter by state">
        <Link href="/console/programs" className={`rounded px-2 py-1 ${!status ? "bg-ink text-scale-50" : "bg-scale-200"}`}>all</Link>
        {PROGRAM_STATUSES.map((s) => (
          <Link key={s} href={`/console/programs?status=${s}`} className={`rounded px-2 py-1 ${status === s ? "bg-ink text-scale-50" : "bg-scale-200"}`}>{s}</Link>
        ))}
      </nav>
      <ProgramsTable status={status} />
      <p className="mt-2 text-xs text-ink-muted">The newest 100, refreshed every 5 seconds. Click a column to sort.</p>
    </>
  );
}
