"use client";

import { flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type ColumnDef, type SortingState } from "@tanstack/react-table";
import { useState } from "react";
import useSWR from "swr";

const fetcher = async (url: string) => {
  const res = await fetch(url);
  if (!res.ok) throw new Error((await res.json().catch(() => ({}))).error ?? `HTTP ${res.status}`);
  return res.json();
};

/**
 * A table fed by one of the console's data routes (SWR, refreshed every few seconds) and
 * sortable by any column (TanStack Table), with loading, empty and error states.
 */
export function LiveTable<T extends { id: string }>({ url, columns, empty, refreshMs = 5000, testId }: {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- columns carry their own value types
  url: string; columns: ColumnDef<T, any>[]; empty: string; refreshMs?: number; testId?: string;
}) {
  const { data, error, isLoading } = useSWR<{ data: T[] }>(url, fetcher, { refreshInterval: refreshMs });
  const [sorting, setSorting] = useState<SortingState>([]);
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
        <tbody className="divide-y divide-scale-100">
          {table.getRowModel().rows.map((r) => (
            <tr key={r.id} data-testid={testId} className="hover:bg-scale-50">
              {r.getVisibleCells().map((c) => <td key={c.id} className="px-3 py-2 align-top">{flexRender(c.column.columnDef.cell, c.getContext())}</td>)}
            </tr>
          ))}
        </tbody>
      </table>
      {isLoading && <p role="status" className="px-3 py-6 text-center text-sm text-ink-muted">Loading…</p>}
      {!isLoading && !data?.data.length && <p className="px-3 py-6 text-center text-sm text-ink-muted">{empty}</p>}
    </div>
  );
}
