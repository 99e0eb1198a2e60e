"use client";

/**
 * Two scans of one port compared: both preview clouds in the plate's frame, scan B coloured by its
 * deviation from scan A on a diverging scale with numbers, and the section profiles and their
 * per-station difference underneath. The deviation is computed here in the browser, in slices,
 * with progress, from the previews (not the full scans).
 */
import { useEffect, useMemo, useState } from "react";
import { AreaDifferenceChart } from "../charts/AreaDifferenceChart";
import { SectionAreaChart } from "../charts/SectionAreaChart";
import { Button } from "../ui/Button";
import { formatNumber } from "../ui/format";
import { boundsOfPositions, type Vec3 } from "./camera";
import { DEVIATION_RAMP, deviationColours, rampColour, rgbToHex } from "./colour";
import { centerlinePoints, PointsObject } from "./cloud-parts";
import { guidelineOf, portAxisOf } from "./results";
import { binCounts, NearestGrid, niceLimit, signedDeviations, summarizeDeviation, symmetricEdges, type DeviationSummary } from "./deviation";
import { LoadProgress, ViewerProblem } from "./LoadProgress";
import { decodeCloudPreview, type CloudPreview } from "./preview-blobs";
import { PolylineObject } from "./scene-parts";
import { Stage, useViewRequests, ViewButtons } from "./Stage";
import type { GeometryResultLite, ScanSide } from "./types";
import { usePreviewDownload, type PreviewState } from "./usePreviewDownload";

export type CloudCompareViewerProps = { a: ScanSide; b: ScanSide };

const SLICE = 20_000;
const LIMITS = [0.1, 0.2, 0.5, 1, 2, 5];

function sideProblem(name: string, s: PreviewState<CloudPreview>) {
  return s.phase === "error" ? `${name}: ${s.message}` : null;
}

export default function CloudCompareViewer({ a, b }: CloudCompareViewerProps) {
  const sa = usePreviewDownload(a.analysisId, decodeCloudPreview);
  const sb = usePreviewDownload(b.analysisId, decodeCloudPreview);
  const problem = sideProblem(a.label, sa) ?? sideProblem(b.label, sb);
  if (problem) return <ViewerProblem>The point-cloud previews could not be shown. {problem}</ViewerProblem>;
  if (sa.phase !== "ready" || sb.phase !== "ready") {
    return (
      <div className="flex flex-wrap gap-3">
        {sa.phase === "loading" ? <LoadProgress label={`Loading ${a.label}`} progress={sa.progress} /> : <LoadProgress label={`${a.label} loaded`} fraction={1} />}
        {sb.phase === "loading" ? <LoadProgress label={`Loading ${b.label}`} progress={sb.progress} /> : <LoadProgress label={`${b.label} loaded`} fraction={1} />}
      </div>
    );
  }
  return <CompareExplorer a={a} b={b} cloudA={sa.data} cloudB={sb.data} />;
}

type Deviation = { values: Float32Array; done: number; reachMm: number };

/** Computes B's deviations in slices between frames, so the page keeps answering. */
function useDeviation(cloudA: CloudPreview, cloudB: CloudPreview, centerlineA: Vec3[]): Deviation {
  const [state, setState] = useState<Deviation>(() => ({ values: new Float32Array(cloudB.count).fill(Number.NaN), done: 0, reachMm: 0 }));
  useEffect(() => {
    let cancelled = false;
    let timer: ReturnType<typeof setTimeout>;
    const values = new Float32Array(cloudB.count).fill(Number.NaN);
    const grid = new NearestGrid(cloudA.positions);
    const sign = { stationsA: cloudA.stations, centerlineA };
    let done = 0;
    const step = () => {
      if (cancelled) return;
      const to = Math.min(cloudB.count, done + SLICE);
      signedDeviations(grid, cloudA.positions, cloudB.positions, values, done, to, sign);
      done = to;
      setState({ values, done, reachMm: grid.reachMm() });
      if (done < cloudB.count) timer = setTimeout(step, 0);
    };
    timer = setTimeout(step, 0);
    return () => {
      cancelled = true;
      clearTimeout(timer);
    };
  }, [cloudA, cloudB, centerlineA]);
  return state;
}

