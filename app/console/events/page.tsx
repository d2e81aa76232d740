import Link from "next/link";
import { PageHeader, Table, Td, when } from "@/components/ui";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { EVENT_TYPES } from "@/lib/services/event-types";
import { listEvents } from "@/lib/services/webhooks";

export const metadata = { title: "Events" };

export default async function Events({ searchParams }: { searchParams: Promise<{ type?: string; cursor?: string }> }) {
  const member = await currentMember();
  const q = await searchParams;
  const type = (EVENT_TYPES as readonly string[]).includes(q.type ?? "") ? q.type : undefined;
  const page = await listEvents(await requestEm(), member.shopId, { limit: 50, type, cursor: q.cursor });
  return (
    <>
      <PageHeader title="Events" lead="Everything that happened in your shop, newest first. Each is delivered to the endpoints that chose its type." />
      <nav className="mb-3 flex flex-wrap gap-1 text-xs" aria-label="Filter by type">
        <Link href="/console/events" className={`rounded px-2 py-1 ${!type ? "bg-ink text-scale-50" : "bg-scale-200"}`}>all</Link>
        {EVENT_TYPES.map((t) => <Link key={t} href={`/console/events?type=${t}`} className={`rounded px-2 py-1 font-mono ${type === t ? "bg-ink text-scale-50" : "bg-scale-200"}`}>{t}</Link>)}
      </nav>
      <Table head={["When", "Type", "About", "Event id"]} empty="No events yet.">
        {page.data.map((e) => (
          <tr key={e.id}>
            <Td mono>{when(e.createdAt)}</Td>
            <Td mono>{e.type}</Td>
            <Td mono>{e.subjectId.startsWith("prg_") ? <Link className="text-edge hover:underline" href={`/console/programs/${e.subjectId}`}>{e.subjectId}</Link> : e.subjectId}</Td>
            <Td mono>{e.id}</Td>
          </tr>
        ))}
      </Table>
      {page.next_cursor && <Link className="mt-3 inline-block text-sm text-edge hover:underline" href={`/console/events?${new URLSearchParams({ ...(type ? { type } : {}), cursor: page.next_cursor })}`}>Older events →</Link>}
    </>
  );
}
