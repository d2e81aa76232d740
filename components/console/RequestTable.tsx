"use client";

import { createColumnHelper, flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import { Badge, when } from "@/components/ui";

interface Row {
  id: string; createdAt: string; method: string; path: string; status: number; latencyMs: number; keyId: string | null; errorType: string | null;
}

const col = createColumnHelper<Row>();
const fetcher = async (url: string) => {
  const res = await fetch(url);
  if (!res.ok) throw new Error((await res.json().catch(() => ({}))).error ?? `HTTP ${res.status}`);
  return res.json() as Promise<{ data: Row[]; next_cursor: string | null }>;
};

/** The request log, refreshed every 5 s, sortable by any column. */
export function RequestTable({ query, keyNames }: { query: string; keyNames: Record<string, string> }) {
  const { data, error, isLoading } = useSWR(`/console/data/requests?${query}`, fetcher, { refreshInterval: 5000 });
  const [sorting, setSorting] = useState<SortingState>([]);
  const columns = [
    col.accessor("createdAt", { header: "When", cell: (c) => when(c.getValue()) }),
    col.accessor("method", { header: "Method" }),
    col.accessor("path", { header: "Path" }),
    col.accessor("status", { header: "Status", cell: (c) => <Badge value={c.getValue() < 300 ? "succeeded" : c.getValue() < 500 ? "warning" : "error"} label={String(c.getValue())} /> }),
    col.accessor("latencyMs", { header: "Latency", cell: (c) => `${c.getValue()} ms` }),
    col.accessor("keyId", { header: "Key", cell: (c) => (c.getValue() ? keyNames[c.getValue()!] ?? c.getValue() : "—") }),
    col.accessor("id", { header: "Request id", cell: (c) => <Link className="text-edge hover:underline" href={`/console/logs/${c.getValue()}`}>{c.getValue()}</Link> }),
  ];
  const table = useReactTable({ data: data?.data ?? [], columns, state: { sorting }, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel() });

  if (error) return <p role="alert" className="rounded-md bg-fault-light px-3 py-2 text-sm text-fault">{error.message}</p>;
  return (
    <div className="overflow-x-auto rounded-md border border-scale-200 bg-white">
      <table className="w-full text-left text-sm">
        <thead className="border-b border-scale-200 bg-scale-50 text-[11px] uppercase tracking-wide text-ink-muted">
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h) => (
                <th key={h.id} className="px-3 py-2 font-medium" aria-sort={h.column.getIsSorted() === "asc" ? "ascending" : h.column.getIsSorted() === "desc" ? "descending" : "none"}>
                  <button type="button" onClick={h.column.getToggleSortingHandler()} className="uppercase">
                    {flexRender(h.column.columnDef.header, h.getContext())}{{ asc: " ▲", desc: " ▼" }[h.column.getIsSorted() as string] ?? ""}
                  </button>
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-scale-100 font-mono text-xs">
          {table.getRowModel().rows.map((r) => (
            <tr key={r.id} data-testid="request-row">{r.getVisibleCells().map((c) => <td key={c.id} className="px-3 py-2">{flexRender(c.column.columnDef.cell, c.getContext())}</td>)}</tr>
          ))}
        </tbody>
      </table>
      {isLoading && <p className="px-3 py-6 text-center text-sm text-ink-muted">Loading…</p>}
      {!isLoading && !data?.data.length && <p className="px-3 py-6 text-center text-sm text-ink-muted">No requests match.</p>}
    </div>
  );
}
