import { notFound } from "next/navigation";
import { CatalogDetail } from "@/components/console/CatalogDetail";
import { ShearForm } from "@/components/console/CatalogForms";
import { Shear } from "@/entities";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { viewShear } from "@/lib/services/catalog";

export const metadata = { title: "Shear" };

export default async function ShearPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await currentMember();
  const shear = await (await requestEm()).findOne(Shear, { id, shop: member.shopId });
  if (!shear) notFound();
  const view = viewShear(shear);
  return (
    <CatalogDetail
      back={{ href: "/console/shears", label: "Shears" }}
      title={view.name}
      id={view.id}
      archivedAt={view.archivedAt}
      manage={can(member.role, "catalog:manage")}
      archiveConfirm="Archive this shear? It takes no new programs."
      form={<ShearForm id={view.id} initial={view} />}
      fields={view}
    />
  );
}
