import Link from "next/link";
import { notFound } from "next/navigation";
import { archiveAction } from "@/app/console/catalog-actions";
import { GradeForm } from "@/components/console/CatalogForms";
import { PageHeader } from "@/components/ui";
import { ActionForm } from "@/components/console/ActionForm";
import { Grade } from "@/entities";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { viewGrade } from "@/lib/services/catalog";

export const metadata = { title: "Grade" };

export default async function GradePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await currentMember();
  const grade = await (await requestEm()).findOne(Grade, { id, shop: member.shopId });
  if (!grade) notFound();
  const s = viewGrade(grade);
  const manage = can(member.role, "catalog:manage");
  return (
    <>
      <p className="mb-1 text-xs">
        <Link href="/console/grades" className="text-edge hover:underline">
          ← Grades
        </Link>
      </p>
      <PageHeader
        title={`${s.code} · ${s.name}`}
        lead={
          <span className="font-mono text-xs">
            {s.id}
            {s.archivedAt ? " · archived" : ""}
          </span>
        }
      >
        {manage && !s.archivedAt && (
          <ActionForm
            action={archiveAction}
            fields={{ id: s.id }}
            confirm="Archive this grade? Programs naming it get a grade_unknown finding."
            buttonClassName="rounded border border-fault/50 px-2 py-1 text-xs text-fault"
          >
            Archive
          </ActionForm>
        )}
      </PageHeader>
      <section className="max-w-2xl rounded-md border border-scale-200 bg-white p-4">
        {manage ? (
          <GradeForm id={s.id} initial={s} />
        ) : (
          <pre tabIndex={0} className="overflow-x-auto text-xs">
            {JSON.stringify(s, null, 2)}
          </pre>
        )}
      </section>
    </>
  );
}
