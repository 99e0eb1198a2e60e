"use client";

/**
 * One digitized port in 3D: the decimated preview cloud coloured by station along the
 * centerline, the centerline, and the section slider — the plane in 3D, its outline and figures
 * in 2D beside it, the smallest section marked — with the area chart underneath.
 * Loaded only through CloudView (next/dynamic).
 */
import { useMemo, useState } from "react";
import { SectionAreaChart } from "../charts/SectionAreaChart";
import { formatNumber } from "../ui/format";
import { boxRadius, boundsOfPositions } from "./camera";
import { rampColour, rgbToHex, STATION_RAMP, stationColours } from "./colour";
import { centerlinePoints, PointsObject, SectionPlane } from "./cloud-parts";
import { LoadProgress, ViewerProblem } from "./LoadProgress";
import { decodeCloudPreview, type CloudPreview } from "./preview-blobs";
import { PolylineObject } from "./scene-parts";
import { SectionPanel } from "./SectionPanel";
import { minSectionIndex, outlineExtent, outlineIn3d, pointsAtStation, stationIndexOf } from "./sections";
import { Stage, useViewRequests, ViewButtons } from "./Stage";
import { guidelineOf, portAxisOf } from "./results";
import type { GeometryResultLite } from "./types";
import { usePreviewDownload } from "./usePreviewDownload";

export type CloudViewerProps = { analysisId: number; result: GeometryResultLite; label: string };

export default function CloudViewer(props: CloudViewerProps) {
  const state = usePreviewDownload(props.analysisId, decodeCloudPreview);
  if (state.phase === "error") return <ViewerProblem>The point-cloud preview could not be shown: {state.message}</ViewerProblem>;
  if (state.phase === "loading") return <LoadProgress label="Loading the point-cloud preview" progress={state.progress} />;
  return <CloudExplorer cloud={state.data} {...props} />;
}

function CloudExplorer({ cloud, result, label }: CloudViewerProps & { cloud: CloudPreview }) {
  const sections = result.sections;
  const minIndex = minSectionIndex(sections, result.minSection);
  const [index, setIndex] = useState(() => Math.max(0, Math.floor(sections.length / 2)));
  const [showCloud, setShowCloud] = useState(true);
  const box = useMemo(() => boundsOfPositions(cloud.positions), [cloud]);
  const axis = useMemo(() => portAxisOf(result), [result]);
  const stationCount = useMemo(() => Math.max(1, Math.round(result.centerline.lengthMm / result.stepMm) + 1), [result]);
  const colours = useMemo(() => (cloud.stations ? stationColours(cloud.stations, stationCount) : null), [cloud, stationCount]);
  const line = useMemo(() => centerlinePoints(result.centerline.points), [result]);
  const extent = useMemo(() => outlineExtent(sections), [sections]);
  const section = sections[index];
  const slice = useMemo(() => (section ? pointsAtStation(cloud.positions, cloud.stations, stationIndexOf(section.stationMm, result.stepMm)) : new Float32Array(0)), [cloud, section, result.stepMm]);
  const minOutline = useMemo(() => (minIndex >= 0 ? outlineIn3d(sections[minIndex]) : null), [sections, minIndex]);
  const { request, show } = useViewRequests();
  const r = boxRadius(box);

  return (
    <div className="flex flex-col gap-5" data-testid="cloud-viewer">
      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <div className="flex min-w-0 flex-col gap-3">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <ViewButtons request={request} onShow={show} hasPortAxis={axis !== null} />
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={showCloud} onChange={(e) => setShowCloud(e.target.checked)} className="size-4 accent-copper" />
              Show the points
            </label>
          </div>
          <Stage box={box} portAxis={axis} request={request} testId="cloud-canvas" label={`${label}: ${cloud.count.toLocaleString()} preview points coloured by station, the centerline and the section at ${section ? formatNumber(section.stationMm, 1) : "—"} mm. The section's figures are beside the view.`}>
            {showCloud && <PointsObject positions={cloud.positions} colours={colours} size={2} />}
            <PolylineObject points={line} colour="#1d1c1a" onTop />
            {minOutline && minIndex !== index && <PolylineObject points={minOutline} colour="#9b2c2c" closed dashed dash={r / 60} />}
            {section && <SectionPlane section={section} halfSize={extent * 1.25} />}
            {slice.length > 0 && <PointsObject positions={slice} colour="#8e4320" size={4} />}
          </Stage>
          <StationLegend lengthMm={result.centerline.lengthMm} />
        </div>
        <SectionPanel sections={sections} index={index} minIndex={minIndex} extent={extent} valveDiameterMm={result.valveDiameterMm} onChange={setIndex} />
      </div>
      <SectionAreaChart
        series={[{ label, sections: sections.map((s) => ({ stationMm: s.stationMm, areaMm2: s.areaMm2 })), min: result.minSection }]}
        valveDiameterMm={result.valveDiameterMm}
        guideline={guidelineOf(result)}
        selectedStationMm={section?.stationMm ?? null}
      />
    </div>
  );
}

/** The station colour ramp with its distances in words (colour is never the only cue). */
export function StationLegend({ lengthMm }: { lengthMm: number }) {
  const stops = Array.from({ length: 24 }, (_, i) => rgbToHex(rampColour(i / 23, STATION_RAMP)));
  return (
    <div className="flex flex-wrap items-center gap-2 text-xs text-ink-soft" aria-label="Colour by station">
      <span>Colour by distance along the centerline:</span>
      <span className="font-mono">0 mm (entry)</span>
      <span className="h-2.5 w-40 rounded-sm border border-rule" style={{ background: `linear-gradient(to right, ${stops.join(", ")})` }} aria-hidden />
      <span className="font-mono">{formatNumber(lengthMm, 0)} mm (valve end)</span>
      <span>· black line: centerline · copper: the section on the slider · dashed red: the smallest section</span>
    </div>
  );
}
