import Link from "next/link";
import { GradeForm } from "@/components/console/CatalogForms";
import { GAUGE_SYSTEM_WORDS, mpa } from "@/components/console/words";
import { PageHeader, Table, Td } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listGrades } from "@/lib/services/catalog";

export const metadata = { title: "Grades" };

export default async function Grades() {
  const member = await currentMember();
  const grades = await listGrades(await requestEm(), member.shopId, { limit: 200 });
  return (
    <>
      <PageHeader title="Grades" lead="Materials programs may name, with the strengths the checks use." />
      <div className="grid gap-6 2xl:grid-cols-[1fr_28rem]">
        <Table
          head={["Code", "Name", "Family", "Yield", "Tensile", "Shear / tensile", "Gauges", "Hardness", "Standard"]}
          empty="No grades yet."
        >
          {grades.data.map((grade) => (
            <tr key={grade.id}>
              <Td mono>
                <Link className="text-edge hover:underline" href={`/console/grades/${grade.id}`}>
                  {grade.code}
                </Link>
              </Td>
              <Td>{grade.name}</Td>
              <Td>{grade.family}</Td>
              <Td mono>{grade.yieldMpa ? mpa(grade.yieldMpa) : "—"}</Td>
              <Td mono>
                {grade.tensileMinMpa
                  ? `at least ${mpa(grade.tensileMinMpa)}`
                  : grade.tensileTypicalMpa
                    ? `about ${mpa(grade.tensileTypicalMpa)}`
                    : "—"}
                {grade.valuesAreTypical ? " (typical)" : ""}
              </Td>
              <Td mono>{grade.shearTensileRatio}</Td>
              <Td>
                {grade.gaugeFamily ? (
                  <abbr title={GAUGE_SYSTEM_WORDS[grade.gaugeFamily]} className="font-mono text-xs">
                    {grade.gaugeFamily}
                  </abbr>
                ) : (
                  "—"
                )}
              </Td>
              <Td mono>{grade.hardnessHb ? `${grade.hardnessHb} HB` : "—"}</Td>
              <Td className="text-xs text-ink-muted">{grade.standard}</Td>
            </tr>
          ))}
        </Table>
        <dl className="text-xs text-ink-muted 2xl:col-start-1">
          <dt className="font-semibold text-ink">Gauge systems</dt>
          {Object.entries(GAUGE_SYSTEM_WORDS).map(([code, words]) => (
            <dd key={code}>
              <span className="font-mono">{code}</span>: {words}
            </dd>
          ))}
          <dd className="mt-1">
            A program may give its thickness as a gauge number; the grade&apos;s system turns it into a size.
          </dd>
        </dl>
        {can(member.role, "catalog:manage") && (
          <section className="rounded-md border border-scale-200 bg-white p-4">
            <h2 className="mb-3 text-sm font-semibold">Add a grade</h2>
            <GradeForm />
          </section>
        )}
      </div>
    </>
  );
}
