import { Shear } from "@/entities";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { csvTemplate } from "@/lib/services/import";

export const dynamic = "force-dynamic";

/** The cut-list template to download: the columns, and an example naming this shop's first shear. */
export async function GET() {
  const member = await currentMember();
  const shear = await (
    await requestEm()
  ).findOne(Shear, { shop: member.shopId, archivedAt: null }, { orderBy: { name: "asc" }, fields: ["name"] });
  return new Response(csvTemplate(shear?.name ?? "Bay 1 sheet shear"), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": 'attachment; filename="shearwire-cut-list.csv"',
      "Cache-Control": "no-store",
    },
  });
}
