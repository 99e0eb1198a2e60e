"use client";

/** Programs and revisions as server-driven tables. */
import Link from "next/link";
import type { ProgramListRow, RevisionListRow } from "@/db/queries/programs";
import { RevisionBadge } from "../library/StageBadge";
import { DataTable, type Columns } from "../table/DataTable";
import { formatDateTime } from "../ui/format";
import { formatDuration } from "./format";

const programColumns: Columns<ProgramListRow> = [
  {
    accessorKey: "name",
    header: "Program",
    cell: (c) => (
      <Link href={`/programs/${c.row.original.id}`} className="font-semibold text-copper-deep hover:underline">
        {c.row.original.name}
      </Link>
    ),
  },
  { accessorKey: "castingNumber", header: "Casting", cell: (c) => <span className="font-mono">{c.getValue() as string}</span> },
  { accessorKey: "port", header: "Port", cell: (c) => (c.getValue() === "intake" ? "Intake" : "Exhaust") },
  { accessorKey: "revisionCount", header: "Revisions" },
  { accessorKey: "releasedLetter", header: "Released", cell: (c) => <span className="font-mono font-semibold">{(c.getValue() as string | null) ?? "none"}</span> },
  {
    accessorKey: "latestState",
    header: "Latest",
    enableSorting: false,
    cell: (c) =>
      c.row.original.latestLetter ? (
        <span className="inline-flex items-center gap-2">
          <span className="font-mono">{c.row.original.latestLetter}</span>
          <RevisionBadge state={c.row.original.latestState!} />
        </span>
      ) : (
        "—"
      ),
  },
  { accessorKey: "createdAt", header: "Created", cell: (c) => formatDateTime(c.getValue() as number) },
];

export function ProgramsTable() {
  return <DataTable endpoint="/api/programs" queryKey="programs" columns={programColumns} searchLabel="Name, casting or port" emptyTitle="No programs yet." emptyHint="A machinist creates a program per casting and port." initialSort={{ id: "castingNumber", desc: false }} />;
}

const programPart: Columns<RevisionListRow> = [
  { accessorKey: "programName", header: "Program" },
  { accessorKey: "castingNumber", header: "Casting", cell: (c) => <span className="font-mono">{c.getValue() as string}</span> },
  { accessorKey: "port", header: "Port", cell: (c) => (c.getValue() === "intake" ? "Intake" : "Exhaust") },
];

const revisionColumns = (withProgram: boolean): Columns<RevisionListRow> => [
  {
    accessorKey: "letter",
    header: "Rev.",
    cell: (c) => (
      <Link href={`/programs/${c.row.original.programId}/revisions/${c.row.original.id}`} className="font-mono text-base font-bold text-copper-deep hover:underline">
        {c.row.original.letter}
      </Link>
    ),
  },
  ...(withProgram ? programPart : []),
  { accessorKey: "state", header: "State", cell: (c) => <RevisionBadge state={c.row.original.state} /> },
  { accessorKey: "changeNote", header: "Change", enableSorting: false, cell: (c) => <span className="line-clamp-2 max-w-sm">{c.getValue() as string}</span> },
  { accessorKey: "cycleTimeS", header: "Cycle time", cell: (c) => formatDuration(c.getValue() as number | null) },
  { accessorKey: "createdByName", header: "By" },
  { accessorKey: "createdAt", header: "Created", cell: (c) => formatDateTime(c.getValue() as number) },
  { accessorKey: "releasedAt", header: "Released", cell: (c) => formatDateTime(c.getValue() as number | null) },
];

export function RevisionsTable({ programId, state }: { programId?: number; state?: string }) {
  return (
    <DataTable
      endpoint={programId ? `/api/programs/${programId}/revisions` : "/api/revisions"}
      queryKey={programId ? `revisions-${programId}` : "revisions"}
      columns={revisionColumns(!programId)}
      extraParams={state ? { state } : undefined}
      searchLabel={programId ? "Change note" : "Program, casting or change"}
      emptyTitle="No revisions yet."
      initialSort={{ id: "createdAt", desc: true }}
    />
  );
}