function CompareExplorer({ a, b, cloudA, cloudB }: CloudCompareViewerProps & { cloudA: CloudPreview; cloudB: CloudPreview }) {
  const dev = useDeviation(cloudA, cloudB, a.result.centerline.points);
  const finished = dev.done >= cloudB.count;
  const summary = useMemo(() => (finished ? summarizeDeviation(dev.values) : null), [finished, dev.values]);
  const [chosenLimit, setChosenLimit] = useState<number | null>(null);
  const limit = chosenLimit ?? (summary ? niceLimit(summary.p95AbsMm) : 0.5);
  const colours = useMemo(() => (finished ? deviationColours(dev.values, limit) : null), [finished, dev.values, limit]);
  const [showA, setShowA] = useState(true);
  const [showB, setShowB] = useState(true);
  const box = useMemo(() => {
    const ba = boundsOfPositions(cloudA.positions);
    const bb = boundsOfPositions(cloudB.positions);
    return { min: [0, 1, 2].map((k) => Math.min(ba.min[k], bb.min[k])) as Vec3, max: [0, 1, 2].map((k) => Math.max(ba.max[k], bb.max[k])) as Vec3 };
  }, [cloudA, cloudB]);
  const axis = useMemo(() => portAxisOf(a.result), [a.result]);
  const line = useMemo(() => centerlinePoints(a.result.centerline.points), [a.result]);
  const { request, show } = useViewRequests();
  const profile = (r: GeometryResultLite) => r.sections.map((s) => ({ stationMm: s.stationMm, areaMm2: s.areaMm2 }));

  return (
    <div className="flex flex-col gap-5" data-testid="cloud-compare-viewer">
      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <div className="flex min-w-0 flex-col gap-3">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <ViewButtons request={request} onShow={show} hasPortAxis={axis !== null} />
            <div className="flex gap-3 text-sm">
              <label className="flex items-center gap-2">
                <input type="checkbox" checked={showA} onChange={(e) => setShowA(e.target.checked)} className="size-4 accent-copper" />
                {a.label} (faint grey)
              </label>
              <label className="flex items-center gap-2">
                <input type="checkbox" checked={showB} onChange={(e) => setShowB(e.target.checked)} className="size-4 accent-copper" />
                {b.label} (by deviation)
              </label>
            </div>
          </div>
          <Stage box={box} portAxis={axis} request={request} testId="compare-canvas" label={`${a.label} in grey and ${b.label} coloured by its distance from ${a.label}. The deviation figures are beside the view.`}>
            {showA && <PointsObject positions={cloudA.positions} colour="#8a8379" size={1} opacity={0.18} />}
            {showB && <PointsObject positions={cloudB.positions} colours={colours} colour="#57524b" size={2} />}
            <PolylineObject points={line} colour="#1d1c1a" onTop />
          </Stage>
          {!finished && <LoadProgress label="Measuring the deviation point by point" fraction={cloudB.count ? dev.done / cloudB.count : 1} />}
        </div>
        <aside className="flex flex-col gap-3 text-sm" aria-label="Deviation">
          <DeviationScale limit={limit} summary={summary} values={finished ? dev.values : null} />
          <div role="group" aria-label="Scale limit" className="flex flex-wrap items-center gap-1">
            <span className="mr-1 text-xs text-ink-soft">Scale ±</span>
            <Button variant={chosenLimit === null ? "primary" : "secondary"} className="min-h-8 px-2 text-xs" onClick={() => setChosenLimit(null)} aria-pressed={chosenLimit === null}>
              auto
            </Button>
            {LIMITS.map((l) => (
              <Button key={l} variant={chosenLimit === l ? "primary" : "secondary"} className="min-h-8 px-2 text-xs" onClick={() => setChosenLimit(l)} aria-pressed={chosenLimit === l}>
                {l} mm
              </Button>
            ))}
          </div>
          {summary && (
            <dl className="grid grid-cols-2 gap-x-4 gap-y-2" data-testid="deviation-figures">
              <Fig label="Mean distance" value={`${formatNumber(summary.meanAbsMm, 3)} mm`} />
              <Fig label="95 % within" value={`${formatNumber(summary.p95AbsMm, 3)} mm`} />
              <Fig label="Largest" value={`${formatNumber(summary.maxAbsMm, 3)} mm`} />
              <Fig label="Wall farther out in B" value={`${formatNumber(summary.outwardShare * 100, 0)} % of points`} />
              <Fig label="Points compared" value={summary.measured.toLocaleString()} />
              <Fig label={`Beyond ${formatNumber(dev.reachMm, 1)} mm`} value={summary.unmatched.toLocaleString()} />
            </dl>
          )}
          <p className="text-xs text-ink-soft">
            Distance from each point of {b.label} to the nearest point of {a.label}, in the plate&apos;s frame (no re-alignment: a shift between the scans shows). Computed on the decimated previews, so even identical scans show about half
            their point spacing. Points farther than the reach are drawn neutral.
          </p>
        </aside>
      </div>
      <div className="grid gap-5 xl:grid-cols-2">
        <SectionAreaChart
          title="Section area along each port"
          series={[
            { label: a.label, sections: profile(a.result), min: a.result.minSection },
            { label: b.label, sections: profile(b.result), min: b.result.minSection },
          ]}
          valveDiameterMm={a.result.valveDiameterMm}
          guideline={guidelineOf(a.result)}
        />
        <AreaDifferenceChart a={profile(a.result)} b={profile(b.result)} labelA={a.label} labelB={b.label} stepMm={a.result.stepMm} />
      </div>
      <p className="text-xs text-ink-soft">Stations are distances from each scan&apos;s own entry along its own centerline; where the centerlines differ, a station is not exactly the same plane in both.</p>
    </div>
  );
}

