"use client";

/**
 * One file's analysis: progress while it runs (polled), the engine's message and a re-run button
 * when it failed, and the figures when it is done — a toolpath's cycle time, tools, bounds and
 * checks, or a port scan's section profile.
 */
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { toast } from "sonner";
import type { AnalysisView as AnalysisRow } from "@/db/queries/files";
import { AnalysisBadge } from "../library/StageBadge";
import { fetchJson } from "../table/fetch-json";
import { Badge } from "../ui/Badge";
import { Button } from "../ui/Button";
import { formatNumber } from "../ui/format";
import { formatDuration } from "./format";
import { SectionProfileChart } from "./SectionProfileChart";

type Range = { min: number; max: number };
type ToolpathResult = {
  lines: number;
  units: string;
  cycleTimeS: number;
  feedTimeS: number;
  rapidTimeS: number;
  toolChangeTimeS: number;
  feedLengthMm: number;
  rapidLengthMm: number;
  toolChanges: number;
  machineProfile: string;
  bounds: Record<string, Range>;
  tools: Array<{ number: number; feedMmPerMin: Range | null; spindleRpm: Range | null; feedLengthMm: number; feedTimeS: number }>;
  violations: Array<{ kind: string; message: string; count: number; worstLine: number }>;
  warningCounts: Record<string, number>;
  checks: { travel: string; rotaryLimits: boolean; plateEnvelope: boolean; maxFeed: boolean; maxSpindle: boolean };
  unmeasuredMoves: number;
};
type GeometryResult = {
  points: number;
  stepMm: number;
  centerline: { lengthMm: number };
  sections: Array<{ stationMm: number; areaMm2: number; equivalentDiameterMm: number; complete: boolean }>;
  minSection: { stationMm: number; areaMm2: number; equivalentDiameterMm: number; percentOfValve: number | null } | null;
  volumeCc: number;
  valveDiameterMm: number | null;
  guideline: { basis: string; verdict: "below" | "within" | "above" | null };
  warnings: Array<{ code: string; message: string }>;
};

const range = (r: Range | null | undefined, digits = 0) => (r ? (r.min === r.max ? formatNumber(r.min, digits) : `${formatNumber(r.min, digits)}–${formatNumber(r.max, digits)}`) : "—");

