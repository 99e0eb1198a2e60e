/**
 * Preview cloud for the 3D viewer: voxel-decimated to a point budget, each point with the index
 * of its nearest section station (for colouring), packed into one binary blob.
 *
 * Blob layout (version 1, all little-endian):
 *   0  4 bytes  magic "PPV1"
 *   4  uint16   version (1)
 *   6  uint16   flags (bit 0: station indices present)
 *   8  uint32   point count n
 *  12  uint32   station count (stations are 0 … count−1)
 *  16  float32  voxel size, mm (0 when no decimation was needed)
 *  20  float32 ×3  bounds min x y z, mm
 *  32  float32 ×3  bounds max x y z, mm
 *  44  uint32   points in the source cloud
 *  48  float32 ×3n positions x y z, mm
 *  48+12n  uint16 ×n  station index per point (if flag bit 0)
 *  padded with zeros to a multiple of 4 bytes
 */
export const PREVIEW_MAGIC = "PPV1";
export const PREVIEW_HEADER_BYTES = 48;
export const DEFAULT_PREVIEW_POINTS = 500_000;

export type PreviewCloud = {
  positions: Float32Array;
  /** Nearest station index per point, or null. */
  stations: Uint16Array | null;
  count: number;
  stationCount: number;
  voxelMm: number;
  sourceCount: number;
  bounds: { min: [number, number, number]; max: [number, number, number] };
};

/**
 * Keeps the first point of every occupied voxel (an actual probe point, not an average, so the
 * preview never shows a point the probe did not touch). The voxel grows by 1.25× until the
 * occupied voxels fit the budget; each try stops counting as soon as it is over budget.
 */
export function buildPreviewCloud(
  cloud: { positions: Float32Array; count: number },
  pointStation: Uint16Array | null,
  options: { maxPoints?: number; stationCount?: number } = {},
): PreviewCloud {
  const { positions, count } = cloud;
  const maxPoints = Math.max(1, options.maxPoints ?? DEFAULT_PREVIEW_POINTS);
  const min: [number, number, number] = [Infinity, Infinity, Infinity];
  const max: [number, number, number] = [-Infinity, -Infinity, -Infinity];
  for (let i = 0; i < count * 3; i++) {
    const k = i % 3;
    if (positions[i] < min[k]) min[k] = positions[i];
    if (positions[i] > max[k]) max[k] = positions[i];
  }
  if (count === 0) {
    min.fill(0);
    max.fill(0);
  }
  let stationCount = options.stationCount ?? 0;
  if (pointStation && !options.stationCount) for (let i = 0; i < count; i++) stationCount = Math.max(stationCount, pointStation[i] + 1);
  let keep: Uint32Array;
  let voxel = 0;
  if (count <= maxPoints) {
    keep = Uint32Array.from({ length: count }, (_, i) => i);
  } else {
    const diag = Math.hypot(max[0] - min[0], max[1] - min[1], max[2] - min[2]) || 1;
    voxel = diag / 4000;
    let picked: Uint32Array | null = null;
    while (!picked) {
      picked = voxelPick(positions, count, min, voxel, maxPoints);
      if (!picked) voxel *= 1.25;
    }
    keep = picked;
  }
  const n = keep.length;
  const out = new Float32Array(n * 3);
  const st = pointStation ? new Uint16Array(n) : null;
  for (let k = 0; k < n; k++) {
    const i = keep[k];
    out[3 * k] = positions[3 * i];
    out[3 * k + 1] = positions[3 * i + 1];
    out[3 * k + 2] = positions[3 * i + 2];
    if (st && pointStation) st[k] = pointStation[i];
  }
  return { positions: out, stations: st, count: n, stationCount, voxelMm: voxel, sourceCount: count, bounds: { min, max } };
}

