/**
 * Reading the preview blobs the analyses store, in the browser: the toolpath preview ("PTVW",
 * the toolpath engine's own decoder) and the point cloud ("PTPC", written by the analysis runner;
 * the geometry engine's "PPV1" blob is read too, so a later switch of the runner needs no change).
 */
import { decodePreviewCloud } from "@/lib/geometry/preview";
import { decodePreview, type ToolpathPreview } from "@/lib/toolpath/preview";

export type CloudPreview = {
  positions: Float32Array;
  /** Nearest centerline station per point (station k sits k·step mm from the entry), or null. */
  stations: Uint16Array | null;
  count: number;
};

export type PreviewFormat = "PTVW" | "PTPC" | "PPV1";

export function magicOf(bytes: Uint8Array): string {
  return bytes.length >= 4 ? String.fromCharCode(bytes[0], bytes[1], bytes[2], bytes[3]) : "";
}

/**
 * "PTPC" layout (little-endian): magic, uint16 version 1, uint16 header size H (16), uint32 count
 * N, uint32 reserved; then N × float32 xyz, then N × uint16 station.
 */
export function decodeCloudPreview(input: Uint8Array | ArrayBuffer): CloudPreview {
  const bytes = input instanceof Uint8Array ? input : new Uint8Array(input);
  const magic = magicOf(bytes);
  if (magic === "PPV1") {
    const p = decodePreviewCloud(bytes);
    return { positions: p.positions, stations: p.stations, count: p.count };
  }
  if (magic !== "PTPC") throw new Error("This is not a point-cloud preview.");
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const version = view.getUint16(4, true);
  if (version !== 1) throw new Error(`Point-cloud preview version ${version} is not known to this viewer.`);
  const header = view.getUint16(6, true);
  const n = view.getUint32(8, true);
  if (header < 16 || bytes.length < header + 14 * n) throw new Error("The point-cloud preview is shorter than its header says.");
  const positions = new Float32Array(3 * n);
  let o = header;
  for (let i = 0; i < 3 * n; i++, o += 4) positions[i] = view.getFloat32(o, true);
  const stations = new Uint16Array(n);
  for (let i = 0; i < n; i++, o += 2) stations[i] = view.getUint16(o, true);
  return { positions, stations, count: n };
}

export function decodeToolpathPreview(input: Uint8Array | ArrayBuffer): ToolpathPreview {
  const bytes = input instanceof Uint8Array ? input : new Uint8Array(input);
  if (magicOf(bytes) !== "PTVW") throw new Error("This is not a toolpath preview.");
  return decodePreview(bytes);
}
