import Link from "next/link";
import { notFound } from "next/navigation";
import { CutDrawing } from "@/components/console/CutDrawing";
import { WritePrograms } from "@/components/console/PlanActions";
import { PlanProgress } from "@/components/console/PlanProgress";
import { groupName, sheetsHint } from "@/components/console/words";
import { SafetyNote } from "@/components/SafetyNote";
import { RoutingNote } from "@/components/console/RoutingNote";
import { Badge, PageHeader, Stat, Table, Td } from "@/components/ui";
import { ApiError } from "@/lib/errors";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { PLAN_OBJECTIVE_LABELS } from "@/lib/schemas/enums";
import type { PlanResultT } from "@/lib/schemas/plan-result";
import { Program } from "@/entities";
import { getPlan } from "@/lib/services/plans";
import { programLayout } from "@/lib/shear";

export const metadata = { title: "Plan" };

const fmtTime = (seconds: number) =>
  seconds >= 3600
    ? `${Math.floor(seconds / 3600)} h ${Math.round((seconds % 3600) / 60)} min`
    : `${Math.round(seconds / 60)} min`;

export default async function PlanPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await currentMember();
  const em = await requestEm();
  const view = await getPlan(em, member.shopId, id).catch((err) => {
    if (err instanceof ApiError && err.status === 404) notFound();
    throw err;
  });
  const units = view.units;
  const header = (badge: { value: string; label: string }, objective?: string) => (
    <>
      <p className="mb-1 text-xs">
        <Link href="/console/plans" className="text-edge hover:underline">
          ← Plans
        </Link>
      </p>
      <PageHeader
        title={`${view.reference ?? view.id}${view.title ? ` · ${view.title}` : ""}`}
        lead={
          <span className="font-mono text-xs">
            {view.id} · {view.grade} ·{" "}
            {"gauge" in view.thickness ? `${view.thickness.gauge} ga` : `${view.thickness.value} ${units}`}
            {objective ? ` · ${objective}` : ""}
          </span>
        }
      >
        <Badge value={badge.value} label={badge.label} />
      </PageHeader>
    </>
  );
  if (view.status !== "complete" || !view.result) {
    return (
      <>
        {header({
          value: view.status === "failed" ? "fail" : view.status === "cancelled" ? "cancelled" : "running",
          label: view.status,
        })}
        <PlanProgress
          id={view.id}
          initial={{
            status: view.status,
            progress: view.progress,
            failure: view.failure,
            attempts: view.attempts,
            startedAt: view.startedAt,
          }}
          canCancel={can(member.role, "programs:write")}
        />
      </>
    );
  }
  const plan: PlanResultT & { id: string; reference: string | null; programs: { pattern: string; id: string }[] } = {
    ...view.result,
    id: view.id,
    reference: view.reference,
    programs: view.programs,
  };
  const totals = plan.summary;
  const written = new Map(plan.programs.map((p) => [p.pattern, p.id]));
  const programs = new Map(
    (plan.programs.length
      ? await em.find(
          Program,
          { id: { $in: plan.programs.map((p) => p.id) }, shop: member.shopId },
          { fields: ["reference", "status"] },
        )
      : []
    ).map((p) => [p.id, { reference: p.reference, status: p.status }]),
  );

  return (
    <>
      {header(
        {
          value: plan.coverage === "complete" ? "pass" : "warn",
          label: plan.coverage === "complete" ? "complete" : "partial",
        },
        `${PLAN_OBJECTIVE_LABELS[plan.options.objective]}${plan.options.trim ? ` · trim ${plan.options.trim} ${units}` : ""}`,
      )}

      <div className="mb-6 grid gap-3 sm:grid-cols-3 lg:grid-cols-6">
        <Stat
          label="Sheets"
          value={totals.sheets}
          hint={[`${totals.patterns} pattern${totals.patterns === 1 ? "" : "s"}`, sheetsHint(totals)]
            .filter(Boolean)
            .join(" · ")}
        />
        <Stat
          label="Blanks"
          value={`${totals.blanksPlanned} / ${totals.blanksAsked}`}
          hint={totals.short ? `${totals.short} not planned` : totals.extra ? `${totals.extra} extra` : "as asked"}
        />
        <Stat
          label="Stock used"
          value={`${totals.utilisationPct} %`}
          hint={
            plan.options.reusableOffcut ? `${totals.netUtilisationPct} % less kept offcuts` : "blank area ÷ sheet area"
          }
        />
        <Stat label="Strokes" value={totals.strokes} />
        <Stat label="Turns" value={totals.turns} />
        <Stat label="Estimate" value={fmtTime(totals.estimateSeconds)} hint="at the shear, all sheets" />
      </div>

      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <div className="space-y-6">
          {view.routing && <RoutingNote routing={view.routing} />}
          {plan.findings.length > 0 && (
            <section>
              <h2 className="mb-2 text-sm font-semibold">Findings</h2>
              <Table head={["Severity", "Code", "Where", "Message"]}>
                {plan.findings.map((finding, index) => (
                  <tr key={index}>
                    <Td>
                      <Badge value={finding.severity} />
                    </Td>
                    <Td mono>{finding.code}</Td>
                    <Td mono>{finding.pointer}</Td>
                    <Td>{finding.message}</Td>
                  </tr>
                ))}
              </Table>
            </section>
          )}

          <SafetyNote />

          {plan.patterns.map((pattern) => {
            const faulty = [
              ...new Set(
                pattern.check.findings
                  .map((f) => /^\/cuts\/(\d+)/.exec(f.pointer)?.[1])
                  .filter(Boolean)
                  .map(Number),
              ),
            ];
            // Strips and pieces come as runs (repeat, count): each copy is one width or one length further on.
            const marks = pattern.strips.flatMap((strip) =>
              Array.from({ length: strip.repeat }, (_, stripCopy) =>
                strip.pieces.flatMap((piece) =>
                  Array.from({ length: piece.count }, (_, pieceCopy) => ({
                    x: piece.x + pieceCopy * piece.length,
                    y: piece.y + stripCopy * strip.width,
                    length: piece.length,
                    width: piece.width,
                    text: piece.label,
                  })),
                ),
              ).flat(),
            );
            const reusable = pattern.offcuts
              .filter((offcut) => offcut.reusable)
              .map((offcut) => ({ x: offcut.x, y: offcut.y, length: offcut.length, width: offcut.width }));
            const programId = written.get(pattern.key);
            return (
              <section key={pattern.key} data-testid={`pattern-${pattern.key}`}>
                <h2 className="mb-2 flex flex-wrap items-baseline gap-2 text-sm font-semibold">
                  Pattern {pattern.key} · {pattern.repeats} sheet{pattern.repeats === 1 ? "" : "s"} of{" "}
                  {plan.stock[pattern.stock].length} × {plan.stock[pattern.stock].width} {units}
                  <span className="font-normal text-ink-muted">
                    {pattern.rotated ? "width to the blade · " : ""}
                    {pattern.utilisationPct} % used · {pattern.strokes} stroke{pattern.strokes === 1 ? "" : "s"},{" "}
                    {pattern.turns} turn
                    {pattern.turns === 1 ? "" : "s"} per sheet
                  </span>
                  <Badge value={pattern.check.validation} label={`check: ${pattern.check.validation}`} />
                  {programId && (
                    <Link href={`/console/programs/${programId}`} className="font-normal text-edge hover:underline">
                      program →
                    </Link>
                  )}
                </h2>
                <CutDrawing
                  sheet={pattern.sheet}
                  layout={programLayout({ units: units, sheet: { ...pattern.sheet, count: 1 }, cuts: pattern.cuts })}
                  units={units}
                  faultyGroups={faulty}
                  marks={marks}
                  reusable={reusable}
                />
                <details className="mt-2 text-xs text-ink-muted">
                  <summary className="cursor-pointer">
                    The program: {pattern.cuts.length} groups
                    {pattern.check.findings.length
                      ? ` · ${pattern.check.findings.length} finding${pattern.check.findings.length === 1 ? "" : "s"}`
                      : ""}
                  </summary>
                  <ol className="mt-1 space-y-0.5">
                    {pattern.cuts.map((cut, index) => (
                      <li key={index} className={faulty.includes(index) ? "text-fault" : ""}>
                        <span className="font-medium">{groupName(index)}</span>: {cut.count} stroke
                        {cut.count === 1 ? "" : "s"} at {cut.backgauge} {units}
                        {cut.note ? ` · ${cut.note}` : ""}
                      </li>
                    ))}
                  </ol>
                  {pattern.check.findings.map((finding, index) => (
                    <p key={index} className={finding.severity === "error" ? "text-fault" : "text-caution-dark"}>
                      {finding.code}: {finding.message}
                    </p>
                  ))}
                </details>
              </section>
            );
          })}
        </div>

        <aside className="space-y-6">
          {plan.programs.length ? (
            <section className="rounded-md border border-scale-200 bg-white p-4 text-sm" data-testid="plan-programs">
              <h2 className="mb-2 font-semibold">Programs written</h2>
              <ul className="space-y-1">
                {plan.programs.map((entry) => {
                  const program = programs.get(entry.id);
                  return (
                    <li key={entry.id} className="flex flex-wrap items-center gap-2">
                      <Link href={`/console/programs/${entry.id}`} className="text-edge hover:underline">
                        {program?.reference ?? entry.id}
                      </Link>
                      {program && <Badge value={program.status} />}
                      <span className="text-xs text-ink-muted">pattern {entry.pattern}</span>
                    </li>
                  );
                })}
              </ul>
            </section>
          ) : plan.patterns.length && can(member.role, "programs:write") ? (
            <WritePrograms plan={plan.id} defaultPrefix={plan.reference ?? plan.id} patterns={plan.patterns.length} />
          ) : null}

          <section className="rounded-md border border-scale-200 bg-white p-4 text-sm">
            <h2 className="mb-2 font-semibold">Demand</h2>
            <Table head={["Blank", "Size", "Asked", "Planned"]}>
              {plan.blanks.map((blank, index) => (
                <tr key={index}>
                  <Td>
                    {blank.label}
                    {blank.canTurn ? (
                      ""
                    ) : (
                      <span className="text-ink-muted" title="keeps the sheet's direction: grain or finish">
                        {" "}
                        (not turned)
                      </span>
                    )}
                  </Td>
                  <Td mono>
                    {blank.length} × {blank.width}
                  </Td>
                  <Td mono>{blank.quantity}</Td>
                  <Td mono className={blank.short ? "text-fault" : blank.extra ? "text-caution-dark" : ""}>
                    {blank.planned}
                    {blank.short ? ` (−${blank.short})` : blank.extra ? ` (+${blank.extra})` : ""}
                  </Td>
                </tr>
              ))}
            </Table>
          </section>

          <section className="rounded-md border border-scale-200 bg-white p-4 text-sm">
            <h2 className="mb-2 font-semibold">Stock</h2>
            <ul className="space-y-0.5 font-mono text-xs">
              {plan.stock.map((st, index) => (
                <li key={index}>
                  {st.length} × {st.width} {units}: {st.used} used{st.count !== null ? ` of ${st.count}` : ""}
                </li>
              ))}
            </ul>
            {plan.reusableOffcuts.length > 0 && (
              <>
                <h3 className="mb-1 mt-3 font-semibold">Offcuts to keep</h3>
                <ul className="space-y-0.5 font-mono text-xs">
                  {plan.reusableOffcuts.map((reusableOffcut, index) => (
                    <li key={index}>
                      {reusableOffcut.count} × {reusableOffcut.length} × {reusableOffcut.width} {units}
                    </li>
                  ))}
                </ul>
              </>
            )}
          </section>
        </aside>
      </div>
    </>
  );
}
