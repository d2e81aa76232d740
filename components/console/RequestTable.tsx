"use client";

import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { Badge, Moment } from "@/components/ui";
import { LiveTable } from "./LiveTable";

interface Row {
  id: string;
  createdAt: string;
  method: string;
  path: string;
  status: number;
  latencyMs: number;
  keyId: string | null;
}
const col = createColumnHelper<Row>();

/** The request log, refreshed every 5 s, sortable by any column. */
export function RequestTable({ query, keyNames }: { query: string; keyNames: Record<string, string> }) {
  const mono = (v: string) => <span className="font-mono text-xs">{v}</span>;
  const columns = [
    col.accessor("createdAt", {
      header: "When",
      cell: (c) => <Moment value={c.getValue()} />,
    }),
    col.accessor("method", { header: "Method", cell: (c) => mono(c.getValue()) }),
    col.accessor("path", { header: "Path", cell: (c) => mono(c.getValue()) }),
    col.accessor("status", {
      header: "Status",
      cell: (cell) => (
        <Badge
          value={cell.getValue() < 300 ? "succeeded" : cell.getValue() < 500 ? "warning" : "error"}
          label={String(cell.getValue())}
        />
      ),
    }),
    col.accessor("latencyMs", { header: "Latency", cell: (c) => mono(`${c.getValue()} ms`) }),
    col.accessor("keyId", {
      header: "Key",
      cell: (c) => (c.getValue() ? (keyNames[c.getValue()!] ?? c.getValue()) : "—"),
    }),
    col.accessor("id", {
      header: "Request id",
      cell: (cell) => (
        <Link className="font-mono text-xs text-edge hover:underline" href={`/console/logs/${cell.getValue()}`}>
          {cell.getValue()}
        </Link>
      ),
    }),
  ];
  return (
    <LiveTable<Row>
      url={`/console/data/requests?${query}`}
      columns={columns}
      noun="requests"
      empty="No requests match. Calls to the API with a key of this shop appear here within a second."
      testId="request-row"
    />
  );
}
