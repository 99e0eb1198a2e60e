"use client";

/** The library's server-driven tables: masters, plates, machines, scans. */
import Link from "next/link";
import type { MachineListRow, MasterListRow, PlateListRow } from "@/db/queries/library";
import type { ScanListRow } from "@/db/queries/scans";
import { DataTable, type Columns } from "../table/DataTable";
import { Badge } from "../ui/Badge";
import { formatDate, formatDateTime, formatNumber } from "../ui/format";
import { AnalysisBadge, StageBadge } from "./StageBadge";

const link = (href: string, text: string) => (
  <Link href={href} className="font-mono font-semibold text-copper-deep underline-offset-2 hover:underline">
    {text}
  </Link>
);

const masterColumns: Columns<MasterListRow> = [
  { accessorKey: "label", header: "Master", cell: (c) => link(`/masters/${c.row.original.id}`, c.row.original.label) },
  { accessorKey: "castingNumber", header: "Casting", cell: (c) => <span className="font-mono">{c.getValue() as string}</span> },
  { accessorKey: "stage", header: "Stage", cell: (c) => <StageBadge stage={c.row.original.stage} /> },
  { accessorKey: "porterName", header: "Porter" },
  { accessorKey: "startedOn", header: "Started", cell: (c) => formatDate(c.getValue() as string | null) },
  { accessorKey: "finishedOn", header: "Handed over", cell: (c) => formatDate(c.getValue() as string | null) },
  { accessorKey: "scanCount", header: "Scans" },
  { accessorKey: "updatedAt", header: "Changed", cell: (c) => formatDateTime(c.getValue() as number) },
];

export function MastersTable({ stage }: { stage?: string }) {
  return (
    <DataTable
      endpoint="/api/masters"
      queryKey="masters"
      columns={masterColumns}
      extraParams={stage ? { stage } : undefined}
      searchLabel="Label or casting"
      emptyTitle="No master heads yet."
      emptyHint="A porter registers each hand-ported master here."
      initialSort={{ id: "updatedAt", desc: true }}
    />
  );
}

const plateColumns: Columns<PlateListRow> = [
  { accessorKey: "code", header: "Plate", cell: (c) => link(`/plates/${c.row.original.id}`, c.row.original.code) },
  { accessorKey: "castingNumber", header: "Casting", cell: (c) => <span className="font-mono">{c.getValue() as string}</span> },
  { accessorKey: "datumDescription", header: "Datum and dowels", enableSorting: false, cell: (c) => <span className="line-clamp-2 max-w-md">{c.getValue() as string}</span> },
  { accessorKey: "scanCount", header: "Scans" },
  { accessorKey: "updatedAt", header: "Changed", cell: (c) => formatDateTime(c.getValue() as number) },
];

export function PlatesTable() {
  return <DataTable endpoint="/api/plates" queryKey="plates" columns={plateColumns} searchLabel="Code or casting" emptyTitle="No fixture plates yet." initialSort={{ id: "code", desc: false }} />;
}

const machineColumns: Columns<MachineListRow> = [
  { accessorKey: "name", header: "Machine", cell: (c) => link(`/machines/${c.row.original.id}`, c.row.original.name) },
  { accessorKey: "axes", header: "Axes", cell: (c) => <span className="font-mono">{c.getValue() as string}</span> },
  { accessorKey: "maxFeedMmMin", header: "Max feed mm/min", cell: (c) => formatNumber(c.getValue() as number, 0) },
  { accessorKey: "maxSpindleRpm", header: "Max spindle rpm", cell: (c) => formatNumber(c.getValue() as number, 0) },
  { accessorKey: "toolChangeS", header: "Tool change s", cell: (c) => formatNumber(c.getValue() as number, 1) },
  { accessorKey: "active", header: "In service", cell: (c) => <Badge tone={c.row.original.active ? "ok" : "neutral"}>{c.row.original.active ? "In service" : "Out of service"}</Badge> },
];

export function MachinesTable() {
  return <DataTable endpoint="/api/machines" queryKey="machines" columns={machineColumns} searchLabel="Name" emptyTitle="No machines yet." emptyHint="An administrator adds each CNC machine and its limits." initialSort={{ id: "name", desc: false }} />;
}

const scanColumns: Columns<ScanListRow> = [
  { accessorKey: "id", header: "Scan", cell: (c) => link(`/scans/${c.row.original.id}`, `S-${c.row.original.id}`) },
  { accessorKey: "masterLabel", header: "Master", cell: (c) => <span className="font-mono">{c.getValue() as string}</span> },
  { accessorKey: "port", header: "Port", cell: (c) => (c.getValue() === "intake" ? "Intake" : "Exhaust") },
  { accessorKey: "plateCode", header: "Plate", cell: (c) => <span className="font-mono">{c.getValue() as string}</span> },
  { accessorKey: "machineName", header: "Machine" },
  { accessorKey: "operatorName", header: "Operator" },
  { accessorKey: "stylusDiameterMm", header: "Stylus mm", cell: (c) => formatNumber(c.getValue() as number, 2) },
  { accessorKey: "pointSpacingMm", header: "Spacing mm", cell: (c) => formatNumber(c.getValue() as number, 2) },
  { accessorKey: "scannedOn", header: "Scanned", cell: (c) => formatDate(c.getValue() as string) },
  { accessorKey: "fileCount", header: "Files" },
  { accessorKey: "analysisState", header: "Geometry", enableSorting: false, cell: (c) => <AnalysisBadge state={c.row.original.analysisState as never} /> },
];

export function ScansTable({ masterId }: { masterId?: number }) {
  return (
    <DataTable
      endpoint="/api/scans"
      queryKey="scans"
      columns={scanColumns}
      extraParams={masterId ? { masterId: String(masterId) } : undefined}
      searchLabel="Master, casting or plate"
      emptyTitle="No scans yet."
      emptyHint="A machinist records each digitizing run here."
      initialSort={{ id: "scannedOn", desc: true }}
    />
  );
}