function Fig({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-xs uppercase text-ink-faint">{label}</dt>
      <dd className="font-mono">{value}</dd>
    </div>
  );
}

/** The diverging scale with its numbers, and how many points fall in each band. */
function DeviationScale({ limit, summary, values }: { limit: number; summary: DeviationSummary | null; values: Float32Array | null }) {
  const stops = Array.from({ length: 24 }, (_, i) => rgbToHex(rampColour(i / 23, DEVIATION_RAMP)));
  const edges = symmetricEdges(limit, 8);
  const counts = values ? binCounts(values, edges) : null;
  const total = summary?.measured ?? 0;
  return (
    <figure className="flex flex-col gap-1" data-testid="deviation-scale">
      <figcaption className="text-xs font-semibold uppercase tracking-wide text-ink-soft">Deviation of B from A, mm</figcaption>
      <div className="h-3 rounded-sm border border-rule" style={{ background: `linear-gradient(to right, ${stops.join(", ")})` }} aria-hidden />
      <div className="flex justify-between font-mono text-[11px] text-ink-soft">
        {[-limit, -limit / 2, 0, limit / 2, limit].map((v) => (
          <span key={v}>{v > 0 ? "+" : v < 0 ? "−" : ""}{formatNumber(Math.abs(v), limit < 1 ? 2 : 1)}</span>
        ))}
      </div>
      <div className="flex justify-between gap-3 text-[11px] text-ink-soft">
        <span>− less room in B (wall nearer the centerline)</span>
        <span className="text-right">+ more room in B</span>
      </div>
      {counts && total > 0 && (
        <table className="mt-1 w-full text-right font-mono text-[11px]">
          <caption className="text-left font-sans text-[11px] text-ink-soft">Share of points per band (the end bands include everything beyond)</caption>
          <tbody>
            {counts.map((c, i) => (
              <tr key={i}>
                <td className="text-left">
                  {formatNumber(edges[i], 2)} … {formatNumber(edges[i + 1], 2)}
                </td>
                <td className="w-1/2 px-1">
                  <span className="block h-2 bg-graphite/60" style={{ width: `${Math.round((100 * c) / total)}%` }} />
                </td>
                <td>{formatNumber((100 * c) / total, 1)} %</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </figure>
  );
}
