import Link from "next/link";
import { EventsTable } from "@/components/console/EventsTable";
import { PageHeader } from "@/components/ui";
import { currentMember } from "@/lib/auth/session";
import { EVENT_TYPES, isEventType } from "@/lib/schemas/enums";

export const metadata = { title: "Events" };

export default async function Events({ searchParams }: { searchParams: Promise<{ type?: string }> }) {
  await currentMember();
  const query = await searchParams;
  const type = isEventType(query.type) ? query.type : undefined;
  return (
    <>
      <PageHeader
        title="Events"
        lead="Everything that happened in your shop, newest first. Each is delivered to the endpoints that chose its type."
      />
      <nav className="mb-3 flex flex-wrap gap-1 text-xs" aria-label="Filter by type">
        <Link href="/console/events" className={`rounded px-2 py-1 ${!type ? "bg-ink text-scale-50" : "bg-scale-200"}`}>
          all
        </Link>
        {EVENT_TYPES.map((eventType) => (
          <Link
            key={eventType}
            href={`/console/events?type=${eventType}`}
            className={`rounded px-2 py-1 font-mono ${type === eventType ? "bg-ink text-scale-50" : "bg-scale-200"}`}
          >
            {eventType}
          </Link>
        ))}
      </nav>
      <EventsTable type={type} />
    </>
  );
}
