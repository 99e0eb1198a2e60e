/**
 * Deviation of scan B from scan A, point by point, computed in the browser from the two preview
 * clouds: the distance from each B point to the nearest A point (a spatial hash of A), signed by
 * whether B's wall lies farther from A's centerline than A's wall there (+: more room in B, the
 * wall moved outwards) or nearer (−: less room). Nearest-point distance includes A's own point
 * spacing, so identical scans show about half that spacing, not zero (the legend says so).
 */

export type Vec3 = [number, number, number];

/** Hash of a cell's integer coordinates; buckets may merge cells (harmless: true distances decide). */
function cellHash(ix: number, iy: number, iz: number, mask: number): number {
  return (Math.imul(ix, 73856093) ^ Math.imul(iy, 19349663) ^ Math.imul(iz, 83492791)) & mask;
}

/** Shells searched per query by default: bounds the work for points far from the other scan. */
export const DEFAULT_SHELLS = 10;

export class NearestGrid {
  readonly cell: number;
  private readonly mask: number;
  private readonly start: Uint32Array;
  private readonly order: Uint32Array;
  private readonly positions: Float32Array;
  private readonly origin: Vec3;

  /** `cellMm` defaults to about twice the point spacing of a surface cloud (diagonal / √n). */
  constructor(positions: Float32Array, cellMm?: number) {
    const n = Math.floor(positions.length / 3);
    this.positions = positions;
    const min: Vec3 = [Infinity, Infinity, Infinity];
    const max: Vec3 = [-Infinity, -Infinity, -Infinity];
    for (let i = 0; i < 3 * n; i++) {
      const k = i % 3;
      if (positions[i] < min[k]) min[k] = positions[i];
      if (positions[i] > max[k]) max[k] = positions[i];
    }
    if (n === 0) min.fill(0);
    this.origin = min;
    const diag = n > 0 ? Math.hypot(max[0] - min[0], max[1] - min[1], max[2] - min[2]) : 1;
    this.cell = cellMm && cellMm > 0 ? cellMm : Math.max((2 * diag) / Math.sqrt(Math.max(1, n)), 1e-3);
    let size = 1;
    while (size < 2 * Math.max(1, n)) size <<= 1;
    this.mask = size - 1;
    // Counting sort of the points by bucket: start[b] … start[b+1] index into `order`.
    const bucket = new Uint32Array(n);
    const counts = new Uint32Array(size + 1);
    for (let i = 0; i < n; i++) {
      const b = this.bucketOf(positions[3 * i], positions[3 * i + 1], positions[3 * i + 2]);
      bucket[i] = b;
      counts[b + 1]++;
    }
    for (let b = 0; b < size; b++) counts[b + 1] += counts[b];
    this.start = counts.slice();
    const fill = counts;
    this.order = new Uint32Array(n);
    for (let i = 0; i < n; i++) this.order[fill[bucket[i]]++] = i;
  }

  /** Farthest distance at which a nearest point is still found with `maxShells`. */
  reachMm(maxShells = DEFAULT_SHELLS): number {
    return maxShells * this.cell;
  }

  private cellOf(v: number, k: number): number {
    return Math.floor((v - this.origin[k]) / this.cell);
  }

  private bucketOf(x: number, y: number, z: number): number {
    return cellHash(this.cellOf(x, 0), this.cellOf(y, 1), this.cellOf(z, 2), this.mask);
  }

  /**
   * Nearest stored point to (x, y, z): its index and distance; index −1 (distance Infinity) when
   * none lies within `maxShells` cell sizes. Searches shells of cells outwards and stops once the next
   * shell cannot hold anything nearer than the best found.
   */
  nearest(x: number, y: number, z: number, maxShells = DEFAULT_SHELLS): { index: number; distance: number } {
    const cx = this.cellOf(x, 0);
    const cy = this.cellOf(y, 1);
    const cz = this.cellOf(z, 2);
    let best = -1;
    let bestD2 = Infinity;
    const p = this.positions;
    for (let r = 0; r <= maxShells; r++) {
      // Every point in shell r is at least (r − 1)·cell away.
      if (best >= 0 && (r - 1) * this.cell > Math.sqrt(bestD2)) break;
      for (let dx = -r; dx <= r; dx++) {
        for (let dy = -r; dy <= r; dy++) {
          const onFace = Math.abs(dx) === r || Math.abs(dy) === r;
          for (let dz = -r; dz <= r; dz += onFace ? 1 : 2 * r || 1) {
            const b = cellHash(cx + dx, cy + dy, cz + dz, this.mask);
            for (let k = this.start[b]; k < this.start[b + 1]; k++) {
              const i = this.order[k];
              const ddx = p[3 * i] - x;
              const ddy = p[3 * i + 1] - y;
              const ddz = p[3 * i + 2] - z;
              const d2 = ddx * ddx + ddy * ddy + ddz * ddz;
              if (d2 < bestD2) {
                bestD2 = d2;
                best = i;
              }
            }
          }
        }
      }
    }
    // Every point within maxShells·cell lies in the shells searched; a farther hit (through a
    // shared bucket) might not be the nearest, so it does not count.
    const d = Math.sqrt(bestD2);
    return best >= 0 && d <= maxShells * this.cell ? { index: best, distance: d } : { index: -1, distance: Infinity };
  }
}

