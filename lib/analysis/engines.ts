/**
 * The engines as the runner sees them: bytes in (a stream), a JSON report and a preview blob
 * out, progress as a fraction. Each engine's own types stay behind this file.
 */
import type { Readable } from "node:stream";
import { analyzePort, buildPreviewCloud, encodePreviewCloud, readPointCloud } from "../geometry";
import { analyzeToolpath, encodePreview } from "../toolpath";
import type { MachineProfile, PlateEnvelope } from "../toolpath/types";

export type EngineOutput = { result: unknown; preview: Uint8Array | null; summary: string };

export type ToolpathJob = { source: Readable; sizeBytes: number; machine?: MachineProfile; plate?: PlateEnvelope; onProgress(fraction: number): void };

export async function runToolpathEngine(job: ToolpathJob): Promise<EngineOutput> {
  const { report, preview } = await analyzeToolpath(job.source, {
    machine: job.machine,
    plate: job.plate,
    onProgress: (bytes) => job.onProgress(job.sizeBytes > 0 ? Math.min(0.99, bytes / job.sizeBytes) : 0),
  });
  return {
    result: report,
    preview: encodePreview(preview),
    summary: `${report.lines} lines, ${report.tools.length} tools, ${Math.round(report.cycleTimeS)} s`,
  };
}

export type GeometryJob = {
  source: Readable;
  sizeBytes: number;
  fileName: string;
  valveDiameterMm?: number;
  portKind: "intake" | "exhaust";
  onProgress(fraction: number): void;
};

export async function runGeometryEngine(job: GeometryJob): Promise<EngineOutput> {
  // Reading is most of the time on large files; the section pass takes the rest.
  const cloud = await readPointCloud(job.source, {
    filename: job.fileName,
    sizeBytes: job.sizeBytes,
    onProgress: (bytes) => job.onProgress(job.sizeBytes > 0 ? Math.min(0.8, (0.8 * bytes) / job.sizeBytes) : 0),
  });
  job.onProgress(0.85);
  const analysis = analyzePort(cloud, { stepMm: 2, valveDiameterMm: job.valveDiameterMm, portKind: job.portKind });
  const preview = encodePreviewCloud(buildPreviewCloud(cloud, analysis.pointStation));
  return {
    result: analysis.report,
    preview,
    summary: `${analysis.report.points} points, ${analysis.report.sections.length} sections`,
  };
}
