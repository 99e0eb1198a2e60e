"use client";

import Link from "next/link";
import { DataTable, type Columns } from "../table/DataTable";
import type { HeadTypeRow } from "@/db/queries/head-types";

const mm = (v: number | null) => (v == null ? "—" : v.toFixed(1));

const columns: Columns<HeadTypeRow> = [
  { accessorKey: "castingNumber", header: "Casting number", cell: (c) => <Link href={`/head-types/${c.row.original.id}`} className="font-mono font-semibold text-copper-deep hover:underline">{c.getValue() as string}</Link> },
  { accessorKey: "engineFamily", header: "Engine family" },
  { accessorKey: "cylinders", header: "Cyl." },
  { accessorKey: "boreMm", header: "Bore mm", cell: (c) => mm(c.getValue() as number) },
  { accessorKey: "strokeMm", header: "Stroke mm", cell: (c) => mm(c.getValue() as number) },
  { accessorKey: "intakeValveMm", header: "Intake valve mm", cell: (c) => mm(c.getValue() as number) },
  { accessorKey: "exhaustValveMm", header: "Exhaust valve mm", cell: (c) => mm(c.getValue() as number) },
];

export function HeadTypesTable() {
  return <DataTable endpoint="/api/head-types" queryKey="head-types" columns={columns} searchLabel="Casting or family" emptyTitle="No head types yet." initialSort={{ id: "castingNumber", desc: false }} />;
}