export type SignContext = {
  /** A's nearest station per point and A's centerline points (station k at index k). */
  stationsA: Uint16Array | null;
  centerlineA: ReadonlyArray<Vec3>;
};

/**
 * Signed deviations of B's points `from` … `to`−1 into `out`. Called in slices by the viewer so
 * the page stays responsive and shows progress.
 */
export function signedDeviations(grid: NearestGrid, a: Float32Array, b: Float32Array, out: Float32Array, from: number, to: number, sign: SignContext | null): void {
  for (let i = from; i < to; i++) {
    const x = b[3 * i];
    const y = b[3 * i + 1];
    const z = b[3 * i + 2];
    const { index, distance } = grid.nearest(x, y, z);
    if (index < 0) {
      out[i] = Number.NaN;
      continue;
    }
    let s = 1;
    if (sign && sign.stationsA && sign.centerlineA.length > 0) {
      const c = sign.centerlineA[Math.min(sign.stationsA[index], sign.centerlineA.length - 1)];
      const ra = Math.hypot(a[3 * index] - c[0], a[3 * index + 1] - c[1], a[3 * index + 2] - c[2]);
      const rb = Math.hypot(x - c[0], y - c[1], z - c[2]);
      s = rb >= ra ? 1 : -1;
    }
    out[i] = s * distance;
  }
}

export type DeviationSummary = {
  /** Points with a deviation (the rest had no A point within reach). */
  measured: number;
  unmatched: number;
  meanAbsMm: number;
  p95AbsMm: number;
  maxAbsMm: number;
  /** Share of measured points with deviation > 0 (B's wall farther out). */
  outwardShare: number;
};

export function summarizeDeviation(values: Float32Array): DeviationSummary {
  const abs: number[] = [];
  let outward = 0;
  let sum = 0;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    const a = Math.abs(v);
    abs.push(a);
    sum += a;
    if (v > 0) outward++;
  }
  abs.sort((x, y) => x - y);
  const measured = abs.length;
  return {
    measured,
    unmatched: values.length - measured,
    meanAbsMm: measured ? sum / measured : 0,
    p95AbsMm: measured ? abs[Math.min(measured - 1, Math.ceil(0.95 * measured) - 1)] : 0,
    maxAbsMm: measured ? abs[measured - 1] : 0,
    outwardShare: measured ? outward / measured : 0,
  };
}

/** A round scale limit (1, 2, 5 × 10ⁿ mm) at or above `value`. */
export function niceLimit(value: number): number {
  if (!(value > 0) || !Number.isFinite(value)) return 0.1;
  const p = 10 ** Math.floor(Math.log10(value));
  for (const m of [1, 2, 5, 10]) if (m * p >= value * (1 - 1e-12)) return m * p;
  return 10 * p;
}

/**
 * Counts of values per bin between `edges` (ascending); values below the first edge fall in the
 * first bin and above the last in the last, so every measured point is counted once.
 */
export function binCounts(values: Float32Array, edges: readonly number[]): number[] {
  const counts = new Array<number>(Math.max(1, edges.length - 1)).fill(0);
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    let lo = 0;
    let hi = edges.length - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (v >= edges[mid]) lo = mid;
      else hi = mid;
    }
    counts[Math.min(counts.length - 1, lo)]++;
  }
  return counts;
}

/** Symmetric bin edges −limit … +limit in `bins` equal steps (bins is even so 0 is an edge). */
export function symmetricEdges(limit: number, bins = 8): number[] {
  const n = bins % 2 === 0 ? bins : bins + 1;
  return Array.from({ length: n + 1 }, (_, i) => -limit + (2 * limit * i) / n);
}
