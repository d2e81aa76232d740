import { notFound } from "next/navigation";
import { CatalogDetail } from "@/components/console/CatalogDetail";
import { GradeForm } from "@/components/console/CatalogForms";
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
  const view = viewGrade(grade);
  return (
    <CatalogDetail
      back={{ href: "/console/grades", label: "Grades" }}
      title={`${view.code} · ${view.name}`}
      id={view.id}
      archivedAt={view.archivedAt}
      manage={can(member.role, "catalog:manage")}
      archiveConfirm="Archive this grade? Programs naming it get a grade_unknown finding."
      form={<GradeForm id={view.id} initial={view} />}
      fields={view}
    />
  );
}
