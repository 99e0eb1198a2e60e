"use client";

/**
 * The toolpath of one analysed program file in 3D: feed moves solid in their tool's colour,
 * rapids dashed and faint, each tool switchable, the plate's envelope and the machine's travel
 * as boxes, broken limits marked, and a scrubber that plays the program forward.
 * Loaded only through ToolpathView (next/dynamic), so three.js stays out of other pages.
 */
import { useThree } from "@react-three/fiber";
import { useEffect, useLayoutEffect, useMemo, useState } from "react";
import * as THREE from "three";
import { PREVIEW_TOOL_SHIFT, type ToolpathPreview } from "@/lib/toolpath/preview";
import { formatDuration } from "../programs/format";
import { Button } from "../ui/Button";
import { formatNumber } from "../ui/format";
import { machineBoxInWork, plateBox } from "./boxes";
import { boundsOfPositions, boxRadius, principalAxis, type Vec3 } from "./camera";
import { toolColour } from "./colour";
import { LoadProgress, ViewerProblem } from "./LoadProgress";
import { decodeToolpathPreview } from "./preview-blobs";
import { BoxLines, Marker } from "./scene-parts";
import { Stage, useViewRequests, ViewButtons } from "./Stage";
import { clampVertex, coarseSegments, dashedSegments, groupSegments, playStep, scrubFraction, segmentIndex, segmentsUpTo, vertexAtLine, type CoarseSegments, type SegmentGroup } from "./toolpath-segments";
import type { SetupContext, ToolpathResultLite } from "./types";
import { usePreviewDownload } from "./usePreviewDownload";

const RAPID_COLOUR = "#33312e";
const PLATE_COLOUR = "#b0592d";
const MACHINE_COLOUR = "#8a8379";
const VIOLATION_COLOUR = "#9b2c2c";

export type ToolpathViewerProps = { analysisId: number; result: ToolpathResultLite; setup: SetupContext; fileName: string };

export default function ToolpathViewer(props: ToolpathViewerProps) {
  const state = usePreviewDownload(props.analysisId, decodeToolpathPreview);
  if (state.phase === "error") return <ViewerProblem>The toolpath preview could not be shown: {state.message}</ViewerProblem>;
  if (state.phase === "loading") return <LoadProgress label="Loading the toolpath preview" progress={state.progress} />;
  return <ToolpathExplorer preview={state.data} {...props} />;
}

/** Feed groups carry a full and a coarse index; rapids (few, dashed) are always drawn in full. */
type DrawnGroup = { group: SegmentGroup; object: THREE.LineSegments; full: THREE.BufferAttribute | null; coarse: (CoarseSegments & { attribute: THREE.BufferAttribute }) | null };

/** Previews above this many vertices switch to the coarse stand-in while the camera moves. */
const COARSE_ABOVE = 60_000;
const COARSE_RUN = 4;

/**
 * Shows each group up to vertex `upTo`, hiding switched-off tools (and rapids when asked); with
 * `moving`, feed groups draw their coarse stand-in.
 */
function applyScrub(drawn: DrawnGroup[], upTo: number, hiddenTools: Set<number>, showRapids: boolean, moving: boolean) {
  for (const { group, object, full, coarse } of drawn) {
    object.visible = !hiddenTools.has(group.toolIndex) && (showRapids || !group.rapid);
    const geometry = object.geometry;
    if (coarse && full) {
      const wanted = moving ? coarse.attribute : full;
      if (geometry.index !== wanted) geometry.setIndex(wanted);
    }
    // Both layouts use two vertices (or two indices) per segment.
    const count = moving && coarse ? segmentsUpTo(coarse.ends, upTo) : segmentsUpTo(group.ends, upTo);
    geometry.setDrawRange(0, 2 * count);
  }
}

