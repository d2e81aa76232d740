import Link from "next/link";
import { Badge, PageHeader, Table, Td, when } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listPlans } from "@/lib/services/plans";
import { textProblem } from "@/lib/text";

export const metadata = { title: "Plans" };

export default async function Plans({ searchParams }: { searchParams: Promise<{ search?: string; cursor?: string }> }) {
  const member = await currentMember();
  const query = await searchParams;
  const search = query.search?.trim().slice(0, 100) || undefined;
  const unsafe = [search, query.cursor].some((v) => v && textProblem(v));
  const { data, next_cursor } = unsafe
    ? { data: [], next_cursor: null }
    : await listPlans(await requestEm(), member.shopId, { limit: 50, search, cursor: query.cursor }).catch(() => ({
        data: [],
        next_cursor: null,
      }));
  return (
    <>
      <PageHeader
        title="Plans"
        lead="Order lines laid out on the stock on hand in patterns your shear can cut, and the draft programs written from them."
      >
        {can(member.role, "programs:write") && (
          <Link href="/console/plans/new" className="rounded-md bg-ink px-3 py-1.5 text-sm font-medium text-scale-50">
            New plan
          </Link>
        )}
      </PageHeader>
      <form className="mb-3 flex flex-wrap items-end gap-2 text-sm" role="search">
        <label className="grid gap-0.5 text-xs">
          Reference or title contains
          <input
            name="search"
            defaultValue={search ?? ""}
            maxLength={100}
            className="rounded border border-scale-300 bg-white px-2 py-1 text-sm"
          />
        </label>
        <button className="rounded-md bg-ink px-3 py-1.5 text-scale-50">Show</button>
        {search && (
          <Link href="/console/plans" className="text-xs text-edge">
            Clear
          </Link>
        )}
      </form>
      <Table
        head={["Plan", "Created", "Status", "Sheets", "Patterns", "Blanks", "Stock used", "Programs"]}
        empty={
          search
            ? "No plans match."
            : "No plans yet. Send one to POST /api/v1/plans, or start one here with a cut list."
        }
      >
        {data.map((plan) => (
          <tr key={plan.id}>
            <Td>
              <Link href={`/console/plans/${plan.id}`} className="text-edge hover:underline">
                {plan.reference ?? plan.id}
              </Link>
              {plan.title ? <span className="text-ink-muted"> · {plan.title}</span> : null}
            </Td>
            <Td className="text-ink-muted">{when(plan.createdAt)}</Td>
            <Td>
              {plan.status === "complete" ? (
                <Badge
                  value={plan.coverage === "complete" ? "pass" : "warn"}
                  label={plan.coverage === "complete" ? "complete" : "partial"}
                />
              ) : (
                <Badge
                  value={
                    plan.status === "running" || plan.status === "queued"
                      ? "running"
                      : plan.status === "failed"
                        ? "fail"
                        : "cancelled"
                  }
                  label={plan.status}
                />
              )}
            </Td>
            <Td mono>{plan.summary?.sheets ?? "—"}</Td>
            <Td mono>{plan.summary?.patterns ?? (plan.progress ? `${plan.progress.patterns}…` : "—")}</Td>
            <Td mono>
              {plan.summary
                ? `${plan.summary.blanksPlanned} / ${plan.summary.blanksAsked}`
                : plan.progress
                  ? `${plan.progress.piecesPlaced} / ${plan.progress.piecesWanted}…`
                  : "—"}
            </Td>
            <Td mono>{plan.summary ? `${plan.summary.utilisationPct} %` : "—"}</Td>
            <Td>
              {plan.programs.length ? (
                `${plan.programs.length} written`
              ) : (
                <span className="text-ink-muted">not yet</span>
              )}
            </Td>
          </tr>
        ))}
      </Table>
      <p className="mt-2 flex gap-3 text-xs">
        {query.cursor && (
          <Link className="text-edge" href={`/console/plans${search ? `?search=${encodeURIComponent(search)}` : ""}`}>
            Newest
          </Link>
        )}
        {next_cursor && (
          <Link
            className="text-edge"
            href={`/console/plans?${new URLSearchParams({ ...(search ? { search } : {}), cursor: next_cursor })}`}
          >
            Older plans →
          </Link>
        )}
      </p>
    </>
  );
}
