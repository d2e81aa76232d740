import Link from "next/link";
import { UploadForm } from "@/components/console/UploadForm";
import { PageHeader } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { CSV_COLUMNS } from "@/lib/services/import";

export const metadata = { title: "Upload" };

export default async function Upload() {
  const member = await currentMember();
  return (
    <>
      <PageHeader title="Upload a cut list" lead="Each program is checked like one sent to the API and stored as a draft. If any row has a problem, nothing is imported." />
      <p className="mb-4 text-sm text-ink-muted">A list of blanks rather than cut groups? <Link href="/console/plans/new" className="text-edge hover:underline">Plan it onto your sheets</Link> and write the programs from the plan.</p>
      {can(member.role, "programs:write") ? <UploadForm /> : <p className="text-sm text-ink-muted">Your role ({member.role}) can read programs; admins and owners import them.</p>}
      <section className="mt-8 max-w-3xl text-sm">
        <h2 className="font-semibold">CSV layout</h2>
        <p className="mt-1 text-ink-muted">One row per cut group, in cutting order. Rows with the same <code>reference</code> make one program; its other columns come from its first row. Lengths are in the row&apos;s <code>units</code> (<code>in</code> or <code>mm</code>); give <code>thickness</code> or <code>gauge</code>; <code>turn</code> and <code>scrap</code> take yes or no.</p>
        <pre className="mt-2 overflow-x-auto rounded bg-scale-100 p-3 text-xs">{`${CSV_COLUMNS.join(",")}
SO-2291/4,Side panels,shr_…,A36,,10,in,120,48,2,12,3,,,,rip strips,5,2026-12-08T14:00:00Z
SO-2291/4,,,,,,,,,,16,7,12,yes,,,,`}</pre>
        <p className="mt-2 text-ink-muted">A JSON file holds one program, or a list of them, exactly as <code>POST /api/v1/programs</code> takes them.</p>
      </section>
    </>
  );
}