/** One line-segments object per tool and kind; visibility and scrub position applied in place. */
function PathLines({ preview, groups, upTo, hiddenTools, showRapids, dash, moving }: { preview: ToolpathPreview; groups: SegmentGroup[]; upTo: number; hiddenTools: Set<number>; showRapids: boolean; dash: number; moving: boolean }) {
  const invalidate = useThree((s) => s.invalidate);
  const drawn = useMemo<DrawnGroup[]>(() => {
    // Feed groups share one position buffer (uploaded once) and differ only in their index.
    const shared = new THREE.BufferAttribute(preview.positions, 3);
    const lighten = preview.flags.length > COARSE_ABOVE;
    return groups.map((group) => {
      const geometry = new THREE.BufferGeometry();
      let material: THREE.Material;
      let full: THREE.BufferAttribute | null = null;
      let coarse: DrawnGroup["coarse"] = null;
      if (group.rapid) {
        const d = dashedSegments(preview.positions, group.ends);
        geometry.setAttribute("position", new THREE.BufferAttribute(d.positions, 3));
        geometry.setAttribute("lineDistance", new THREE.BufferAttribute(d.lineDistances, 1));
        material = new THREE.LineDashedMaterial({ color: RAPID_COLOUR, dashSize: dash, gapSize: dash * 0.8, transparent: true, opacity: 0.55 });
      } else {
        geometry.setAttribute("position", shared);
        full = new THREE.BufferAttribute(segmentIndex(group.ends), 1);
        geometry.setIndex(full);
        if (lighten) {
          const c = coarseSegments(group.ends, COARSE_RUN);
          coarse = { ...c, attribute: new THREE.BufferAttribute(c.index, 1) };
        }
        material = new THREE.LineBasicMaterial({ color: toolColour(group.toolIndex) });
      }
      return { group, object: new THREE.LineSegments(geometry, material), full, coarse };
    });
  }, [preview, groups, dash]);
  useEffect(
    () => () =>
      drawn.forEach(({ object }) => {
        object.geometry.dispose();
        (object.material as THREE.Material).dispose();
      }),
    [drawn],
  );
  useLayoutEffect(() => {
    applyScrub(drawn, upTo, hiddenTools, showRapids, moving);
    invalidate();
  }, [drawn, upTo, hiddenTools, showRapids, moving, invalidate]);
  return (
    <>
      {drawn.map(({ group, object }) => (
        <primitive key={`${group.toolIndex}-${group.rapid}`} object={object} />
      ))}
    </>
  );
}

