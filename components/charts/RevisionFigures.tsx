"use client";

/**
 * Two revisions side by side: cycle time and path lengths as paired bars (A solid, B hatched, so
 * print and colour-blind readers can tell them apart), every figure with its change in a table,
 * and the tools of both with what changed, in words.
 */
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { Delta, RevisionComparison } from "@/lib/programs/compare";
import { formatDuration, formatSigned } from "../programs/format";
import { Badge, type Tone } from "../ui/Badge";
import { formatNumber } from "../ui/format";
import { AXIS_TEXT, GRID_STROKE, TOOLTIP_STYLE } from "./chart-style";

const A_FILL = "#33312e";
const B_FILL = "url(#revision-b-hatch)";

function PairedBars({ title, unit, rows, labelA, labelB, digits }: { title: string; unit: string; rows: Array<{ name: string; a: number | null; b: number | null }>; labelA: string; labelB: string; digits: number }) {
  return (
    <figure className="flex flex-col gap-1">
      <figcaption className="text-sm font-semibold text-ink">
        {title} <span className="font-normal text-ink-soft">— {unit}</span>
      </figcaption>
      <div className="h-52 w-full">
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={rows} margin={{ top: 8, right: 12, bottom: 4, left: 4 }}>
            <defs>
              <pattern id="revision-b-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
                <rect width="6" height="6" fill="#f5e4d8" />
                <line x1="0" y1="0" x2="0" y2="6" stroke="#b0592d" strokeWidth="3" />
              </pattern>
            </defs>
            <CartesianGrid stroke={GRID_STROKE} strokeDasharray="2 2" vertical={false} />
            <XAxis dataKey="name" tick={AXIS_TEXT} />
            <YAxis width={48} tick={AXIS_TEXT} />
            <Tooltip formatter={(v) => (typeof v === "number" ? `${formatNumber(v, digits)} ${unit}` : "—")} contentStyle={TOOLTIP_STYLE} />
            <Legend wrapperStyle={{ fontSize: 12 }} />
            <Bar dataKey="a" name={labelA} fill={A_FILL} isAnimationActive={false} />
            <Bar dataKey="b" name={labelB} fill={B_FILL} stroke="#b0592d" isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}

/** "+1 min 38 s", "−12 s", or "±0 s" when the change rounds to nothing. */
const durationChange = (v: number | null) => (v === null ? "—" : Math.round(v) === 0 ? "±0 s" : `${v < 0 ? "−" : "+"}${formatDuration(Math.abs(v))}`);

const minutes = (d: Delta) => ({ a: d.a === null ? null : d.a / 60, b: d.b === null ? null : d.b / 60 });
const metres = (d: Delta) => ({ a: d.a === null ? null : d.a / 1000, b: d.b === null ? null : d.b / 1000 });

/** The paired bars, and (unless `barsOnly`, for pages that already list the figures) the table. */
export function RevisionFigures({ comparison: c, labelA, labelB, barsOnly = false }: { comparison: RevisionComparison; labelA: string; labelB: string; barsOnly?: boolean }) {
  const rows: Array<{ label: string; d: Delta; show: (v: number | null) => string; diff: (v: number | null) => string }> = [
    { label: "Cycle time (estimate)", d: c.cycleTimeS, show: formatDuration, diff: durationChange },
    { label: "Feed time", d: c.feedTimeS, show: formatDuration, diff: durationChange },
    { label: "Rapid time", d: c.rapidTimeS, show: formatDuration, diff: durationChange },
    { label: "Cutting path", d: c.feedLengthMm, show: (v) => (v === null ? "—" : `${formatNumber(v / 1000, 2)} m`), diff: (v) => formatSigned(v === null ? null : v / 1000, 2, "m") },
    { label: "Rapid path", d: c.rapidLengthMm, show: (v) => (v === null ? "—" : `${formatNumber(v / 1000, 2)} m`), diff: (v) => formatSigned(v === null ? null : v / 1000, 2, "m") },
    { label: "Tool changes", d: c.toolChanges, show: (v) => formatNumber(v, 0), diff: (v) => formatSigned(v, 0) },
    { label: "Program lines", d: c.lines, show: (v) => formatNumber(v, 0), diff: (v) => formatSigned(v, 0) },
    { label: "Limits broken", d: c.violations, show: (v) => formatNumber(v, 0), diff: (v) => formatSigned(v, 0) },
  ];
  return (
    <div className="flex flex-col gap-4" data-testid="revision-figures">
      <div className="grid gap-4 md:grid-cols-2">
        <PairedBars title="Time" unit="min" digits={1} labelA={labelA} labelB={labelB} rows={[{ name: "cycle", ...minutes(c.cycleTimeS) }, { name: "feed", ...minutes(c.feedTimeS) }, { name: "rapid", ...minutes(c.rapidTimeS) }]} />
        <PairedBars title="Path length" unit="m" digits={2} labelA={labelA} labelB={labelB} rows={[{ name: "cutting", ...metres(c.feedLengthMm) }, { name: "rapid", ...metres(c.rapidLengthMm) }]} />
      </div>
      {!barsOnly && <table className="w-full text-left text-sm">
        <caption className="mb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">Figures ({c.toolpathFiles.a} and {c.toolpathFiles.b} toolpath files)</caption>
        <thead>
          <tr className="border-b border-rule text-ink-soft">
            <th className="py-1 font-semibold">Figure</th>
            <th className="font-semibold">{labelA}</th>
            <th className="font-semibold">{labelB}</th>
            <th className="font-semibold">Change</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.label} className="border-b border-rule/50">
              <td className="py-1">{r.label}</td>
              <td className="font-mono">{r.show(r.d.a)}</td>
              <td className="font-mono">{r.show(r.d.b)}</td>
              <td className="font-mono">
                {r.diff(r.d.diff)}
                {r.d.percent !== null && r.d.diff !== 0 && <span className="text-ink-soft"> ({formatSigned(r.d.percent, 1)} %)</span>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>}
    </div>
  );
}

const CHANGE: Record<"added" | "removed" | "changed" | "same", { word: string; tone: Tone }> = {
  added: { word: "New in B", tone: "copper" },
  removed: { word: "Dropped in B", tone: "warn" },
  changed: { word: "Changed", tone: "neutral" },
  same: { word: "Same", tone: "ok" },
};

type Range = { min: number; max: number } | null;
const range = (r: Range) => (r ? (r.min === r.max ? formatNumber(r.min, 0) : `${formatNumber(r.min, 0)}–${formatNumber(r.max, 0)}`) : "—");

export function ToolsSideBySide({ comparison, labelA, labelB }: { comparison: RevisionComparison; labelA: string; labelB: string }) {
  if (comparison.tools.length === 0) return <p className="text-sm text-ink-soft">Neither revision has an analysed toolpath with tools.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm" data-testid="tools-side-by-side">
        <thead>
          <tr className="border-b border-rule text-ink-soft">
            <th className="py-1 font-semibold">Tool</th>
            <th className="font-semibold">What changed</th>
            <th className="font-semibold">{labelA}: feed mm/min · rpm · cutting</th>
            <th className="font-semibold">{labelB}: feed mm/min · rpm · cutting</th>
          </tr>
        </thead>
        <tbody>
          {comparison.tools.map((t) => (
            <tr key={t.number} className="border-b border-rule/50">
              <td className="py-1 font-mono font-semibold">T{t.number}</td>
              <td>
                <Badge tone={CHANGE[t.change].tone}>{CHANGE[t.change].word}</Badge>
              </td>
              <td className="font-mono">{t.a ? `${range(t.a.feedMmPerMin)} · ${range(t.a.spindleRpm)} · ${formatNumber(t.a.feedLengthMm / 1000, 2)} m` : "—"}</td>
              <td className="font-mono">{t.b ? `${range(t.b.feedMmPerMin)} · ${range(t.b.spindleRpm)} · ${formatNumber(t.b.feedLengthMm / 1000, 2)} m` : "—"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
