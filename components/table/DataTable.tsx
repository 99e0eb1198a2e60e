"use client";

/**
 * The one server-driven table: sorting, text filter and paging happen in the route handler
 * (the same `page/pageSize/sort/dir/q` parameters everywhere), so a 10,000-row list stays fast.
 */
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import {
  rowSortingFeature,
  tableFeatures,
  useTable,
  type ColumnDef,
  type RowData,
  type SortingState,
} from "@tanstack/react-table";
import { useEffect, useMemo, useState } from "react";
import { buttonClass } from "../ui/Button";
import { EmptyState } from "../ui/Card";
import { inputClass } from "../ui/Field";
import { fetchJson } from "./fetch-json";

export const tableFeaturesSet = tableFeatures({ rowSortingFeature });
export type Columns<T extends RowData> = Array<ColumnDef<typeof tableFeaturesSet, T>>;

type PageResult<T> = { rows: T[]; total: number; page: number; pageSize: number; pageCount: number };

export function DataTable<T extends RowData>({
  endpoint,
  columns,
  queryKey,
  extraParams,
  searchLabel = "Filter",
  emptyTitle = "Nothing here yet.",
  emptyHint,
  initialSort,
  pageSize: initialPageSize = 25,
}: {
  endpoint: string;
  columns: Columns<T>;
  queryKey: string;
  extraParams?: Record<string, string | undefined>;
  searchLabel?: string;
  emptyTitle?: string;
  emptyHint?: React.ReactNode;
  initialSort?: { id: string; desc: boolean };
  pageSize?: number;
}) {
  const [sorting, setSorting] = useState<SortingState>(initialSort ? [initialSort] : []);
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(initialPageSize);
  const [text, setText] = useState("");
  const [q, setQ] = useState("");

  // Wait for a pause in typing before asking the server.
  useEffect(() => {
    const t = setTimeout(() => {
      setQ(text.trim());
      setPage(1);
    }, 250);
    return () => clearTimeout(t);
  }, [text]);

  const params = useMemo(() => {
    const p = new URLSearchParams({ page: String(page), pageSize: String(pageSize) });
    if (sorting[0]) {
      p.set("sort", sorting[0].id);
      p.set("dir", sorting[0].desc ? "desc" : "asc");
    }
    if (q) p.set("q", q);
    for (const [k, v] of Object.entries(extraParams ?? {})) if (v) p.set(k, v);
    return p.toString();
  }, [page, pageSize, sorting, q, extraParams]);

  const result = useQuery({
    queryKey: [queryKey, params],
    queryFn: () => fetchJson<PageResult<T>>(`${endpoint}?${params}`),
    placeholderData: keepPreviousData,
  });

  const rows = result.data?.rows ?? (EMPTY as T[]);
  const table = useTable({
    features: tableFeaturesSet,
    columns,
    data: rows,
    state: { sorting },
    onSortingChange: (updater) => {
      setSorting(updater);
      setPage(1);
    },
    manualSorting: true,
  });

  const total = result.data?.total ?? 0;
  const pageCount = result.data?.pageCount ?? 1;

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <label className="flex items-center gap-2 text-sm text-ink-soft">
          <span className="font-semibold">{searchLabel}</span>
          <input className={inputClass()} value={text} onChange={(e) => setText(e.target.value)} placeholder="type to filter" aria-label={searchLabel} />
        </label>
        <span className="text-sm text-ink-faint" aria-live="polite">
          {result.isFetching ? "Loading…" : `${total.toLocaleString()} ${total === 1 ? "row" : "rows"}`}
        </span>
      </div>

      {result.isError ? (
        <div role="alert" className="rounded-md border border-bad/40 bg-bad-wash px-4 py-3 text-sm text-bad">
          Could not load this table: {(result.error as Error).message}{" "}
          <button className="underline" onClick={() => result.refetch()}>
            Try again
          </button>
        </div>
      ) : !result.isPending && rows.length === 0 ? (
        <EmptyState title={q ? "No rows match the filter." : emptyTitle}>{q ? null : emptyHint}</EmptyState>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-rule bg-card">
          <table className="w-full border-collapse text-sm">
            <thead className="bg-paper-deep text-left">
              {table.getHeaderGroups().map((group) => (
                <tr key={group.id}>
                  {group.headers.map((header) => {
                    const sorted = header.column.getIsSorted();
                    const canSort = header.column.getCanSort();
                    return (
                      <th key={header.id} scope="col" className="border-b border-rule px-3 py-2 font-semibold text-ink-soft" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}>
                        {header.isPlaceholder ? null : canSort ? (
                          <button type="button" className="inline-flex items-center gap-1 hover:text-ink" onClick={header.column.getToggleSortingHandler()}>
                            <table.FlexRender header={header} />
                            <span aria-hidden className="text-xs text-copper">
                              {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
                            </span>
                          </button>
                        ) : (
                          <table.FlexRender header={header} />
                        )}
                      </th>
                    );
                  })}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((row) => (
                <tr key={row.id} className="border-b border-rule/60 last:border-0 hover:bg-paper">
                  {row.getAllCells().map((cell) => (
                    <td key={cell.id} className="px-3 py-2 align-top">
                      <table.FlexRender cell={cell} />
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}

      <nav className="flex flex-wrap items-center gap-2 text-sm" aria-label="Pages">
        <button className={buttonClass("secondary")} disabled={page <= 1} onClick={() => setPage((p) => Math.max(1, p - 1))}>
          Previous
        </button>
        <span className="text-ink-soft">
          Page {page} of {pageCount}
        </span>
        <button className={buttonClass("secondary")} disabled={page >= pageCount} onClick={() => setPage((p) => p + 1)}>
          Next
        </button>
        <label className="ml-auto flex items-center gap-2 text-ink-soft">
          Rows per page
          <select className={inputClass()} value={pageSize} onChange={(e) => (setPageSize(Number(e.target.value)), setPage(1))}>
            {[10, 25, 50, 100].map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </select>
        </label>
      </nav>
    </div>
  );
}

const EMPTY: unknown[] = [];
