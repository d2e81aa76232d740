"use client";

import {
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from "@tanstack/react-table";
import { useMemo, useState } from "react";
import useSWR from "swr";

/** One empty list for every render without data (a new one each time would make the table reset itself, again and again). */
const NO_ROWS: never[] = [];

const fetcher = async (url: string) => {
  const res = await fetch(url);
  if (!res.ok) throw new Error((await res.json().catch(() => ({}))).error ?? `HTTP ${res.status}`);
  return res.json();
};

/**
 * A table fed by one of the console's data routes, a page at a time from the server (newest
 * first, older pages by the route's cursor), the newest page refreshed every few seconds
 * (SWR), sortable by any column within the page (TanStack Table), with loading, empty and
 * error states.
 */
export function LiveTable<T extends { id: string }>({
  url,
  columns,
  empty,
  refreshMs = 5000,
  testId,
  noun = "rows",
}: {
  url: string;
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- columns carry their own value types
  columns: ColumnDef<T, any>[];
  empty: string;
  refreshMs?: number;
  testId?: string;
  noun?: string;
}) {
  // The cursors of the pages before this one: going back pops one, going to the newest clears them.
  const [cursors, setCursors] = useState<string[]>([]);
  const [forUrl, setForUrl] = useState(url);
  if (forUrl !== url) {
    // Other filters: start again from the newest page.
    setForUrl(url);
    setCursors([]);
  }
  const cursor = cursors[cursors.length - 1];
  const pageUrl = cursor ? `${url}${url.includes("?") ? "&" : "?"}cursor=${encodeURIComponent(cursor)}` : url;
  const { data, error, isLoading, isValidating } = useSWR<{ data: T[]; next_cursor: string | null }>(pageUrl, fetcher, {
    refreshInterval: cursor ? 0 : refreshMs,
    keepPreviousData: true,
  });
  const rows = useMemo(() => data?.data ?? NO_ROWS, [data]);
  const [sorting, setSorting] = useState<SortingState>([]);
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  if (error)
    return (
      <p role="alert" className="rounded-md bg-fault-light px-3 py-2 text-sm text-fault">
        {error.message}
      </p>
    );
  return (
    <div className="overflow-x-auto rounded-md border border-scale-200 bg-white">
      <table className="w-full text-left text-sm">
        <thead className="border-b border-scale-200 bg-scale-50 text-[11px] uppercase tracking-wide text-ink-muted">
          {table.getHeaderGroups().map((headerGroup) => (
            <tr key={headerGroup.id}>
              {headerGroup.headers.map((header) => (
                <th
                  key={header.id}
                  className="px-3 py-2 font-medium"
                  aria-sort={
                    header.column.getIsSorted() === "asc"
                      ? "ascending"
                      : header.column.getIsSorted() === "desc"
                        ? "descending"
                        : "none"
                  }
                >
                  <button type="button" onClick={header.column.getToggleSortingHandler()} className="uppercase">
                    {flexRender(header.column.columnDef.header, header.getContext())}
                    {{ asc: " ▲", desc: " ▼" }[header.column.getIsSorted() as string] ?? ""}
                  </button>
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-scale-100">
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} data-testid={testId} className="hover:bg-scale-50">
              {row.getVisibleCells().map((visibleCell) => (
                <td key={visibleCell.id} className="px-3 py-2 align-top">
                  {flexRender(visibleCell.column.columnDef.cell, visibleCell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {isLoading && (
        <p role="status" className="px-3 py-6 text-center text-sm text-ink-muted">
          Loading…
        </p>
      )}
      {!isLoading && !data?.data.length && <p className="px-3 py-6 text-center text-sm text-ink-muted">{empty}</p>}
      {(cursors.length > 0 || data?.next_cursor) && (
        <div className="flex flex-wrap items-center gap-2 border-t border-scale-200 px-3 py-2 text-xs">
          <span className="text-ink-muted">Page {cursors.length + 1}</span>
          {cursors.length > 0 && (
            <button
              type="button"
              onClick={() => setCursors([])}
              className="rounded border border-scale-300 px-2 py-0.5"
            >
              Newest
            </button>
          )}
          {cursors.length > 0 && (
            <button
              type="button"
              onClick={() => setCursors((c) => c.slice(0, -1))}
              className="rounded border border-scale-300 px-2 py-0.5"
            >
              ← Newer
            </button>
          )}
          {data?.next_cursor && (
            // Until this page has arrived the rows on screen are the previous page's: no going further from them.
            <button
              type="button"
              disabled={isValidating}
              onClick={() => setCursors((c) => [...c, data.next_cursor!])}
              className="rounded border border-scale-300 px-2 py-0.5 disabled:opacity-50"
            >
              Older {noun} →
            </button>
          )}
        </div>
      )}
    </div>
  );
}
