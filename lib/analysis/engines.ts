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

/**
 * The runner's first cloud-preview layout ("PTPC"), from before the geometry engine had its own
 * blob. New analyses store the engine's PPV1; this writer stays because previews stored in PTPC
 * remain readable by the viewer and its tests write samples with it.
 * Layout (little-endian): "PTPC", uint16 version 1, uint16 header 16, uint32 count N, uint32
 * reserved; then N × float32 xyz, then N × uint16 station. At most PTPC_MAX_POINTS (every k-th).
 */
export const PTPC_MAX_POINTS = 500_000;

export function cloudPreview(positions: Float32Array, count: number, station: Uint16Array): Uint8Array {
  const stride = Math.max(1, Math.ceil(count / PTPC_MAX_POINTS));
  const n = Math.ceil(count / stride);
  const out = new Uint8Array(16 + n * 14);
  const view = new DataView(out.buffer);
  [0x50, 0x54, 0x50, 0x43].forEach((b, i) => view.setUint8(i, b));
  view.setUint16(4, 1, true);
  view.setUint16(6, 16, true);
  view.setUint32(8, n, true);
  let o = 16;
  for (let i = 0, k = 0; k < n; i += stride, k++) {
    view.setFloat32(o, positions[3 * i], true);
    view.setFloat32(o + 4, positions[3 * i + 1], true);
    view.setFloat32(o + 8, positions[3 * i + 2], true);
    o += 12;
  }
  for (let i = 0, k = 0; k < n; i += stride, k++, o += 2) view.setUint16(o, station[i] ?? 0, true);
  return out;
}
