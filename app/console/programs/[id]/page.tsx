import Link from "next/link";
import { notFound } from "next/navigation";
import { CutDrawing } from "@/components/console/CutDrawing";
import { ProgramActions } from "@/components/console/ProgramActions";
import { groupName, pointerInWords, thicknessInWords } from "@/components/console/words";
import { SafetyNote } from "@/components/SafetyNote";
import { RoutingNote } from "@/components/console/RoutingNote";
import { Badge, PageHeader, Table, Td, when } from "@/components/ui";
import { ApiError } from "@/lib/errors";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { Shear } from "@/entities";
import { findProgram } from "@/lib/services/programs";
import { viewProgram } from "@/lib/services/program-view";
import { listEvents } from "@/lib/services/webhooks";
import { programLayout } from "@/lib/shear";

export const metadata = { title: "Program" };

const SETUP_LABELS: Record<string, string> = {
  bladeGap: "Blade gap",
  gapEnds: "Gap at the ends",
  gapCentre: "Gap at the centre",
  rake: "Rake angle",
  holdDown: "Hold-down",
  crown: "Crown",
  backgaugeRetract: "Backgauge retract",
};

export default async function ProgramPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await currentMember();
  const em = await requestEm();
  const entity = await findProgram(em, member.shopId, id).catch((err) => {
    if (err instanceof ApiError && err.status === 404) notFound();
    throw err;
  });
  const p = viewProgram(entity);
  const c = p.check;
  const shear = await em.findOne(Shear, { id: p.shear }, { fields: ["name"] });
  const shearName = shear?.name ?? p.shear;
  const errors = c.findings.filter((f) => f.severity === "error");
  const history = await listEvents(em, member.shopId, { limit: 100, subject: p.id });
  const faultyGroups = [
    ...new Set(
      c.findings
        .map((f) => /^\/cuts\/(\d+)/.exec(f.pointer)?.[1])
        .filter(Boolean)
        .map(Number),
    ),
  ];
  const warnings = [...new Set(c.findings.filter((f) => f.severity === "warning").map((f) => f.code))];
  const mayRelease = can(member.role, "programs:release");

  return (
    <>
      <p className="mb-1 text-xs">
        <Link href="/console/programs" className="text-edge hover:underline">
          ← Programs
        </Link>
      </p>
      <PageHeader
        title={`${p.reference}${p.title ? ` · ${p.title}` : ""}`}
        lead={
          <>
            <span className="block text-sm text-ink" data-testid="program-where">
              On{" "}
              <Link href={`/console/shears/${p.shear}`} className="text-edge hover:underline">
                {shearName}
              </Link>
              {" · "}
              {thicknessInWords(p.thickness, p.units, c.thickness)} {p.grade}
              {" · "}
              {p.sheet.count} sheet{p.sheet.count === 1 ? "" : "s"} of {p.sheet.length} × {p.sheet.width} {p.units}
            </span>
            <span className="font-mono text-xs">
              {p.id} · revision {p.revision}
              {p.metadata.plan?.startsWith("pln_") && (
                <>
                  {" "}
                  ·{" "}
                  <Link href={`/console/plans/${p.metadata.plan}`} className="text-edge hover:underline">
                    pattern {p.metadata.pattern ?? "?"} of plan {p.metadata.plan}
                  </Link>
                </>
              )}
            </span>
          </>
        }
      >
        <Badge value={p.status} /> <Badge value={p.validation} label={`check: ${p.validation}`} />
      </PageHeader>

      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <div className="space-y-6">
          {p.routing && <RoutingNote routing={p.routing} />}
          <section>
            <h2 className="mb-2 text-sm font-semibold">Findings</h2>
            {c.findings.length === 0 ? (
              <p className="text-sm text-ok">No findings: the program fits this shear and grade.</p>
            ) : (
              <Table head={["Severity", "Where", "Message", "Limit", "Actual", "Code"]}>
                {c.findings.map((f, i) => (
                  <tr key={i}>
                    <Td>
                      <Badge value={f.severity} />
                    </Td>
                    <Td>
                      {pointerInWords(f.pointer)}
                      <br />
                      <span className="font-mono text-xs text-ink-muted">{f.pointer || "/"}</span>
                    </Td>
                    <Td>{f.message}</Td>
                    <Td mono>
                      {f.limit ?? "—"} {f.limit !== null ? f.unit : ""}
                    </Td>
                    <Td mono>
                      {f.actual ?? "—"} {f.actual !== null ? f.unit : ""}
                    </Td>
                    <Td mono>{f.code}</Td>
                  </tr>
                ))}
              </Table>
            )}
          </section>

          <section>
            <h2 className="mb-2 text-sm font-semibold">One sheet, as it is cut</h2>
            <CutDrawing
              sheet={p.sheet}
              layout={
                c.layout !== undefined ? c.layout : programLayout({ units: p.units, sheet: p.sheet, cuts: p.cuts })
              }
              units={p.units}
              faultyGroups={faultyGroups}
            />
            <ol className="mt-2 space-y-0.5 text-xs text-ink-muted">
              {p.cuts.map((cut, i) => (
                <li key={i} className={faultyGroups.includes(i) ? "text-fault" : ""}>
                  <span className="font-medium">{groupName(i)}</span>:{" "}
                  {cut.turn
                    ? cut.from !== undefined
                      ? `turn each piece of ${groupName(cut.from)}, then `
                      : "turn each piece, then "
                    : ""}
                  {cut.count} stroke{cut.count === 1 ? "" : "s"} at {cut.backgauge} {p.units}
                  {cut.length ? `, ${cut.length} ${p.units} long` : ""}
                  {cut.scrap ? " (trim)" : ""}
                  {cut.note ? ` · ${cut.note}` : ""}
                </li>
              ))}
            </ol>
          </section>

          {c.setup && (
            <section>
              <h2 className="mb-2 text-sm font-semibold">Setup</h2>
              <div className="mb-3">
                <SafetyNote />
              </div>
              <Table head={["Setting", "Value", "From", "Why"]}>
                {Object.keys(SETUP_LABELS)
                  .map((key) => [key, c.setup![key as keyof typeof c.setup]] as const)
                  .map(
                    ([key, setting]) =>
                      setting && (
                        <tr key={key} data-testid={`setup-${key}`}>
                          <Td>{SETUP_LABELS[key] ?? key}</Td>
                          <Td mono>
                            {setting.value} {setting.unit}
                          </Td>
                          <Td>
                            <Badge value={setting.source === "given" ? "released" : "draft"} label={setting.source} />
                          </Td>
                          <Td className="text-ink-muted">{setting.why}</Td>
                        </tr>
                      ),
                  )}
              </Table>
              {c.force && (
                <p className="mt-2 text-sm text-ink-muted">
                  Force:{" "}
                  <span className="font-mono text-ink">
                    {c.force.required} {c.force.unit}
                  </span>{" "}
                  of{" "}
                  <span className="font-mono text-ink">
                    {c.force.rated} {c.force.unit}
                  </span>{" "}
                  rated ({c.force.capacityUsedPct} %); with dull blades about{" "}
                  <span className="font-mono text-ink">
                    {c.force.dullBlade.required} {c.force.unit}
                  </span>{" "}
                  ({c.force.dullBlade.capacityUsedPct} %). Thickest {p.grade} this shear takes:{" "}
                  {c.force.maxThicknessForGrade.value} {c.force.maxThicknessForGrade.unit} (
                  {c.force.maxThicknessForGrade.why})
                </p>
              )}
            </section>
          )}
        </div>

        <aside className="space-y-6">
          <section className="rounded-md border border-scale-200 bg-white p-4 text-sm">
            <h2 className="mb-2 font-semibold">Yield</h2>
            {c.yield ? (
              <dl className="grid grid-cols-2 gap-y-1">
                <dt className="text-ink-muted">Sheets</dt>
                <dd className="font-mono">{c.yield.sheets}</dd>
                <dt className="text-ink-muted">Blanks</dt>
                <dd className="font-mono">{c.yield.total.blanks}</dd>
                <dt className="text-ink-muted">Strokes</dt>
                <dd className="font-mono">{c.yield.total.strokes}</dd>
                <dt className="text-ink-muted">Offcut pieces</dt>
                <dd className="font-mono">{c.yield.total.offcutPieces}</dd>
                <dt className="text-ink-muted">Stock used</dt>
                <dd className="font-mono">{c.yield.utilisationPct} %</dd>
              </dl>
            ) : (
              <p className="text-ink-muted">Not worked out (see findings).</p>
            )}
            {c.yield?.blanks.map((b, i) => (
              <p key={i} className="mt-1 font-mono text-xs text-ink-muted">
                {b.count} × {b.width} × {b.length} {c.yield!.lengthUnit}
              </p>
            ))}
          </section>
          <section className="rounded-md border border-scale-200 bg-white p-4 text-sm">
            <h2 className="mb-2 font-semibold">Estimate</h2>
            {c.estimate ? (
              <dl className="grid grid-cols-2 gap-y-1">
                <dt className="text-ink-muted">Strokes</dt>
                <dd className="font-mono">{c.estimate.seconds.strokes} s</dd>
                <dt className="text-ink-muted">Backgauge moves</dt>
                <dd className="font-mono">{c.estimate.seconds.backgauge} s</dd>
                <dt className="text-ink-muted">Turning pieces</dt>
                <dd className="font-mono">{c.estimate.seconds.turns} s</dd>
                <dt className="text-ink-muted">Loading sheets</dt>
                <dd className="font-mono">{c.estimate.seconds.sheets} s</dd>
                <dt className="font-medium">Total</dt>
                <dd className="font-mono font-medium">{(c.estimate.seconds.total / 60).toFixed(1)} min</dd>
              </dl>
            ) : (
              <p className="text-ink-muted">Not worked out.</p>
            )}
          </section>
          {(p.status === "draft" || ["released", "claimed", "running"].includes(p.status)) && (
            <section className="rounded-md border border-scale-200 bg-white p-4">
              <h2 className="mb-2 text-sm font-semibold">Actions</h2>
              {mayRelease ? (
                <ProgramActions
                  id={p.id}
                  reference={p.reference}
                  shearName={shearName}
                  status={p.status}
                  errors={errors.length}
                  canCancel
                  warnings={warnings.map((code) => ({
                    code,
                    message: c.findings.find((f) => f.code === code)?.message ?? code,
                  }))}
                />
              ) : (
                <p className="text-sm text-ink-muted">
                  Your role ({member.role}) can read programs; admins and owners release and cancel them.
                </p>
              )}
            </section>
          )}
          <section>
            <h2 className="mb-2 text-sm font-semibold">History</h2>
            <ol className="space-y-1 text-xs">
              {history.data
                .slice()
                .reverse()
                .map((e) => (
                  <li key={e.id} className="flex justify-between gap-2">
                    <span className="font-mono">{e.type}</span>
                    <span className="text-ink-muted">{when(e.createdAt)}</span>
                  </li>
                ))}
            </ol>
          </section>
        </aside>
      </div>
    </>
  );
}
