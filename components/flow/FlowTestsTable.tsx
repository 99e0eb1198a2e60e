"use client";

/**
 * The flow-test list: server-side sort, filter and paging through the shared DataTable, with a
 * pick box per row to overlay up to twelve tests on one chart.
 */
import Link from "next/link";
import { useMemo, useState } from "react";
import type { FlowTestListItem } from "@/lib/flowtests/read";
import { MAX_SERIES } from "@/lib/flowtests/query";
import { PORT_WORDS, SUBJECT_SHORT, fixed, portPlace } from "@/lib/flowtests/words";
import { DataTable, type Columns } from "../table/DataTable";
import { Badge, type Tone } from "../ui/Badge";
import { buttonClass } from "../ui/Button";

const SUBJECT_TONE: Record<FlowTestListItem["subject"], Tone> = { baseline: "neutral", master: "copper", revision: "ok", head: "warn" };

export type FlowListFilters = { headTypeId?: string; masterId?: string; revisionId?: string; headId?: string; subject?: string; port?: string };

export function FlowTestsTable({ filters }: { filters: FlowListFilters }) {
  const [picked, setPicked] = useState<number[]>([]);
  const toggle = (id: number) => setPicked((now) => (now.includes(id) ? now.filter((x) => x !== id) : now.length >= MAX_SERIES ? now : [...now, id]));

  const columns = useMemo<Columns<FlowTestListItem>>(
    () => [
      {
        id: "pick",
        header: () => <span className="sr-only">Overlay</span>,
        enableSorting: false,
        cell: (c) => {
          const row = c.row.original;
          return (
            <input
              type="checkbox"
              className="h-5 w-5 accent-copper"
              aria-label={`Overlay test ${row.id}`}
              checked={picked.includes(row.id)}
              disabled={!picked.includes(row.id) && picked.length >= MAX_SERIES}
              onChange={() => toggle(row.id)}
            />
          );
        },
      },
      {
        accessorKey: "id",
        header: "Test",
        cell: (c) => (
          <Link href={`/flow-tests/${c.row.original.id}`} className="font-mono font-semibold text-copper underline decoration-copper/40 underline-offset-2">
            #{c.row.original.id}
          </Link>
        ),
      },
      { accessorKey: "testedOn", header: "Tested on", cell: (c) => <span className="whitespace-nowrap font-mono">{c.row.original.testedOn}</span> },
      { accessorKey: "castingNumber", header: "Casting", cell: (c) => <span className="whitespace-nowrap font-mono">{c.row.original.castingNumber ?? "—"}</span> },
      {
        accessorKey: "subjectLabel",
        header: "What was tested",
        cell: (c) => {
          const r = c.row.original;
          return (
            <span className="flex flex-wrap items-center gap-2">
              <Badge tone={SUBJECT_TONE[r.subject]}>{SUBJECT_SHORT[r.subject]}</Badge>
              {r.subject !== "baseline" && <span>{r.subjectLabel}</span>}
            </span>
          );
        },
      },
      {
        accessorKey: "port",
        header: "Port",
        cell: (c) => {
          const r = c.row.original;
          const place = portPlace(r.cylinder, r.portNumber);
          return (
            <span>
              {PORT_WORDS[r.port]}
              {place && <span className="block whitespace-nowrap text-xs text-ink-soft">{place}</span>}
            </span>
          );
        },
      },
      { accessorKey: "depressionInH2O", header: "Depr. inH₂O", cell: (c) => <span className="font-mono">{fixed(c.row.original.depressionInH2O, 1)}</span> },
      { accessorKey: "valveDiameterMm", header: "Valve mm", cell: (c) => <span className="font-mono">{fixed(c.row.original.valveDiameterMm, 2)}</span> },
      { accessorKey: "pointCount", header: "Points", cell: (c) => <span className="font-mono">{c.row.original.pointCount}</span> },
      {
        id: "peak",
        header: () => <span title="Highest corrected flow of the test, computed from its lift table">Peak cfm @ 28″</span>,
        enableSorting: false,
        cell: (c) => {
          const r = c.row.original;
          return r.peakFlowCfmAt28 == null ? (
            <span className="text-bad">not computable</span>
          ) : (
            <span className="whitespace-nowrap font-mono font-semibold">
              {fixed(r.peakFlowCfmAt28, 1)}
              <span className="block text-xs font-normal text-ink-soft">at {fixed(r.peakFlowLiftMm, 2)} mm</span>
            </span>
          );
        },
      },
      { accessorKey: "operatorName", header: "Operator", cell: (c) => c.row.original.operatorName ?? "—" },
    ],
    [picked],
  );

  const extraParams = useMemo(() => ({ ...filters }), [filters]);

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3 rounded-md border border-rule bg-paper px-3 py-2 text-sm" aria-live="polite">
        <span className="text-ink-soft">
          {picked.length === 0 ? "Tick tests to overlay their curves." : `${picked.length} picked for the overlay (at most ${MAX_SERIES}).`}
        </span>
        <Link
          href={picked.length ? `/flow-tests/compare?ids=${picked.join(",")}` : "#"}
          aria-disabled={picked.length === 0}
          className={buttonClass("secondary", picked.length === 0 ? "pointer-events-none opacity-50" : "")}
          data-testid="overlay-picked"
        >
          Overlay picked tests
        </Link>
        {picked.length > 0 && (
          <button type="button" className="text-ink-soft underline" onClick={() => setPicked([])}>
            Clear picks
          </button>
        )}
      </div>
      <DataTable
        endpoint="/api/flow-tests"
        queryKey="flow-tests"
        columns={columns}
        extraParams={extraParams}
        searchLabel="Casting, master, head, program, operator or notes"
        emptyTitle="No flow tests recorded yet."
        emptyHint="Record a test from the bench, or import the bench's CSV."
        initialSort={{ id: "testedOn", desc: true }}
      />
    </div>
  );
}