function ToolpathFigures({ r }: { r: ToolpathResult }) {
  const warnings = Object.values(r.warningCounts ?? {}).reduce((a, b) => a + b, 0);
  return (
    <div className="flex flex-col gap-3 text-sm">
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 sm:grid-cols-4" data-testid="toolpath-figures">
        <div>
          <dt className="text-xs uppercase text-ink-faint">Cycle time (estimate)</dt>
          <dd className="font-mono text-lg font-bold" data-testid="cycle-time">{formatDuration(r.cycleTimeS)}</dd>
        </div>
        <div>
          <dt className="text-xs uppercase text-ink-faint">Feed / rapid</dt>
          <dd className="font-mono">{formatDuration(r.feedTimeS)} / {formatDuration(r.rapidTimeS)}</dd>
        </div>
        <div>
          <dt className="text-xs uppercase text-ink-faint">Cutting length</dt>
          <dd className="font-mono">{formatNumber(r.feedLengthMm / 1000, 2)} m</dd>
        </div>
        <div>
          <dt className="text-xs uppercase text-ink-faint">Lines · units</dt>
          <dd className="font-mono">{r.lines.toLocaleString()} · {r.units}</dd>
        </div>
      </dl>
      <div className="grid gap-3 lg:grid-cols-2">
        <table className="w-full text-left text-sm">
          <caption className="mb-1 text-left text-xs font-semibold uppercase text-ink-faint">Tools ({r.toolChanges} changes)</caption>
          <thead>
            <tr className="border-b border-rule text-ink-soft">
              <th className="py-1">Tool</th>
              <th>Feed mm/min</th>
              <th>Spindle rpm</th>
              <th>Cutting</th>
            </tr>
          </thead>
          <tbody>
            {r.tools.map((t) => (
              <tr key={t.number} className="border-b border-rule/50">
                <td className="py-1 font-mono font-semibold">T{t.number}</td>
                <td className="font-mono">{range(t.feedMmPerMin)}</td>
                <td className="font-mono">{range(t.spindleRpm)}</td>
                <td className="font-mono">{formatDuration(t.feedTimeS)}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <table className="w-full text-left text-sm">
          <caption className="mb-1 text-left text-xs font-semibold uppercase text-ink-faint">Bounds (work coordinates)</caption>
          <thead>
            <tr className="border-b border-rule text-ink-soft">
              <th className="py-1">Axis</th>
              <th>Min</th>
              <th>Max</th>
            </tr>
          </thead>
          <tbody>
            {Object.entries(r.bounds).map(([axis, b]) => (
              <tr key={axis} className="border-b border-rule/50">
                <td className="py-1 font-mono font-semibold">{axis}</td>
                <td className="font-mono">{formatNumber(b.min, 3)}</td>
                <td className="font-mono">{formatNumber(b.max, 3)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <span className="text-ink-soft">Checked against {r.machineProfile}:</span>
        {r.violations.length === 0 ? <Badge tone="ok">No limit broken</Badge> : <Badge tone="bad">{r.violations.length} limits broken</Badge>}
        <Badge tone={r.checks.plateEnvelope ? "neutral" : "warn"}>{r.checks.plateEnvelope ? "Plate envelope checked" : "Plate envelope not checked"}</Badge>
        <Badge tone={r.checks.travel === "absolute" ? "neutral" : "warn"}>Travel {r.checks.travel.replace("-", " ")}</Badge>
        {warnings > 0 && <Badge tone="warn">{warnings} warnings</Badge>}
      </div>
      {r.violations.length > 0 && (
        <ul className="list-inside list-disc text-bad" data-testid="violations">
          {r.violations.map((v, i) => (
            <li key={i}>
              {v.message} (first at line {v.worstLine.toLocaleString()}, {v.count} moves)
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

const VERDICT = { below: "below", within: "within", above: "above" } as const;

function GeometryFigures({ r }: { r: GeometryResult }) {
  return (
    <div className="flex flex-col gap-3 text-sm">
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 sm:grid-cols-4" data-testid="geometry-figures">
        <div>
          <dt className="text-xs uppercase text-ink-faint">Smallest section</dt>
          <dd className="font-mono text-lg font-bold">{r.minSection ? `${formatNumber(r.minSection.areaMm2, 0)} mm²` : "—"}</dd>
        </div>
        <div>
          <dt className="text-xs uppercase text-ink-faint">Equivalent diameter</dt>
          <dd className="font-mono">
            {r.minSection ? `${formatNumber(r.minSection.equivalentDiameterMm, 2)} mm` : "—"}
            {r.minSection?.percentOfValve != null && ` · ${formatNumber(r.minSection.percentOfValve, 1)} % of valve`}
          </dd>
        </div>
        <div>
          <dt className="text-xs uppercase text-ink-faint">Volume (estimate)</dt>
          <dd className="font-mono">{formatNumber(r.volumeCc, 1)} cc</dd>
        </div>
        <div>
          <dt className="text-xs uppercase text-ink-faint">Centerline · points</dt>
          <dd className="font-mono">{formatNumber(r.centerline.lengthMm, 1)} mm · {r.points.toLocaleString()}</dd>
        </div>
      </dl>
      <p className="text-xs text-ink-soft">
        {r.guideline.basis}
        {r.guideline.verdict && <> — this port is <strong>{VERDICT[r.guideline.verdict]}</strong> the guideline.</>}
      </p>
      <SectionProfileChart series={[{ name: "Section area", points: r.sections.map((s) => ({ stationMm: s.stationMm, areaMm2: s.areaMm2 })) }]} />
      {r.warnings.length > 0 && (
        <ul className="list-inside list-disc text-warn">
          {r.warnings.map((w, i) => (
            <li key={i}>{w.message}</li>
          ))}
        </ul>
      )}
    </div>
  );
}

export function AnalysisView({ initial, canRerun }: { initial: AnalysisRow; canRerun: boolean }) {
  const qc = useQueryClient();
  const router = useRouter();
  const q = useQuery({
    queryKey: ["analysis", initial.id],
    queryFn: () => fetchJson<AnalysisRow>(`/api/analyses/${initial.id}`),
    initialData: initial,
    refetchInterval: (query) => (query.state.data && (query.state.data.state === "queued" || query.state.data.state === "running") ? 1000 : false),
  });
  const a = q.data;
  const running = a.state === "queued" || a.state === "running";
  async function rerun() {
    try {
      await fetchJson(`/api/analyses/${a.id}/rerun`, { method: "POST" });
      toast.success("Analysis queued again.");
      await qc.invalidateQueries({ queryKey: ["analysis", a.id] });
      router.refresh();
    } catch (err) {
      toast.error(err instanceof Error ? err.message : "Could not re-run.");
    }
  }
  return (
    <div className="flex flex-col gap-3" data-testid={`analysis-${a.id}`} data-state={a.state}>
      <div className="flex flex-wrap items-center gap-3">
        <AnalysisBadge state={a.state} />
        {running && (
          <div className="flex min-w-48 flex-1 items-center gap-2">
            <div role="progressbar" aria-label="Analysis progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(a.progress * 100)} className="h-2 flex-1 overflow-hidden rounded bg-paper-deep">
              <div className="h-full bg-graphite transition-[width]" style={{ width: `${Math.round(a.progress * 100)}%` }} />
            </div>
            <span className="font-mono text-xs">{Math.round(a.progress * 100)} %</span>
          </div>
        )}
        {a.state === "failed" && canRerun && (
          <Button onClick={rerun} variant="secondary">
            Run the analysis again
          </Button>
        )}
      </div>
      {a.state === "failed" && (
        <p role="alert" className="rounded border border-bad/30 bg-bad-wash px-3 py-2 text-sm text-bad">
          The engine said: {a.error}
        </p>
      )}
      {a.state === "done" && a.result != null && (a.engine === "toolpath" ? <ToolpathFigures r={a.result as ToolpathResult} /> : <GeometryFigures r={a.result as GeometryResult} />)}
    </div>
  );
}