function ToolpathExplorer({ preview, result, setup, fileName }: ToolpathViewerProps & { preview: ToolpathPreview }) {
  const n = preview.flags.length;
  const groups = useMemo(() => groupSegments(preview.flags), [preview]);
  const pathBox = useMemo(() => boundsOfPositions(preview.positions), [preview]);
  const axis = useMemo(() => principalAxis(preview.positions), [preview]);
  const plate = useMemo(() => plateBox(setup.plateEnvelope), [setup.plateEnvelope]);
  const machine = useMemo(() => machineBoxInWork(setup.machineTravel, setup.workOffset), [setup.machineTravel, setup.workOffset]);
  const r = boxRadius(pathBox);
  const [upTo, setUpTo] = useState(Math.max(0, n - 1));
  const [playing, setPlaying] = useState(false);
  const [hiddenTools, setHiddenTools] = useState<Set<number>>(() => new Set());
  const [showRapids, setShowRapids] = useState(true);
  const [showBoxes, setShowBoxes] = useState(true);
  const [moving, setMoving] = useState(false);
  const { request, show } = useViewRequests();

  useEffect(() => {
    if (!playing) return;
    const step = playStep(n);
    let frame = 0;
    const tick = () => {
      setUpTo((v) => {
        const next = Math.min(n - 1, v + step);
        if (next >= n - 1) setPlaying(false);
        return next;
      });
      frame = requestAnimationFrame(tick);
    };
    frame = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(frame);
  }, [playing, n]);

  const violations = useMemo(
    () =>
      result.violations.map((v, i) => {
        const vertex = vertexAtLine(preview.lineNumbers, v.worstLine);
        const at: Vec3 = [preview.positions[3 * vertex], preview.positions[3 * vertex + 1], preview.positions[3 * vertex + 2]];
        return { ...v, number: i + 1, vertex, at };
      }),
    [result.violations, preview],
  );
  const toolAt = preview.toolNumbers[preview.flags[upTo] >>> PREVIEW_TOOL_SHIFT];
  const line = preview.lineNumbers[upTo] ?? 0;
  const tip: Vec3 = [preview.positions[3 * upTo], preview.positions[3 * upTo + 1], preview.positions[3 * upTo + 2]];
  const toolIndexes = [...new Set(groups.map((g) => g.toolIndex))].sort((a, b) => a - b);

  function toggleTool(index: number) {
    setHiddenTools((prev) => {
      const next = new Set(prev);
      if (next.has(index)) next.delete(index);
      else next.add(index);
      return next;
    });
  }

  if (n === 0) return <ViewerProblem>This program has no moves to draw.</ViewerProblem>;

  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_20rem]" data-testid="toolpath-viewer">
      <div className="flex min-w-0 flex-col gap-3">
        <ViewButtons request={request} onShow={show} hasPortAxis={axis !== null} />
        <Stage box={pathBox} portAxis={axis} request={request} onMoving={setMoving} testId="toolpath-canvas" label={`Toolpath of ${fileName}: ${n.toLocaleString()} preview points, ${toolIndexes.length} tools. The numbers are listed beside the view.`}>
          <PathLines preview={preview} groups={groups} upTo={upTo} hiddenTools={hiddenTools} showRapids={showRapids} dash={r / 80} moving={moving} />
          {showBoxes && plate && <BoxLines box={plate} colour={PLATE_COLOUR} />}
          {showBoxes && machine.box && <BoxLines box={machine.box} colour={MACHINE_COLOUR} dashed dash={boxRadius(machine.box) / 40} />}
          {violations.map((v) => (
            <Marker key={v.number} at={v.at} size={r / 40} colour={VIOLATION_COLOUR} shape="diamond" />
          ))}
          {upTo < n - 1 && <Marker at={tip} size={r / 120} colour="#1d1c1a" />}
          <axesHelper args={[r / 8]} />
        </Stage>
        <Scrubber n={n} upTo={upTo} line={line} toolNumber={toolAt} playing={playing} onChange={(v) => { setPlaying(false); setUpTo(v); }} onPlay={() => { if (upTo >= n - 1) setUpTo(0); setPlaying((p) => !p); }} />
      </div>
      <aside className="flex flex-col gap-4 text-sm" aria-label="Toolpath figures and legend">
        <dl className="grid grid-cols-2 gap-x-4 gap-y-2" data-testid="toolpath-view-figures">
          <Figure label="Cycle time (estimate)" value={formatDuration(result.cycleTimeS)} />
          <Figure label="Program lines" value={result.lines.toLocaleString()} />
          <Figure label="Cutting path" value={`${formatNumber(result.feedLengthMm / 1000, 2)} m`} />
          <Figure label="Rapid path" value={`${formatNumber(result.rapidLengthMm / 1000, 2)} m`} />
          <Figure label="Preview points" value={n.toLocaleString()} />
          <Figure label="Preview tolerance" value={result.previewToleranceMm != null ? `${formatNumber(result.previewToleranceMm, 3)} mm` : "—"} />
        </dl>
        <fieldset className="flex flex-col gap-1.5">
          <legend className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">Tools (feed moves solid)</legend>
          {toolIndexes.map((index) => {
            const number = preview.toolNumbers[index];
            const usage = result.tools.find((t) => t.number === number);
            return (
              <label key={index} className="flex items-center gap-2">
                <input type="checkbox" checked={!hiddenTools.has(index)} onChange={() => toggleTool(index)} className="size-4 accent-copper" />
                <svg width="26" height="10" aria-hidden>
                  <line x1="1" y1="5" x2="25" y2="5" stroke={toolColour(index)} strokeWidth="3" />
                </svg>
                <span className="font-mono font-semibold">{number <= 0 ? "No tool called" : `T${number}`}</span>
                {usage && <span className="text-ink-soft">{formatNumber(usage.feedLengthMm / 1000, 2)} m · {formatDuration(usage.feedTimeS)}</span>}
              </label>
            );
          })}
          <label className="flex items-center gap-2">
            <input type="checkbox" checked={showRapids} onChange={(e) => setShowRapids(e.target.checked)} className="size-4 accent-copper" />
            <svg width="26" height="10" aria-hidden>
              <line x1="1" y1="5" x2="25" y2="5" stroke={RAPID_COLOUR} strokeWidth="1.5" strokeDasharray="4 3" opacity="0.7" />
            </svg>
            Rapid moves (dashed, faint)
          </label>
        </fieldset>
        <fieldset className="flex flex-col gap-1.5">
          <legend className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">Boxes</legend>
          <label className="flex items-center gap-2">
            <input type="checkbox" checked={showBoxes} onChange={(e) => setShowBoxes(e.target.checked)} className="size-4 accent-copper" />
            Show the boxes
          </label>
          <p className="flex items-start gap-2">
            <svg width="26" height="10" aria-hidden className="mt-1 shrink-0">
              <line x1="1" y1="5" x2="25" y2="5" stroke={PLATE_COLOUR} strokeWidth="2" />
            </svg>
            <span>{plate ? <>Plate {setup.plateCode}: safe envelope (solid)</> : <span className="text-ink-soft">No plate envelope: the revision names no plate.</span>}</span>
          </p>
          <p className="flex items-start gap-2">
            <svg width="26" height="10" aria-hidden className="mt-1 shrink-0">
              <line x1="1" y1="5" x2="25" y2="5" stroke={MACHINE_COLOUR} strokeWidth="2" strokeDasharray="5 3" />
            </svg>
            <span>{machine.box ? <>Machine {setup.machineName}: travel (dashed)</> : <span className="text-ink-soft">{setup.machineName ? machine.note : "No machine travel: the revision names no machine."}</span>}</span>
          </p>
          <p className="text-xs text-ink-soft">Small axes at work zero: X red, Y green, Z blue.</p>
        </fieldset>
        <section aria-label="Limits broken">
          <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">Limits broken</h3>
          {violations.length === 0 ? (
            <p className="text-ok" data-testid="no-violations">
              None found{result.checks && !result.checks.plateEnvelope ? " (the plate envelope was not checked)" : ""}.
            </p>
          ) : (
            <ol className="flex flex-col gap-1.5" data-testid="violation-list">
              {violations.map((v) => (
                <li key={v.number} className="rounded border border-bad/30 bg-bad-wash px-2 py-1.5">
                  <p className="text-bad">
                    <span aria-hidden>◆ </span>
                    {v.message}
                  </p>
                  <p className="flex items-center justify-between gap-2 text-xs text-ink-soft">
                    <span>
                      worst at line {v.worstLine.toLocaleString()} · {v.count.toLocaleString()} moves
                    </span>
                    <Button variant="quiet" className="min-h-7 px-2 text-xs" onClick={() => { setPlaying(false); setUpTo(v.vertex); }}>
                      Play up to here
                    </Button>
                  </p>
                </li>
              ))}
            </ol>
          )}
          <p className="mt-1 text-xs text-ink-soft">Marked in the view with a red wire diamond (◆) where the worst move ends.</p>
        </section>
      </aside>
    </div>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-xs uppercase text-ink-faint">{label}</dt>
      <dd className="font-mono">{value}</dd>
    </div>
  );
}

