import Link from "next/link";
import { RequestsChart } from "@/components/console/RequestsChart";
import { Badge, PageHeader, Stat } from "@/components/ui";
import { PROGRAM_STATUSES } from "@/entities/Program";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { overview } from "@/lib/services/overview";

export const metadata = { title: "Overview" };

export default async function Overview() {
  const member = await currentMember();
  const o = await overview(await requestEm(), member.shopId);
  return (
    <>
      <PageHeader title="Overview" lead={`${member.shopName}: the last hour of API traffic, the last day of webhook deliveries, and every program by state.`} />
      <section className="grid grid-cols-2 gap-3 lg:grid-cols-4">
        <Stat label="API requests, last hour" value={o.requestsLastHour} />
        <Stat label="Error rate" value={`${o.errorRatePct} %`} hint="5xx and 429 answers" />
        <Stat label="Deliveries succeeded, 24 h" value={o.deliverySuccessPct === null ? "—" : `${o.deliverySuccessPct} %`} hint={`${o.failedDeliveries} gave up`} />
        <Stat label="Endpoints disabled" value={o.disabledEndpoints} hint={o.disabledEndpoints ? "see Webhooks" : "all receiving"} />
      </section>
      <section className="mt-6 rounded-md border border-scale-200 bg-white p-4">
        <h2 className="text-sm font-semibold">Requests per minute (UTC)</h2>
        <div className="mt-3"><RequestsChart data={o.requestsPerMinute} /></div>
      </section>
      <section className="mt-6">
        <h2 className="mb-2 text-sm font-semibold">Programs by state</h2>
        <div className="flex flex-wrap gap-2">
          {PROGRAM_STATUSES.map((s) => (
            <Link key={s} href={`/console/programs?status=${s}`} className="flex items-center gap-2 rounded-md border border-scale-200 bg-white px-3 py-2 hover:border-ink">
              <Badge value={s} /> <span className="font-mono">{o.programsByStatus[s] ?? 0}</span>
            </Link>
          ))}
        </div>
      </section>
    </>
  );
}
