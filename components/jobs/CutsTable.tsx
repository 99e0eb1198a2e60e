"use client";

import Link from "next/link";
import { useMemo } from "react";
import type { CutRow } from "@/db/queries/cuts";
import { PORT_LABEL } from "@/lib/jobs/words";
import { DataTable, type Columns } from "../table/DataTable";
import { formatDateTime } from "../ui/format";
import { OutcomeBadge, ShortHash } from "./badges";

const columns: Columns<CutRow> = [
  { accessorKey: "startedAt", header: "Cut", cell: (c) => <span className="whitespace-nowrap">{formatDateTime(c.getValue() as number)}</span> },
  {
    accessorKey: "headSerial",
    header: "Head",
    cell: (c) => (
      <Link href={`/trace/head/${encodeURIComponent(c.row.original.headSerial)}`} className="whitespace-nowrap font-mono font-semibold underline decoration-copper/50 underline-offset-2">
        {c.row.original.headSerial}
      </Link>
    ),
  },
  {
    accessorKey: "jobNumber",
    header: "Job",
    cell: (c) => (
      <Link href={`/jobs/${c.row.original.jobId}`} className="whitespace-nowrap font-mono underline decoration-copper/50 underline-offset-2">
        {c.row.original.jobNumber}
      </Link>
    ),
  },
  { accessorKey: "customerName", header: "Customer" },
  { accessorKey: "port", header: "Port", cell: (c) => `${PORT_LABEL[c.row.original.port]}${c.row.original.cylinder ? ` · cyl. ${c.row.original.cylinder}` : ""}` },
  { accessorKey: "revisionLabel", header: "Revision" },
  { id: "sha", header: "Toolpath SHA-256", enableSorting: false, cell: (c) => <ShortHash value={c.row.original.toolpathSha256} /> },
  {
    accessorKey: "operatorName",
    header: "Operator",
    cell: (c) => (
      <span>
        {c.row.original.operatorName}
        <span className="block text-xs text-ink-soft">{c.row.original.machineName}</span>
      </span>
    ),
  },
  {
    accessorKey: "outcome",
    header: "Outcome",
    cell: (c) => (
      <span className="flex flex-col gap-1">
        <OutcomeBadge outcome={c.row.original.outcome} />
        {c.row.original.reason && <span className="max-w-xs text-xs text-ink-soft">{c.row.original.reason}</span>}
      </span>
    ),
  },
];

/** The cut log across jobs, or of one revision (trace) or machine. */
export function CutsTable({ revisionId, jobId, machineId }: { revisionId?: number; jobId?: number; machineId?: number }) {
  const extraParams = useMemo(
    () => ({ revisionId: revisionId ? String(revisionId) : undefined, jobId: jobId ? String(jobId) : undefined, machineId: machineId ? String(machineId) : undefined }),
    [revisionId, jobId, machineId],
  );
  return (
    <DataTable
      endpoint="/api/cuts"
      queryKey="cuts"
      columns={columns}
      extraParams={extraParams}
      searchLabel="Head, job, customer or reason"
      emptyTitle="No cuts recorded."
      initialSort={{ id: "startedAt", desc: true }}
    />
  );
}
