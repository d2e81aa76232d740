import Link from "next/link";
import { ShearForm } from "@/components/console/CatalogForms";
import { PageHeader, Table, Td } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listShears } from "@/lib/services/catalog";
import { getSettings } from "@/lib/services/settings";
import { SettingsForm } from "@/components/console/SettingsForm";

export const metadata = { title: "Shears" };

export default async function Shears() {
  const member = await currentMember();
  const em = await requestEm();
  const [shears, settings] = await Promise.all([
    listShears(em, member.shopId, { limit: 200 }),
    getSettings(em, member.shopId),
  ]);
  return (
    <>
      <PageHeader
        title="Shears"
        lead="The capacity of each machine. Programs are checked against these figures: keep them true to the maker's plate and manual."
      />
      <div className="grid gap-6 2xl:grid-cols-[1fr_28rem]">
        <Table
          head={["Name", "Rating", "Blade", "Backgauge", "Rake", "Blade gap", "Strokes", "Blades to", "Id"]}
          empty="No shears yet."
        >
          {shears.data.map((shear) => (
            <tr key={shear.id}>
              <Td>
                <Link className="text-edge hover:underline" href={`/console/shears/${shear.id}`}>
                  {shear.name}
                </Link>
              </Td>
              <Td mono>
                {shear.ratedThicknessMm} mm at {shear.ratedTensileMpa} MPa, {shear.ratedRakeDeg}°
              </Td>
              <Td mono>{shear.bladeLengthMm} mm</Td>
              <Td mono>
                {shear.backgaugeMinMm}–{shear.backgaugeMaxMm} mm
              </Td>
              <Td mono>
                {shear.rakeMinDeg}–{shear.rakeMaxDeg}°
              </Td>
              <Td mono>
                {shear.gapMinMm}–{shear.gapMaxMm} mm
              </Td>
              <Td mono>{shear.strokesPerMin}/min</Td>
              <Td mono>{shear.maxBladeHardnessHb ? `${shear.maxBladeHardnessHb} HB` : "—"}</Td>
              <Td mono>{shear.id}</Td>
            </tr>
          ))}
        </Table>
        {can(member.role, "catalog:manage") && (
          <section className="rounded-md border border-scale-200 bg-white p-4">
            <h2 className="mb-3 text-sm font-semibold">Add a shear</h2>
            <ShearForm />
          </section>
        )}
        {can(member.role, "settings:manage") && <SettingsForm settings={settings} />}
      </div>
    </>
  );
}
