import Link from "next/link";
import { RequestsChart } from "@/components/console/RequestsChart";
import { Badge, PageHeader, Stat } from "@/components/ui";
import { PROGRAM_STATUSES } from "@/entities/Program";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { overview } from "@/lib/services/overview";

export const metadata = { title: "Overview" };

const SETUP_STEPS = [
  {
    key: "shear",
    label: "Add a shear",
    href: "/console/shears",
    why: "its capacity, blade, backgauge and gap range: every check runs against it",
  },
  {
    key: "grades",
    label: "Check the grades",
    href: "/console/grades",
    why: "the materials programs may name, with the strengths the force and gap come from",
  },
  {
    key: "key",
    label: "Create an API key",
    href: "/console/keys",
    why: "for the ERP (and one for each gateway beside a shear)",
  },
  {
    key: "endpoint",
    label: "Add a webhook endpoint",
    href: "/console/webhooks",
    why: "where the ERP hears that programs ran and plans ended",
  },
  {
    key: "program",
    label: "Send a first program",
    href: "/docs",
    why: "POST /api/v1/programs (the reference has a quickstart), or upload a cut list",
  },
  {
    key: "released",
    label: "Release it to the shear",
    href: "/console/programs",
    why: "once its check passes; the gateway beside the shear claims it",
  },
] as const;

export default async function Overview() {
  const member = await currentMember();
  const summary = await overview(await requestEm(), member.shopId);
  return (
    <>
      <PageHeader
        title="Overview"
        lead={`${member.shopName}: the last hour of API traffic, the last day of webhook deliveries, and every program by state.`}
      />
      {!Object.values(summary.setup).every(Boolean) && (
        <section className="mb-6 rounded-md border border-edge/40 bg-white p-4" data-testid="setup-checklist">
          <h2 className="text-sm font-semibold">Getting this shop going</h2>
          <ol className="mt-2 space-y-1 text-sm">
            {SETUP_STEPS.map((step) => (
              <li key={step.key} className="flex items-start gap-2">
                <span
                  aria-hidden="true"
                  className={`mt-0.5 inline-flex h-4 w-4 shrink-0 items-center justify-center rounded-full text-[10px] ${summary.setup[step.key] ? "bg-ok text-white" : "border border-scale-400"}`}
                >
                  {summary.setup[step.key] ? "✓" : ""}
                </span>
                <span className={summary.setup[step.key] ? "text-ink-muted line-through decoration-scale-400" : ""}>
                  <Link href={step.href} className="text-edge hover:underline">
                    {step.label}
                  </Link>
                  <span className="sr-only">{summary.setup[step.key] ? " (done)" : " (to do)"}</span>: {step.why}
                </span>
              </li>
            ))}
          </ol>
        </section>
      )}
      <section className="grid grid-cols-2 gap-3 lg:grid-cols-4">
        <Stat label="API requests, last hour" value={summary.requestsLastHour} />
        <Stat label="Error rate" value={`${summary.errorRatePct} %`} hint="5xx and 429 answers" />
        <Stat
          label="Deliveries succeeded, 24 h"
          value={summary.deliverySuccessPct === null ? "—" : `${summary.deliverySuccessPct} %`}
          hint={`${summary.failedDeliveries} gave up`}
        />
        <Stat
          label="Endpoints disabled"
          value={summary.disabledEndpoints}
          hint={summary.disabledEndpoints ? "see Webhooks" : "all receiving"}
        />
      </section>
      <section className="mt-6 rounded-md border border-scale-200 bg-white p-4">
        <h2 className="text-sm font-semibold">Requests per minute (UTC)</h2>
        <div className="mt-3">
          <RequestsChart data={summary.requestsPerMinute} />
        </div>
      </section>
      <section className="mt-6">
        <h2 className="mb-2 text-sm font-semibold">Programs by state</h2>
        <div className="flex flex-wrap gap-2">
          {PROGRAM_STATUSES.map((programStatus) => (
            <Link
              key={programStatus}
              href={`/console/programs?status=${programStatus}`}
              className="flex items-center gap-2 rounded-md border border-scale-200 bg-white px-3 py-2 hover:border-ink"
            >
              <Badge value={programStatus} />{" "}
              <span className="font-mono">{summary.programsByStatus[programStatus] ?? 0}</span>
            </Link>
          ))}
        </div>
      </section>
    </>
  );
}
