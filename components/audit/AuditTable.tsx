"use client";

import { useMemo, useState } from "react";
import { DataTable, type Columns } from "../table/DataTable";
import { buttonClass } from "../ui/Button";
import { inputClass } from "../ui/Field";
import { formatDateTime } from "../ui/format";

type AuditRow = { id: number; at: number; actorEmail: string; action: string; entity: string; entityId: string | null; before: unknown; after: unknown };

function Json({ value }: { value: unknown }) {
  if (value == null) return <span className="text-ink-faint">—</span>;
  return (
    <details>
      <summary className="cursor-pointer text-xs text-copper">show</summary>
      <pre className="max-w-md overflow-x-auto whitespace-pre-wrap font-mono text-xs">{JSON.stringify(value, null, 2)}</pre>
    </details>
  );
}

const columns: Columns<AuditRow> = [
  { accessorKey: "id", header: "#", cell: (c) => <span className="font-mono">{c.getValue() as number}</span> },
  { accessorKey: "at", header: "When", cell: (c) => <span className="whitespace-nowrap">{formatDateTime(c.getValue() as number)}</span> },
  { accessorKey: "actorEmail", header: "Who" },
  { accessorKey: "action", header: "What", cell: (c) => <span className="font-mono text-xs">{c.getValue() as string}</span> },
  { accessorKey: "entity", header: "Record", cell: (c) => `${c.row.original.entity} ${c.row.original.entityId ?? ""}` },
  { id: "before", header: "Before", enableSorting: false, cell: (c) => <Json value={c.row.original.before} /> },
  { id: "after", header: "After", enableSorting: false, cell: (c) => <Json value={c.row.original.after} /> },
];

/** The log with the auditor's filters; the CSV export takes the same filters. */
export function AuditTable({ entities = [], actions = [] }: { entities?: string[]; actions?: string[] }) {
  const [entity, setEntity] = useState("");
  const [action, setAction] = useState("");
  const [actor, setActor] = useState("");
  const [from, setFrom] = useState("");
  const [to, setTo] = useState("");
  const families = useMemo(() => [...new Set(actions.map((a) => `${a.split(".")[0]}.`))], [actions]);
  const extraParams = useMemo(
    () => ({ entity: entity || undefined, action: action || undefined, actor: actor.trim() || undefined, from: from || undefined, to: to || undefined }),
    [entity, action, actor, from, to],
  );
  const exportHref = `/api/audit/export?${new URLSearchParams(Object.entries(extraParams).filter((e): e is [string, string] => !!e[1])).toString()}`;
  return (
    <div className="flex flex-col gap-3">
      <fieldset className="flex flex-wrap items-end gap-3 text-sm" aria-label="Filters">
        <label className="flex flex-col gap-1">
          <span className="font-semibold text-ink-soft">Record</span>
          <select className={inputClass()} value={entity} onChange={(e) => setEntity(e.target.value)} aria-label="Record kind">
            <option value="">All</option>
            {entities.map((e) => (
              <option key={e} value={e}>
                {e}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-semibold text-ink-soft">Action</span>
          <select className={inputClass()} value={action} onChange={(e) => setAction(e.target.value)} aria-label="Action">
            <option value="">All</option>
            {families.map((f) => (
              <option key={f} value={f}>
                {f}* (all)
              </option>
            ))}
            {actions.map((a) => (
              <option key={a} value={a}>
                {a}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-semibold text-ink-soft">Person or machine</span>
          <input className={inputClass()} value={actor} onChange={(e) => setActor(e.target.value)} placeholder="part of the e-mail" aria-label="Person or machine" />
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-semibold text-ink-soft">From</span>
          <input type="date" className={inputClass()} value={from} onChange={(e) => setFrom(e.target.value)} aria-label="From date" />
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-semibold text-ink-soft">To (inclusive)</span>
          <input type="date" className={inputClass()} value={to} onChange={(e) => setTo(e.target.value)} aria-label="To date" />
        </label>
        <a href={exportHref} download className={buttonClass("secondary")} data-testid="audit-export">
          Export these events (CSV)
        </a>
      </fieldset>
      <p className="text-xs text-ink-faint">Dates are in UTC. The export lists events oldest first with both hashes, so the chain can be re-checked outside Portolan.</p>
      <DataTable
        endpoint="/api/audit"
        queryKey="audit"
        columns={columns}
        extraParams={extraParams}
        searchLabel="Action, person or record"
        initialSort={{ id: "id", desc: true }}
        pageSize={50}
        emptyTitle="No events match."
      />
    </div>
  );
}
