import Link from "next/link";
import { notFound } from "next/navigation";
import { archiveAction } from "@/app/console/catalog-actions";
import { ShearForm } from "@/components/console/CatalogForms";
import { PageHeader } from "@/components/ui";
import { ConfirmButton } from "@/components/ui/ConfirmButton";
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
  const s = viewShear(shear);
  const manage = can(member.role, "catalog:manage");
  return (
    <>
      <p className="mb-1 text-xs"><Link href="/console/shears" className="text-edge hover:underline">← Shears</Link></p>
      <PageHeader title={s.name} lead={<span className="font-mono text-xs">{s.id}{s.archivedAt ? " · archived" : ""}</span>}>
        {manage && !s.archivedAt && (
          <form action={archiveAction}><input type="hidden" name="id" value={s.id} />
            <ConfirmButton question="Archive this shear? It takes no new programs." className="rounded border border-fault/50 px-2 py-1 text-xs text-fault">Archive</ConfirmButton>
          </form>
        )}
      </PageHeader>
      <section className="max-w-2xl rounded-md border border-scale-200 bg-white p-4">
        {manage ? <ShearForm id={s.id} initial={s} /> : <pre className="text-xs">{JSON.stringify(s, null, 2)}</pre>}
      </section>
    </>
  );
}
