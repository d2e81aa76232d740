"use client";

import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { when } from "@/components/ui";
import { LiveTable } from "./LiveTable";

interface Row { id: string; type: string; subjectId: string; createdAt: string }
const col = createColumnHelper<Row>();
const columns = [
  col.accessor("createdAt", { header: "When", cell: (c) => <span className="font-mono text-xs">{when(c.getValue())}</span> }),
  col.accessor("type", { header: "Type", cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
  col.accessor("subjectId", {
    header: "About",
    cell: (c) => c.getValue().startsWith("prg_")
      ? <Link className="font-mono text-xs text-edge hover:underline" href={`/console/programs/${c.getValue()}`}>{c.getValue()}</Link>
      : <span className="font-mono text-xs">{c.getValue()}</span>,
  }),
  col.accessor("id", { header: "Event id", cell: (c) => <Link className="font-mono text-xs text-edge hover:underline" href={`/console/events/${c.getValue()}`}>{c.getValue()}</Link> }),
];

export function EventsTable({ type }: { type?: string }) {
  return <LiveTable<Row> url={`/console/data/events${type ? `?type=${type}` : ""}`} columns={columns} empty="No events yet." testId="event-row" />;
}
