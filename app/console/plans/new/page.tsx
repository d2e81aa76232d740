import { PlanForm } from "@/components/console/PlanForm";
import { PageHeader } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listGrades, listShears } from "@/lib/services/catalog";
import { BLANK_COLUMNS } from "@/lib/services/import-blanks";

export const metadata = { title: "New plan" };

export default async function NewPlan() {
  const member = await currentMember();
  const em = await requestEm();
  const [shears, grades] = await Promise.all([
    listShears(em, member.shopId, { limit: 200 }),
    listGrades(em, member.shopId, { limit: 200 }),
  ]);
  return (
    <>
      <PageHeader
        title="Plan a cut list"
        lead="Upload the blanks your ERP wants (one row per order line); Shearwire lays them out on the sheets you have, within the shear's blade and backgauge, and shows every sheet pattern before any program is written."
      />
      {can(member.role, "programs:write") ? (
        <PlanForm
          shears={shears.data.filter((s) => !s.archivedAt).map((s) => ({ id: s.id, name: s.name }))}
          grades={grades.data.filter((g) => !g.archivedAt).map((g) => ({ code: g.code, name: g.name }))}
        />
      ) : (
        <p className="text-sm text-ink-muted">Your role ({member.role}) can read plans; admins and owners make them.</p>
      )}
      <section className="mt-8 max-w-3xl text-sm">
        <h2 className="font-semibold">Cut list layout</h2>
        <p className="mt-1 text-ink-muted">
          One row per blank: lengths in the plan&apos;s units, <code>can_turn</code> yes or no (no when grain or finish
          must run along the sheet&apos;s length; empty means yes).
        </p>
        <pre tabIndex={0} className="mt-2 overflow-x-auto rounded bg-scale-100 p-3 text-xs">{`${BLANK_COLUMNS.join(",")}
base,600,400,10,yes
lid,1200,500,4,no`}</pre>
      </section>
    </>
  );
}
