"use client";

import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { Badge, Moment } from "@/components/ui";
import { LiveTable } from "./LiveTable";

interface Row {
  id: string;
  reference: string;
  title: string | null;
  status: string;
  validation: string;
  findings: number;
  dueAt: string | null;
  updatedAt: string;
}
const col = createColumnHelper<Row>();
const columns = [
  col.accessor("reference", {
    header: "Reference",
    cell: (cell) => (
      <Link
        className="whitespace-nowrap font-mono text-edge hover:underline"
        href={`/console/programs/${cell.row.original.id}`}
      >
        {cell.getValue()}
      </Link>
    ),
  }),
  // state and check next to the reference: on a phone they are what is in view without scrolling
  col.accessor("status", { header: "State", cell: (c) => <Badge value={c.getValue()} /> }),
  col.accessor("validation", { header: "Check", cell: (c) => <Badge value={c.getValue()} /> }),
  // at least 12rem wide: on a phone the table scrolls sideways rather than a title wrapping word by word
  col.accessor("title", {
    header: "Title",
    cell: (c) => <span className="block min-w-48">{c.getValue() ?? "—"}</span>,
  }),
  col.accessor("findings", { header: "Findings", cell: (c) => <span className="font-mono">{c.getValue()}</span> }),
  col.accessor("dueAt", {
    header: "Due",
    cell: (c) => <Moment value={c.getValue()} />,
  }),
  col.accessor("updatedAt", {
    header: "Updated",
    cell: (c) => <Moment value={c.getValue()} />,
  }),
];

export function ProgramsTable({ status, search }: { status?: string; search?: string }) {
  const query = new URLSearchParams({ ...(status ? { status } : {}), ...(search ? { search } : {}) }).toString();
  return (
    <LiveTable<Row>
      url={`/console/data/programs${query ? `?${query}` : ""}`}
      columns={columns}
      noun="programs"
      empty={
        search || status
          ? "No programs match."
          : "No programs yet. Send one with POST /api/v1/programs, upload a cut list, or write them from a plan."
      }
      testId="program-row"
    />
  );
}
