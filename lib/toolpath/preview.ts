/**
 * The decimated toolpath preview for the 3D viewer, and its binary form.
 * Runs in the browser too: no Node-only APIs here (no Buffer), only ArrayBuffer and DataView.
 *
 * Vertex i ends the segment from vertex i-1; its flags describe that segment.
 */

/** Segment was a rapid (G0, G28, G53) move. */
export const PREVIEW_RAPID = 0b0000_0001;
/** No line from the previous vertex: the position in between was unknown. */
export const PREVIEW_BREAK = 0b0000_0010;
/** Bits 2–7 hold the index of the tool in `toolNumbers` (63 means 63 or later). */
export const PREVIEW_TOOL_SHIFT = 2;
export const PREVIEW_MAX_TOOL_INDEX = 63;

export type ToolpathPreview = {
  /** x, y, z triples in work coordinates, mm. */
  positions: Float32Array;
  /** Per vertex: PREVIEW_RAPID | PREVIEW_BREAK | toolIndex << PREVIEW_TOOL_SHIFT. */
  flags: Uint8Array;
  /** Per vertex: the 1-based line of the program that produced it. */
  lineNumbers: Uint32Array;
  /** Tool numbers in order of first use; flags refer to them by index. */
  toolNumbers: number[];
  /** Largest deviation from the programmed path the decimation allowed, mm. */
  toleranceMm: number;
};

export function previewToolIndex(flag: number): number {
  return flag >>> PREVIEW_TOOL_SHIFT;
}

export function previewVertexCount(preview: ToolpathPreview): number {
  return preview.flags.length;
}

/*
 * Binary layout, all little-endian:
 *   offset  size  field
 *   0       4     magic "PTVW" (ASCII)
 *   4       2     uint16 format version (1)
 *   6       2     uint16 header size H in bytes (= 44 + 4·T)
 *   8       4     uint32 vertex count N
 *   12      4     uint32 tool count T
 *   16      4     float32 tolerance, mm
 *   20      24    float32 × 6 bounds of the vertices: min x y z, max x y z (NaN when N = 0)
 *   44      4·T   int32 tool numbers, in index order
 *   H       12·N  float32 positions (x, y, z per vertex)
 *   H+12N   4·N   uint32 line numbers
 *   H+16N   N     uint8 flags
 * Total size H + 17·N bytes. The header size lets a later version append fields.
 */
const MAGIC = [0x50, 0x54, 0x56, 0x57]; // "PTVW"
const VERSION = 1;
const FIXED_HEADER = 44;

export function encodePreview(preview: ToolpathPreview): Uint8Array {
  const n = preview.flags.length;
  if (preview.positions.length !== n * 3 || preview.lineNumbers.length !== n) {
    throw new Error("preview arrays disagree on the vertex count");
  }
  const t = preview.toolNumbers.length;
  const header = FIXED_HEADER + 4 * t;
  const out = new Uint8Array(header + 17 * n);
  const view = new DataView(out.buffer);
  MAGIC.forEach((b, i) => view.setUint8(i, b));
  view.setUint16(4, VERSION, true);
  view.setUint16(6, header, true);
  view.setUint32(8, n, true);
  view.setUint32(12, t, true);
  view.setFloat32(16, preview.toleranceMm, true);
  const box = boundsOf(preview.positions);
  for (let k = 0; k < 6; k++) view.setFloat32(20 + 4 * k, box[k], true);
  for (let k = 0; k < t; k++) view.setInt32(FIXED_HEADER + 4 * k, preview.toolNumbers[k], true);
  let o = header;
  for (let k = 0; k < 3 * n; k++, o += 4) view.setFloat32(o, preview.positions[k], true);
  for (let k = 0; k < n; k++, o += 4) view.setUint32(o, preview.lineNumbers[k], true);
  out.set(preview.flags, o);
  return out;
}

export function decodePreview(bytes: Uint8Array | ArrayBuffer): ToolpathPreview {
  const data = bytes instanceof Uint8Array ? bytes : new Uint8Array(bytes);
  if (data.length < FIXED_HEADER) throw new Error("preview: too short for its header");
  const view = new DataView(data.buffer, data.byteOffset, data.byteLength);
  for (let i = 0; i < 4; i++) {
    if (view.getUint8(i) !== MAGIC[i]) throw new Error("preview: not a Portolan preview (bad magic)");
  }
  const version = view.getUint16(4, true);
  if (version !== VERSION) throw new Error(`preview: unsupported version ${version}`);
  const header = view.getUint16(6, true);
  const n = view.getUint32(8, true);
  const t = view.getUint32(12, true);
  if (header < FIXED_HEADER + 4 * t || data.length !== header + 17 * n) {
    throw new Error("preview: size does not match its header");
  }
  const toolNumbers: number[] = [];
  for (let k = 0; k < t; k++) toolNumbers.push(view.getInt32(FIXED_HEADER + 4 * k, true));
  const positions = new Float32Array(3 * n);
  const lineNumbers = new Uint32Array(n);
  let o = header;
  for (let k = 0; k < 3 * n; k++, o += 4) positions[k] = view.getFloat32(o, true);
  for (let k = 0; k < n; k++, o += 4) lineNumbers[k] = view.getUint32(o, true);
  const flags = data.slice(o, o + n);
  return { positions, flags, lineNumbers, toolNumbers, toleranceMm: view.getFloat32(16, true) };
}

/** Bounding box of xyz triples as [minX, minY, minZ, maxX, maxY, maxZ]; NaNs when empty. */
export function boundsOf(positions: Float32Array): number[] {
  if (positions.length === 0) return [NaN, NaN, NaN, NaN, NaN, NaN];
  const box = [Infinity, Infinity, Infinity, -Infinity, -Infinity, -Infinity];
  for (let i = 0; i < positions.length; i += 3) {
    for (let k = 0; k < 3; k++) {
      const v = positions[i + k];
      if (v < box[k]) box[k] = v;
      if (v > box[k + 3]) box[k + 3] = v;
    }
  }
  return box;
}
