"use client";

import { DataTable, type Columns } from "../table/DataTable";
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
  { accessorKey: "at", header: "When", cell: (c) => formatDateTime(c.getValue() as number) },
  { accessorKey: "actorEmail", header: "Who" },
  { accessorKey: "action", header: "What", cell: (c) => <span className="font-mono text-xs">{c.getValue() as string}</span> },
  { accessorKey: "entity", header: "Record", cell: (c) => `${c.row.original.entity} ${c.row.original.entityId ?? ""}` },
  { id: "before", header: "Before", enableSorting: false, cell: (c) => <Json value={c.row.original.before} /> },
  { id: "after", header: "After", enableSorting: false, cell: (c) => <Json value={c.row.original.after} /> },
];

export function AuditTable() {
  return <DataTable endpoint="/api/audit" queryKey="audit" columns={columns} searchLabel="Action, person or record" initialSort={{ id: "id", desc: true }} pageSize={50} />;
}