/** First point index per occupied voxel, or null as soon as more than `limit` voxels are occupied. */
function voxelPick(positions: Float32Array, count: number, min: number[], voxel: number, limit: number): Uint32Array | null {
  let size = 1;
  while (size < limit * 2) size <<= 1;
  const mask = size - 1;
  const keys = new Int32Array(size * 3);
  const slotPoint = new Int32Array(size).fill(-1);
  const picked = new Uint32Array(limit);
  let used = 0;
  const inv = 1 / voxel;
  for (let i = 0; i < count; i++) {
    const ix = Math.floor((positions[3 * i] - min[0]) * inv);
    const iy = Math.floor((positions[3 * i + 1] - min[1]) * inv);
    const iz = Math.floor((positions[3 * i + 2] - min[2]) * inv);
    let h = (Math.imul(ix, 73856093) ^ Math.imul(iy, 19349663) ^ Math.imul(iz, 83492791)) & mask;
    for (;;) {
      if (slotPoint[h] < 0) {
        if (used === limit) return null;
        slotPoint[h] = i;
        keys[3 * h] = ix;
        keys[3 * h + 1] = iy;
        keys[3 * h + 2] = iz;
        picked[used++] = i;
        break;
      }
      if (keys[3 * h] === ix && keys[3 * h + 1] === iy && keys[3 * h + 2] === iz) break;
      h = (h + 1) & mask;
    }
  }
  return picked.slice(0, used);
}

export function encodePreviewCloud(p: PreviewCloud): Uint8Array {
  const n = p.count;
  const body = PREVIEW_HEADER_BYTES + 12 * n + (p.stations ? 2 * n : 0);
  const total = Math.ceil(body / 4) * 4;
  const buf = new ArrayBuffer(total);
  const dv = new DataView(buf);
  for (let k = 0; k < 4; k++) dv.setUint8(k, PREVIEW_MAGIC.charCodeAt(k));
  dv.setUint16(4, 1, true);
  dv.setUint16(6, p.stations ? 1 : 0, true);
  dv.setUint32(8, n, true);
  dv.setUint32(12, p.stationCount, true);
  dv.setFloat32(16, p.voxelMm, true);
  for (let k = 0; k < 3; k++) {
    dv.setFloat32(20 + 4 * k, p.bounds.min[k], true);
    dv.setFloat32(32 + 4 * k, p.bounds.max[k], true);
  }
  dv.setUint32(44, p.sourceCount, true);
  for (let i = 0; i < 3 * n; i++) dv.setFloat32(PREVIEW_HEADER_BYTES + 4 * i, p.positions[i], true);
  if (p.stations) {
    const o = PREVIEW_HEADER_BYTES + 12 * n;
    for (let i = 0; i < n; i++) dv.setUint16(o + 2 * i, p.stations[i], true);
  }
  return new Uint8Array(buf);
}

/** Reads a blob written by encodePreviewCloud. Browser-safe: DataView and typed arrays only. */
export function decodePreviewCloud(bytes: Uint8Array | ArrayBuffer): PreviewCloud {
  const u8 = bytes instanceof Uint8Array ? bytes : new Uint8Array(bytes);
  if (u8.length < PREVIEW_HEADER_BYTES) throw new Error("preview blob: shorter than its header");
  const dv = new DataView(u8.buffer, u8.byteOffset, u8.byteLength);
  const magic = String.fromCharCode(u8[0], u8[1], u8[2], u8[3]);
  if (magic !== PREVIEW_MAGIC) throw new Error("preview blob: wrong magic");
  const version = dv.getUint16(4, true);
  if (version !== 1) throw new Error(`preview blob: unsupported version ${version}`);
  const hasStations = (dv.getUint16(6, true) & 1) === 1;
  const n = dv.getUint32(8, true);
  const need = PREVIEW_HEADER_BYTES + 12 * n + (hasStations ? 2 * n : 0);
  if (u8.length < need) throw new Error("preview blob: truncated");
  const positions = new Float32Array(3 * n);
  for (let i = 0; i < 3 * n; i++) positions[i] = dv.getFloat32(PREVIEW_HEADER_BYTES + 4 * i, true);
  let stations: Uint16Array | null = null;
  if (hasStations) {
    stations = new Uint16Array(n);
    const o = PREVIEW_HEADER_BYTES + 12 * n;
    for (let i = 0; i < n; i++) stations[i] = dv.getUint16(o + 2 * i, true);
  }
  const f = (o: number) => dv.getFloat32(o, true);
  return {
    positions,
    stations,
    count: n,
    stationCount: dv.getUint32(12, true),
    voxelMm: f(16),
    sourceCount: dv.getUint32(44, true),
    bounds: { min: [f(20), f(24), f(28)], max: [f(32), f(36), f(40)] },
  };
}
