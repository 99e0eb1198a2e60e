"use client";

import Link from "next/link";
import type { CustomerRow } from "@/db/queries/customers";
import { DataTable, type Columns } from "../table/DataTable";

const columns: Columns<CustomerRow> = [
  {
    accessorKey: "name",
    header: "Customer",
    cell: (c) => (
      <Link href={`/customers/${c.row.original.id}`} className="font-semibold text-ink underline decoration-copper/50 underline-offset-2">
        {c.getValue() as string}
      </Link>
    ),
  },
  { accessorKey: "contactName", header: "Contact" },
  { accessorKey: "email", header: "E-mail", cell: (c) => <span className="text-ink-soft">{(c.getValue() as string) || "—"}</span> },
  { accessorKey: "phone", header: "Phone", enableSorting: false, cell: (c) => (c.getValue() as string) || "—" },
  { accessorKey: "openJobs", header: "Open jobs", cell: (c) => <span className="font-mono">{c.getValue() as number}</span> },
  { accessorKey: "jobs", header: "All jobs", cell: (c) => <span className="font-mono">{c.getValue() as number}</span> },
  { accessorKey: "heads", header: "Heads", cell: (c) => <span className="font-mono">{c.getValue() as number}</span> },
];

export function CustomersTable() {
  return (
    <DataTable
      endpoint="/api/customers"
      queryKey="customers"
      columns={columns}
      searchLabel="Name, contact or e-mail"
      emptyTitle="No customers yet."
      emptyHint="A lead adds the shop's customers here before opening their jobs."
      initialSort={{ id: "name", desc: false }}
    />
  );
}
