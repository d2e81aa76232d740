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
import { findProgram, readProgramLayout } from "@/lib/services/programs";
import { viewProgram } from "@/lib/services/program-view";
import { listEvents } from "@/lib/services/webhooks";

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
  const program = viewProgram(entity);
  const check = program.check;
  const shear = await em.findOne(Shear, { id: program.shear }, { fields: ["name"] });
  const shearName = shear?.name ?? program.shear;
  const { layout } = await readProgramLayout(em, entity);
  const errors = check.findings.filter((f) => f.severity === "error");
  const history = await listEvents(em, member.shopId, { limit: 100, subject: program.id });
  const faultyGroups = [
    ...new Set(
      check.findings
        .map((f) => /^\/cuts\/(\d+)/.exec(f.pointer)?.[1])
        .filter(Boolean)
        .map(Number),
    ),
  ];
  const warnings = [...new Set(check.findings.filter((f) => f.severity === "warning").map((f) => f.code))];
  const mayRelease = can(member.role, "programs:release");

  return (
    <>
      <p className="mb-1 text-xs">
        <Link href="/console/programs" className="text-edge hover:underline">
          ← Programs
        </Link>
      </p>
      <PageHeader
        title={`${program.reference}${program.title ? ` · ${program.title}` : ""}`}
        lead={
          <>
            <span className="block text-sm text-ink" data-testid="program-where">
              On{" "}
              <Link href={`/console/shears/${program.shear}`} className="text-edge hover:underline">
                {shearName}
              </Link>
              {" · "}
              {thicknessInWords(program.thickness, program.units, check.thickness)} {program.grade}
              {" · "}
              {program.sheet.count} sheet{program.sheet.count === 1 ? "" : "s"} of {program.sheet.length} ×{" "}
              {program.sheet.width} {program.units}
            </span>
            <span className="font-mono text-xs">
              {program.id} · revision {program.revision}
              {program.metadata.plan?.startsWith("pln_") && (
                <>
                  {" "}
                  ·{" "}
                  <Link href={`/console/plans/${program.metadata.plan}`} className="text-edge hover:underline">
                    pattern {program.metadata.pattern ?? "?"} of plan {program.metadata.plan}
                  </Link>
                </>
              )}
            </span>
          </>
        }
      >
        <Badge value={program.status} /> <Badge value={program.validation} label={`check: ${program.validation}`} />
      </PageHeader>

      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <div className="space-y-6">
          {program.routing && <RoutingNote routing={program.routing} />}
          <section>
            <h2 className="mb-2 text-sm font-semibold">Findings</h2>
            {check.findings.length === 0 ? (
              <p className="text-sm text-ok">No findings: the program fits this shear and grade.</p>
            ) : (
              <Table head={["Severity", "Where", "Message", "Limit", "Actual", "Code"]}>
                {check.findings.map((finding, index) => (
                  <tr key={index}>
                    <Td>
                      <Badge value={finding.severity} />
                    </Td>
                    <Td>
                      {pointerInWords(finding.pointer)}
                      <br />
                      <span className="font-mono text-xs text-ink-muted">{finding.pointer || "/"}</span>
                    </Td>
                    <Td>{finding.message}</Td>
                    <Td mono>
                      {finding.limit ?? "—"} {finding.limit !== null ? finding.unit : ""}
                    </Td>
                    <Td mono>
                      {finding.actual ?? "—"} {finding.actual !== null ? finding.unit : ""}
                    </Td>
                    <Td mono>{finding.code}</Td>
                  </tr>
                ))}
              </Table>
            )}
          </section>

          <section>
            <h2 className="mb-2 text-sm font-semibold">One sheet, as it is cut</h2>
            <CutDrawing sheet={program.sheet} layout={layout} units={program.units} faultyGroups={faultyGroups} />
            <ol className="mt-2 space-y-0.5 text-xs text-ink-muted">
              {program.cuts.map((cut, index) => (
                <li key={index} className={faultyGroups.includes(index) ? "text-fault" : ""}>
                  <span className="font-medium">{groupName(index)}</span>:{" "}
                  {cut.turn
                    ? cut.from !== undefined
                      ? `turn each piece of ${groupName(cut.from)}, then `
                      : "turn each piece, then "
                    : ""}
                  {cut.count} stroke{cut.count === 1 ? "" : "s"} at {cut.backgauge} {program.units}
                  {cut.length ? `, ${cut.length} ${program.units} long` : ""}
                  {cut.scrap ? " (trim)" : ""}
                  {cut.note ? ` · ${cut.note}` : ""}
                </li>
              ))}
            </ol>
          </section>

          {check.setup && (
            <section>
              <h2 className="mb-2 text-sm font-semibold">Setup</h2>
              <div className="mb-3">
                <SafetyNote />
              </div>
              <Table head={["Setting", "Value", "From", "Why"]}>
                {Object.keys(SETUP_LABELS)
                  .map((key) => [key, check.setup![key as keyof typeof check.setup]] as const)
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
              {check.force && (
                <p className="mt-2 text-sm text-ink-muted">
                  Force:{" "}
                  <span className="font-mono text-ink">
                    {check.force.required} {check.force.unit}
                  </span>{" "}
                  of{" "}
                  <span className="font-mono text-ink">
                    {check.force.rated} {check.force.unit}
                  </span>{" "}
                  rated ({check.force.capacityUsedPct} %); with dull blades about{" "}
                  <span className="font-mono text-ink">
                    {check.force.dullBlade.required} {check.force.unit}
                  </span>{" "}
                  ({check.force.dullBlade.capacityUsedPct} %). Thickest {program.grade} this shear takes:{" "}
                  {check.force.maxThicknessForGrade.value} {check.force.maxThicknessForGrade.unit} (
                  {check.force.maxThicknessForGrade.why})
                </p>
              )}
            </section>
          )}
        </div>

        <aside className="space-y-6">
          <section className="rounded-md border border-scale-200 bg-white p-4 text-sm">
            <h2 className="mb-2 font-semibold">Yield</h2>
            {check.yield ? (
              <dl className="grid grid-cols-2 gap-y-1">
                <dt className="text-ink-muted">Sheets</dt>
                <dd className="font-mono">{check.yield.sheets}</dd>
                <dt className="text-ink-muted">Blanks</dt>
                <dd className="font-mono">{check.yield.total.blanks}</dd>
                <dt className="text-ink-muted">Strokes</dt>
                <dd className="font-mono">{check.yield.total.strokes}</dd>
                <dt className="text-ink-muted">Offcut pieces</dt>
                <dd className="font-mono">{check.yield.total.offcutPieces}</dd>
                <dt className="text-ink-muted">Stock used</dt>
                <dd className="font-mono">{check.yield.utilisationPct} %</dd>
              </dl>
            ) : (
              <p className="text-ink-muted">Not worked out (see findings).</p>
            )}
            {check.yield?.blanks.map((blank, index) => (
              <p key={index} className="mt-1 font-mono text-xs text-ink-muted">
                {blank.count} × {blank.width} × {blank.length} {check.yield!.lengthUnit}
              </p>
            ))}
          </section>
          <section className="rounded-md border border-scale-200 bg-white p-4 text-sm">
            <h2 className="mb-2 font-semibold">Estimate</h2>
            {check.estimate ? (
              <dl className="grid grid-cols-2 gap-y-1">
                <dt className="text-ink-muted">Strokes</dt>
                <dd className="font-mono">{check.estimate.seconds.strokes} s</dd>
                <dt className="text-ink-muted">Backgauge moves</dt>
                <dd className="font-mono">{check.estimate.seconds.backgauge} s</dd>
                <dt className="text-ink-muted">Turning pieces</dt>
                <dd className="font-mono">{check.estimate.seconds.turns} s</dd>
                <dt className="text-ink-muted">Loading sheets</dt>
                <dd className="font-mono">{check.estimate.seconds.sheets} s</dd>
                <dt className="font-medium">Total</dt>
                <dd className="font-mono font-medium">{(check.estimate.seconds.total / 60).toFixed(1)} min</dd>
              </dl>
            ) : (
              <p className="text-ink-muted">Not worked out.</p>
            )}
          </section>
          {(program.status === "draft" || ["released", "claimed", "running"].includes(program.status)) && (
            <section className="rounded-md border border-scale-200 bg-white p-4">
              <h2 className="mb-2 text-sm font-semibold">Actions</h2>
              {mayRelease ? (
                <ProgramActions
                  id={program.id}
                  reference={program.reference}
                  shearName={shearName}
                  status={program.status}
                  errors={errors.length}
                  canCancel
                  warnings={warnings.map((code) => ({
                    code,
                    message: check.findings.find((f) => f.code === code)?.message ?? code,
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
                .map((item) => (
                  <li key={item.id} className="flex justify-between gap-2">
                    <span className="font-mono">{item.type}</span>
                    <span className="text-ink-muted">{when(item.createdAt)}</span>
                  </li>
                ))}
            </ol>
          </section>
        </aside>
      </div>
    </>
  );
}
