import Link from "next/link";
import { UploadForm } from "@/components/console/UploadForm";
import { PageHeader } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { Shear } from "@/entities";
import { requestEm } from "@/lib/db/orm";
import { csvTemplate } from "@/lib/services/import";

export const metadata = { title: "Upload" };

export default async function Upload() {
  const member = await currentMember();
  const shear = await (
    await requestEm()
  ).findOne(Shear, { shop: member.shopId, archivedAt: null }, { orderBy: { name: "asc" }, fields: ["name"] });
  const firstShear = shear?.name ?? "Bay 1 sheet shear";
  return (
    <>
      <PageHeader
        title="Upload a cut list"
        lead="Each program is checked like one sent to the API and stored as a draft. If any row has a problem, nothing is imported."
      />
      <p className="mb-4 text-sm text-ink-muted">
        A list of blanks rather than cut groups?{" "}
        <Link href="/console/plans/new" className="text-edge hover:underline">
          Plan it onto your sheets
        </Link>{" "}
        and write the programs from the plan.
      </p>
      {can(member.role, "programs:write") ? (
        <UploadForm />
      ) : (
        <p className="text-sm text-ink-muted">
          Your role ({member.role}) can read programs; admins and owners import them.
        </p>
      )}
      <section className="mt-8 max-w-3xl text-sm">
        <h2 className="font-semibold">CSV layout</h2>
        <p className="mt-1 text-ink-muted">
          One row per cut group, in cutting order. Rows with the same <code>reference</code> make one program; its other
          columns come from its first row. The <code>shear</code> column takes a shear&apos;s name as it appears under
          Shears (or its id). Lengths are in the row&apos;s <code>units</code> (<code>in</code> or <code>mm</code>);
          give <code>thickness</code> or <code>gauge</code>; <code>turn</code> and <code>scrap</code> take yes or no.
        </p>
        <p className="mt-2">
          <a
            href="/console/upload/template"
            download
            className="rounded-md border border-scale-300 bg-white px-3 py-1.5 text-sm no-underline hover:border-ink"
          >
            Download the CSV template
          </a>
        </p>
        <pre tabIndex={0} className="mt-2 overflow-x-auto rounded bg-scale-100 p-3 text-xs">
          {csvTemplate(firstShear)}
        </pre>
        <p className="mt-2 text-ink-muted">
          A JSON file holds one program, or a list of them, exactly as <code>POST /api/v1/programs</code> takes them.
        </p>
      </section>
    </>
  );
}
