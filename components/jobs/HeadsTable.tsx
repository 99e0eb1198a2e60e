"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import type { HeadRow } from "@/db/queries/heads";
import { HEAD_SOURCE_LABEL, HEAD_STATES, HEAD_STATE_LABEL } from "@/lib/jobs/words";
import { DataTable, type Columns } from "../table/DataTable";
import { inputClass } from "../ui/Field";
import { formatDateTime } from "../ui/format";
import { HeadStateBadge } from "./badges";

const columns: Columns<HeadRow> = [
  {
    accessorKey: "serial",
    header: "Serial",
    cell: (c) => (
      <Link href={`/heads/${c.row.original.id}`} className="whitespace-nowrap font-mono font-semibold text-ink underline decoration-copper/50 underline-offset-2">
        {c.getValue() as string}
      </Link>
    ),
  },
  { accessorKey: "castingNumber", header: "Casting", cell: (c) => <span className="whitespace-nowrap font-mono">{c.getValue() as string}</span> },
  { accessorKey: "state", header: "State", cell: (c) => <HeadStateBadge state={c.row.original.state} /> },
  { accessorKey: "source", header: "Source", cell: (c) => HEAD_SOURCE_LABEL[c.row.original.source] },
  {
    accessorKey: "jobNumber",
    header: "Job",
    cell: (c) =>
      c.row.original.jobId ? (
        <Link href={`/jobs/${c.row.original.jobId}`} className="whitespace-nowrap font-mono underline decoration-copper/50 underline-offset-2">
          {c.row.original.jobNumber}
        </Link>
      ) : (
        <span className="text-ink-faint">stock</span>
      ),
  },
  { accessorKey: "customerName", header: "Customer", cell: (c) => (c.getValue() as string | null) ?? "—" },
  { accessorKey: "cuts", header: "Cuts", cell: (c) => <span className="font-mono">{c.getValue() as number}</span> },
  { accessorKey: "lastCutAt", header: "Last cut", cell: (c) => <span className="whitespace-nowrap">{formatDateTime(c.getValue() as number | null)}</span> },
];

export function HeadsTable({ jobId, customerId }: { jobId?: number; customerId?: number }) {
  const [state, setState] = useState("");
  const extraParams = useMemo(
    () => ({ state: state || undefined, jobId: jobId ? String(jobId) : undefined, customerId: customerId ? String(customerId) : undefined }),
    [state, jobId, customerId],
  );
  return (
    <div className="flex flex-col gap-3">
      <label className="flex items-center gap-2 text-sm text-ink-soft">
        <span className="font-semibold">State</span>
        <select className={inputClass()} value={state} onChange={(e) => setState(e.target.value)} aria-label="Head state">
          <option value="">All</option>
          {HEAD_STATES.map((s) => (
            <option key={s} value={s}>
              {HEAD_STATE_LABEL[s]}
            </option>
          ))}
        </select>
      </label>
      <DataTable
        endpoint="/api/heads"
        queryKey="heads"
        columns={columns}
        extraParams={extraParams}
        searchLabel="Serial, casting, job or customer"
        emptyTitle="No heads recorded yet."
        emptyHint="Heads are received onto a job from its page, with their incoming inspection."
        initialSort={{ id: "serial", desc: false }}
      />
    </div>
  );
}
