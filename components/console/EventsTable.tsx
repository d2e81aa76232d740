"use client";

import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { Moment } from "@/components/ui";
import { LiveTable } from "./LiveTable";

interface Row {
  id: string;
  type: string;
  subjectId: string;
  about: { label: string; href: string | null };
  createdAt: string;
}
const col = createColumnHelper<Row>();
const columns = [
  col.accessor("createdAt", {
    header: "When",
    cell: (c) => <Moment value={c.getValue()} />,
  }),
  col.accessor("type", { header: "Type", cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
  col.accessor((row) => row.about.label, {
    id: "about",
    header: "About",
    cell: (cell) => {
      const { about, subjectId } = cell.row.original;
      return (
        <span>
          {about.href ? (
            <Link className="text-edge hover:underline" href={about.href}>
              {about.label}
            </Link>
          ) : (
            about.label
          )}
          <br />
          <span className="font-mono text-[11px] text-ink-muted">{subjectId}</span>
        </span>
      );
    },
  }),
  col.accessor("id", {
    header: "Event id",
    cell: (cell) => (
      <Link className="font-mono text-xs text-edge hover:underline" href={`/console/events/${cell.getValue()}`}>
        {cell.getValue()}
      </Link>
    ),
  }),
];

export function EventsTable({ type }: { type?: string }) {
  return (
    <LiveTable<Row>
      url={`/console/data/events${type ? `?type=${type}` : ""}`}
      columns={columns}
      noun="events"
      empty="No events yet. They appear as programs are created, released and run, and as plans end; add a webhook endpoint to receive them."
      testId="event-row"
    />
  );
}