function Scrubber({ n, upTo, line, toolNumber, playing, onChange, onPlay }: { n: number; upTo: number; line: number; toolNumber: number | undefined; playing: boolean; onChange: (v: number) => void; onPlay: () => void }) {
  const pct = Math.round(scrubFraction(upTo, n) * 100);
  const where = `line ${line.toLocaleString()}${toolNumber !== undefined && toolNumber > 0 ? `, tool T${toolNumber}` : ""}, ${pct} % of the preview`;
  return (
    <div className="flex flex-col gap-1.5 rounded-md border border-rule bg-card px-3 py-2">
      <div className="flex items-center gap-3">
        <Button variant="secondary" className="min-h-9 w-20 px-3 text-xs" onClick={onPlay} aria-label={playing ? "Pause" : "Play the program forward"}>
          {playing ? "Pause" : "Play"}
        </Button>
        <input
          type="range"
          min={0}
          max={Math.max(0, n - 1)}
          step={1}
          value={upTo}
          onChange={(e) => onChange(clampVertex(Number(e.target.value), n))}
          aria-label="Position along the program"
          aria-valuetext={where}
          className="h-9 flex-1 accent-copper"
          data-testid="toolpath-scrubber"
        />
      </div>
      <p className="font-mono text-xs text-ink-soft" aria-live="off" data-testid="scrub-position">
        Line <strong className="text-ink">{line.toLocaleString()}</strong>
        {toolNumber !== undefined && toolNumber > 0 && <> · T{toolNumber}</>} · point {(upTo + 1).toLocaleString()} of {n.toLocaleString()} · {pct} %
      </p>
    </div>
  );
}
