"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import { JOB_STATES } from "@/db/enums";
import type { JobRow } from "@/db/queries/jobs";
import { JOB_STATE_LABEL } from "@/lib/jobs/words";
import { DataTable, type Columns } from "../table/DataTable";
import { inputClass } from "../ui/Field";
import { formatDate } from "../ui/format";
import { JobStateBadge, RevisionFlag } from "./badges";

function RevisionCell({ label, cut, state }: { label: string | null; cut: boolean; state: JobRow["intakeRevisionState"] }) {
  if (!cut) return <span className="text-ink-faint">not cut</span>;
  if (!label) return <span className="text-warn">none chosen</span>;
  const ended = state === "superseded" || state === "withdrawn";
  return (
    <span className={ended ? "font-semibold text-bad" : ""}>
      {label}
      {ended && <span className="ml-1 text-xs font-normal">({state})</span>}
    </span>
  );
}

const columns: Columns<JobRow> = [
  {
    accessorKey: "number",
    header: "Job",
    cell: (c) => (
      <Link href={`/jobs/${c.row.original.id}`} className="whitespace-nowrap font-mono font-semibold text-ink underline decoration-copper/50 underline-offset-2">
        {c.getValue() as string}
      </Link>
    ),
  },
  {
    accessorKey: "state",
    header: "State",
    cell: (c) => (
      <span className="flex flex-wrap items-center gap-1">
        <JobStateBadge state={c.row.original.state} />
        {c.row.original.flagged && <RevisionFlag />}
      </span>
    ),
  },
  { accessorKey: "customerName", header: "Customer" },
  { accessorKey: "castingNumber", header: "Casting", cell: (c) => <span className="whitespace-nowrap font-mono">{c.getValue() as string}</span> },
  { accessorKey: "quantity", header: "Heads", cell: (c) => <span className="whitespace-nowrap font-mono">{`${c.row.original.heads} / ${c.row.original.quantity}`}</span> },
  {
    id: "intake",
    header: "Intake revision",
    enableSorting: false,
    cell: (c) => <RevisionCell label={c.row.original.intakeRevisionLabel} cut={c.row.original.cutIntake} state={c.row.original.intakeRevisionState} />,
  },
  {
    id: "exhaust",
    header: "Exhaust revision",
    enableSorting: false,
    cell: (c) => <RevisionCell label={c.row.original.exhaustRevisionLabel} cut={c.row.original.cutExhaust} state={c.row.original.exhaustRevisionState} />,
  },
  { accessorKey: "machineName", header: "Machine", cell: (c) => (c.getValue() as string | null) ?? <span className="text-ink-faint">—</span> },
  { accessorKey: "dueOn", header: "Due", cell: (c) => <span className="whitespace-nowrap">{formatDate(c.getValue() as string | null)}</span> },
];

export function JobsTable({ customerId, revisionId, defaultState = "open" }: { customerId?: number; revisionId?: number; defaultState?: string }) {
  const [state, setState] = useState(defaultState);
  const [flagged, setFlagged] = useState(false);
  const extraParams = useMemo(
    () => ({ state: state || undefined, flagged: flagged ? "1" : undefined, customerId: customerId ? String(customerId) : undefined, revisionId: revisionId ? String(revisionId) : undefined }),
    [state, flagged, customerId, revisionId],
  );
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-4 text-sm">
        <label className="flex items-center gap-2 text-ink-soft">
          <span className="font-semibold">State</span>
          <select className={inputClass()} value={state} onChange={(e) => setState(e.target.value)} aria-label="Job state">
            <option value="open">Open (not shipped or cancelled)</option>
            <option value="">All</option>
            {JOB_STATES.map((s) => (
              <option key={s} value={s}>
                {JOB_STATE_LABEL[s]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2 text-ink-soft">
          <input type="checkbox" checked={flagged} onChange={(e) => setFlagged(e.target.checked)} className="h-4 w-4 accent-copper" />
          <span className="font-semibold">Only jobs whose revision changed</span>
        </label>
      </div>
      <DataTable
        endpoint="/api/jobs"
        queryKey="jobs"
        columns={columns}
        extraParams={extraParams}
        searchLabel="Number, customer or casting"
        emptyTitle="No jobs match."
        emptyHint="A lead opens a job for a customer and a casting, then picks the released revision for each port."
        initialSort={{ id: "dueOn", desc: false }}
      />
    </div>
  );
}
