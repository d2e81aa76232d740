import { PageHeader } from "@/components/ui";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { listKeys } from "@/lib/services/keys";
import { routesSeen, type LogFilter } from "@/lib/services/logs";
import { RequestTable } from "@/components/console/RequestTable";

export const metadata = { title: "Request log" };

const HOURS = { "1": "last hour", "24": "last day", "168": "last week" } as const;

export default async function Logs({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const member = await currentMember();
  const query = await searchParams;
  const em = await requestEm();
  const hours = query.hours && query.hours in HOURS ? Number(query.hours) : 24;
  const filter: Pick<LogFilter, "statusClass"> = {
    statusClass: ["2xx", "3xx", "4xx", "5xx"].includes(query.status ?? "")
      ? (query.status as LogFilter["statusClass"])
      : undefined,
  };
  const [keys, routes] = await Promise.all([listKeys(em, member.shopId), routesSeen(em, member.shopId)]);
  const keyName = new Map(keys.map((k) => [k.id, `${k.name} (${k.prefix}…)`]));
  return (
    <>
      <PageHeader
        title="Request log"
        lead="Every API call with a key of this shop: who, what, how it went. Bodies and secrets are never logged."
      />
      <form className="mb-3 flex flex-wrap items-end gap-2 text-sm" role="search">
        <label className="grid gap-0.5 text-xs">
          Request id
          <input
            name="id"
            defaultValue={query.id ?? ""}
            maxLength={64}
            placeholder="req_…"
            className="rounded border border-scale-300 bg-white px-2 py-1 font-mono text-sm"
          />
        </label>
        <label className="grid gap-0.5 text-xs">
          Key
          <select
            name="key"
            defaultValue={query.key ?? ""}
            className="rounded border border-scale-300 px-2 py-1 text-sm"
          >
            <option value="">any</option>
            {keys.map((key) => (
              <option key={key.id} value={key.id}>
                {keyName.get(key.id)}
              </option>
            ))}
          </select>
        </label>
        <label className="grid gap-0.5 text-xs">
          Route
          <select
            name="route"
            defaultValue={query.route ?? ""}
            className="rounded border border-scale-300 px-2 py-1 text-sm"
          >
            <option value="">any</option>
            {routes.map((r) => (
              <option key={r}>{r}</option>
            ))}
          </select>
        </label>
        <label className="grid gap-0.5 text-xs">
          Status
          <select
            name="status"
            defaultValue={query.status ?? ""}
            className="rounded border border-scale-300 px-2 py-1 text-sm"
          >
            <option value="">any</option>
            {["2xx", "3xx", "4xx", "5xx"].map((s) => (
              <option key={s}>{s}</option>
            ))}
          </select>
        </label>
        <label className="grid gap-0.5 text-xs">
          Time
          <select
            name="hours"
            defaultValue={String(hours)}
            className="rounded border border-scale-300 px-2 py-1 text-sm"
          >
            {Object.entries(HOURS).map(([span, label]) => (
              <option key={span} value={span}>
                {label}
              </option>
            ))}
          </select>
        </label>
        <button className="rounded-md bg-ink px-3 py-1.5 text-scale-50">Filter</button>
      </form>
      <RequestTable
        query={new URLSearchParams({
          hours: String(hours),
          ...(query.id ? { id: query.id.trim().slice(0, 64) } : {}),
          ...(query.key ? { key: query.key } : {}),
          ...(query.route ? { route: query.route } : {}),
          ...(filter.statusClass ? { status: filter.statusClass } : {}),
        }).toString()}
        keyNames={Object.fromEntries(keyName)}
      />
      <p className="mt-2 text-xs text-ink-muted">
        50 to a page, newest first; the first page refreshes every 5 seconds. A request id finds its request at any age.
        Click a column to sort the page.
      </p>
    </>
  );
}
