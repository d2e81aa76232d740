import Link from "next/link";
import { ProgramsTable } from "@/components/console/ProgramsTable";
import { PageHeader } from "@/components/ui";
import { PROGRAM_STATUSES, isProgramStatus } from "@/lib/schemas/enums";
import { currentMember } from "@/lib/auth/session";

export const metadata = { title: "Programs" };

export default async function Programs({
  searchParams,
}: {
  searchParams: Promise<{ status?: string; search?: string }>;
}) {
  await currentMember();
  const query = await searchParams;
  const status = isProgramStatus(query.status) ? query.status : undefined;
  const search = query.search?.trim().slice(0, 100) || undefined;
  return (
    <>
      <PageHeader title="Programs" lead="Cut programs your systems sent, newest first.">
        <Link
          href="/console/upload"
          className="rounded-md border border-scale-300 px-3 py-1.5 text-sm hover:border-ink"
        >
          Upload a cut list
        </Link>
      </PageHeader>
      <form className="mb-3 flex flex-wrap items-end gap-2 text-sm" role="search">
        <label className="grid gap-0.5 text-xs">
          Reference or title contains
          <input
            name="search"
            defaultValue={search ?? ""}
            maxLength={100}
            placeholder="SO-2291"
            className="rounded border border-scale-300 bg-white px-2 py-1 text-sm"
          />
        </label>
        <label className="grid gap-0.5 text-xs">
          State
          <select
            name="status"
            defaultValue={status ?? ""}
            className="rounded border border-scale-300 bg-white px-2 py-1 text-sm"
          >
            <option value="">any</option>
            {PROGRAM_STATUSES.map((s) => (
              <option key={s}>{s}</option>
            ))}
          </select>
        </label>
        <button className="rounded-md bg-ink px-3 py-1.5 text-scale-50">Show</button>
        {(search || status) && (
          <Link href="/console/programs" className="text-xs text-edge">
            Clear
          </Link>
        )}
      </form>
      <ProgramsTable status={status} search={search} />
      <p className="mt-2 text-xs text-ink-muted">
        50 to a page, newest first; the first page refreshes every 5 seconds. Click a column to sort the page.
      </p>
    </>
  );
}
