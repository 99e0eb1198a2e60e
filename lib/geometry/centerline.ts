import { binOf, fillEmptyBins, outlineFromBins } from "./angularOutline";
import { centroid, perimeter, signedArea } from "./polygon";
import type { CloudStats } from "./stats";
import type { Vec3 } from "./types";
import { add, cross, distance, dot, lerp, normalize, perpendicular, scale, sub } from "./vec";

/*
 * Centerline method, and why.
 * The port is tracked like a probe would walk it: start inside the port near the middle of the
 * cloud (a bin of points across the principal axis whose points surround their mean; for a bend
 * of up to ~90° the tangent there is about parallel to the principal axis), then step along the
 * current direction; at each step take the points in a thin slab across the direction (and within
 * a radius of the last section, so the other leg of a bend is never picked up), bin them by angle,
 * and move to the area centroid of that outline. The direction is the chord over the last few
 * centroids, so the walk turns with the port. The walk stops where the slab no longer sees a
 * closed ring of wall; the end is then placed where the wall ends (per angular bin the farthest
 * reach along the direction, median over the bins, so an oblique end face averages out). Both
 * walks together, lightly smoothed and resampled, are the centerline.
 * Why not a global fit: assigning every point to its nearest sample breaks when the port is much
 * wider than the sample spacing (a small wobble of one sample swings the boundary with its
 * neighbour across the whole section), and slabs across the principal axis cut the ends of a
 * bent port obliquely. Walking keeps every decision local.
 * Limits: the centerline's bend radius must exceed the local half-width (else neighbouring planes
 * cross inside the port); sections must surround their centroid (star-shaped); a port shorter
 * than it is wide has no reliable principal axis, so the user's entry and exit points decide; the
 * walk runs on an even subsample (≤ 20 000 points), plenty for centroids.
 */

export function polylineLength(pts: Vec3[]): number {
  let l = 0;
  for (let i = 1; i < pts.length; i++) l += distance(pts[i - 1], pts[i]);
  return l;
}

/** Points at equal arc-length spacing (the last spacing absorbs the remainder), ends kept. */
export function resamplePolyline(pts: Vec3[], spacing: number): Vec3[] {
  const { at, total } = polylineSampler(pts);
  if (pts.length < 2 || total === 0) return pts.slice();
  const n = Math.max(2, Math.round(total / spacing) + 1);
  return Array.from({ length: n }, (_, k) => at((total * k) / (n - 1)));
}

/** Point at arc length s (clamped to the ends). */
export function pointAtLength(pts: Vec3[], s: number): Vec3 {
  return polylineSampler(pts).at(s);
}

/** Arc-length lookup with cumulative lengths and binary search, for many queries on one line. */
export function polylineSampler(pts: Vec3[]): { at: (s: number) => Vec3; total: number } {
  const n = pts.length;
  const cum = new Float64Array(Math.max(n, 1));
  for (let i = 1; i < n; i++) cum[i] = cum[i - 1] + distance(pts[i - 1], pts[i]);
  const total = n > 0 ? cum[n - 1] : 0;
  const at = (s: number): Vec3 => {
    if (n === 0) return [0, 0, 0];
    if (n === 1 || s <= 0) return pts[0];
    if (s >= total) return pts[n - 1];
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (cum[mid] <= s) lo = mid;
      else hi = mid;
    }
    const seg = cum[hi] - cum[lo];
    return lerp(pts[lo], pts[hi], seg > 0 ? (s - cum[lo]) / seg : 0);
  };
  return { at, total };
}

/**
 * Unit tangents by differences over ±w samples (one-sided near the ends). A wide baseline keeps
 * a few tenths of a millimetre of centroid noise from tilting the section planes; for a circular
 * arc the chord between symmetric neighbours is exactly parallel to the tangent.
 */
export function tangentsOf(pts: Vec3[], w = 1): Vec3[] {
  const n = pts.length;
  return pts.map((_, i) => normalize(sub(pts[Math.min(i + w, n - 1)], pts[Math.max(i - w, 0)])));
}

/**
 * Rotation-minimising frames: u is carried from station to station with the least turn, so the 2D
 * outlines the viewer shows beside the slider do not spin as the slider moves.
 */
export function transportFrames(tangents: Vec3[]): { u: Vec3[]; v: Vec3[] } {
  const u: Vec3[] = [];
  const v: Vec3[] = [];
  let prev = perpendicular(tangents[0]);
  for (const t of tangents) {
    let uu = sub(prev, scale(t, dot(prev, t)));
    if (Math.hypot(uu[0], uu[1], uu[2]) < 1e-9) uu = perpendicular(t);
    uu = normalize(uu);
    u.push(uu);
    v.push(cross(t, uu));
    prev = uu;
  }
  return { u, v };
}


/** Trims or extends the line so it starts at (the projection of) startTarget and ends at endTarget. */
function moveEnds(pts: Vec3[], startTarget: Vec3, endTarget: Vec3): Vec3[] {
  let line = pts;
  const total = polylineLength(line);
  const headDir = normalize(sub(line[Math.min(1, line.length - 1)], line[0]));
  const tailDir = normalize(sub(line[line.length - 1], line[Math.max(0, line.length - 2)]));
  const before = dot(sub(startTarget, line[0]), headDir) < 0;
  const after = dot(sub(endTarget, line[line.length - 1]), tailDir) > 0;
  const s0 = before ? 0 : closestLength(line, startTarget).s;
  const s1 = after ? total : closestLength(line, endTarget).s;
  if (s1 - s0 > 0.2 * total && (s0 > 0 || s1 < total)) line = slicePolyline(line, s0, s1);
  if (before) line = [startTarget, ...line];
  if (after) line = [...line, endTarget];
  return line;
}

export const FIT_SAMPLE_LIMIT = 20_000;

/** An even subsample (every k-th point) as doubles, for the fit. */
export function subsample(positions: Float32Array, count: number, limit = FIT_SAMPLE_LIMIT): Float64Array {
  const stride = Math.max(1, Math.floor(count / limit));
  const m = Math.floor((count - 1) / stride) + 1;
  const out = new Float64Array(m * 3);
  for (let i = 0, k = 0; k < m; i += stride, k++) {
    out[3 * k] = positions[3 * i];
    out[3 * k + 1] = positions[3 * i + 1];
    out[3 * k + 2] = positions[3 * i + 2];
  }
  return out;
}

export type CenterlineFit = {
  /** False when no section around the start surrounds its centre: not a tube. */
  ok: boolean;
  points: Vec3[];
  /** 4πA/P² of sections at 15 % and 85 % of the length (1 for a circle). */
  circularityStart: number;
  circularityEnd: number;
  meanPerimeterMm: number;
};

/** Points of the subsample sorted into a dense grid of cells (CSR layout) for local queries. */
class PointGrid {
  readonly start: Uint32Array;
  readonly order: Uint32Array;
  readonly nx: number;
  readonly ny: number;
  readonly nz: number;
  constructor(
    readonly pts: Float64Array,
    readonly min: Vec3,
    readonly cell: number,
    max: Vec3,
  ) {
    this.nx = Math.max(1, Math.ceil((max[0] - min[0]) / cell) + 1);
    this.ny = Math.max(1, Math.ceil((max[1] - min[1]) / cell) + 1);
    this.nz = Math.max(1, Math.ceil((max[2] - min[2]) / cell) + 1);
    const m = pts.length / 3;
    const cellOf = new Uint32Array(m);
    const counts = new Uint32Array(this.nx * this.ny * this.nz + 1);
    for (let i = 0; i < m; i++) {
      const c = this.cellIndex(pts[3 * i], pts[3 * i + 1], pts[3 * i + 2]);
      cellOf[i] = c;
      counts[c + 1]++;
    }
    for (let c = 1; c < counts.length; c++) counts[c] += counts[c - 1];
    this.start = counts.slice();
    this.order = new Uint32Array(m);
    const fill = counts;
    for (let i = 0; i < m; i++) this.order[fill[cellOf[i]]++] = i;
  }
  private clampCell(v: number, n: number): number {
    return v < 0 ? 0 : v >= n ? n - 1 : v;
  }
  cellIndex(x: number, y: number, z: number): number {
    const ix = this.clampCell(Math.floor((x - this.min[0]) / this.cell), this.nx);
    const iy = this.clampCell(Math.floor((y - this.min[1]) / this.cell), this.ny);
    const iz = this.clampCell(Math.floor((z - this.min[2]) / this.cell), this.nz);
    return (iz * this.ny + iy) * this.nx + ix;
  }
  /**
   * Calls visit(i) for every point whose cell meets the cube of half-size r around c and, when a
   * plane is given, lies within `slab` of it (cells are culled by their centre's distance).
   */
  near(c: Vec3, r: number, visit: (i: number) => void, normal?: Vec3, slab = Infinity): void {
    const lo = (k: 0 | 1 | 2, n: number) => this.clampCell(Math.floor((c[k] - r - this.min[k]) / this.cell), n);
    const hi = (k: 0 | 1 | 2, n: number) => this.clampCell(Math.floor((c[k] + r - this.min[k]) / this.cell), n);
    const reach = slab + this.cell * 0.8661; // half the cell's diagonal
    for (let iz = lo(2, this.nz); iz <= hi(2, this.nz); iz++) {
      const dz = this.min[2] + (iz + 0.5) * this.cell - c[2];
      for (let iy = lo(1, this.ny); iy <= hi(1, this.ny); iy++) {
        const dy = this.min[1] + (iy + 0.5) * this.cell - c[1];
        for (let ix = lo(0, this.nx); ix <= hi(0, this.nx); ix++) {
          if (normal) {
            const dx = this.min[0] + (ix + 0.5) * this.cell - c[0];
            const s = dx * normal[0] + dy * normal[1] + dz * normal[2];
            if (s > reach || s < -reach) continue;
          }
          const cidx = (iz * this.ny + iy) * this.nx + ix;
          for (let q = this.start[cidx]; q < this.start[cidx + 1]; q++) visit(this.order[q]);
        }
      }
    }
  }
}

type Slice = { coverage: number; centre: Vec3; area: number; perimeter: number; maxRadius: number };

const WALK_BINS = 32;

/** The outline of the points in a slab around plane (p, t) within radius rMax of p. */
function sliceAt(grid: PointGrid, p: Vec3, t: Vec3, halfWidth: number, rMax: number): Slice {
  const { u, v } = transportFrames([t]);
  const [ux, uy, uz] = u[0];
  const [vx, vy, vz] = v[0];
  const [tx, ty, tz] = t;
  const [px, py, pz] = p;
  const sum = new Float64Array(WALK_BINS);
  const cnt = new Uint32Array(WALK_BINS);
  const pts = grid.pts;
  const r2max = rMax * rMax;
  const cell = grid.cell;
  const reach = halfWidth + cell * 0.8661; // cells whose centre is farther from the plane hold no slab point
  const r = Math.hypot(rMax, halfWidth);
  const lo = (k: 0 | 1 | 2, n: number) => Math.min(n - 1, Math.max(0, Math.floor((p[k] - r - grid.min[k]) / cell)));
  const hi = (k: 0 | 1 | 2, n: number) => Math.min(n - 1, Math.max(0, Math.floor((p[k] + r - grid.min[k]) / cell)));
  const x0 = lo(0, grid.nx), x1 = hi(0, grid.nx), y0 = lo(1, grid.ny), y1 = hi(1, grid.ny), z0 = lo(2, grid.nz), z1 = hi(2, grid.nz);
  // Loops written out (no callback per point): this runs ~100 times per port, cold.
  for (let iz = z0; iz <= z1; iz++) {
    const dzc = grid.min[2] + (iz + 0.5) * cell - pz;
    for (let iy = y0; iy <= y1; iy++) {
      const dyc = grid.min[1] + (iy + 0.5) * cell - py;
      for (let ix = x0; ix <= x1; ix++) {
        const dxc = grid.min[0] + (ix + 0.5) * cell - px;
        const sc = dxc * tx + dyc * ty + dzc * tz;
        if (sc > reach || sc < -reach) continue;
        const cidx = (iz * grid.ny + iy) * grid.nx + ix;
        for (let q = grid.start[cidx], qe = grid.start[cidx + 1]; q < qe; q++) {
          const i = 3 * grid.order[q];
          const dx = pts[i] - px;
          const dy = pts[i + 1] - py;
          const dz = pts[i + 2] - pz;
          const s = dx * tx + dy * ty + dz * tz;
          if (s > halfWidth || s < -halfWidth) continue;
          const x = dx * ux + dy * uy + dz * uz;
          const y = dx * vx + dy * vy + dz * vz;
          const r2 = x * x + y * y;
          if (r2 > r2max) continue;
          let k = Math.floor(((Math.atan2(y, x) + Math.PI) / (2 * Math.PI)) * WALK_BINS);
          if (k >= WALK_BINS) k = WALK_BINS - 1;
          sum[k] += Math.sqrt(r2);
          cnt[k]++;
        }
      }
    }
  }
  const radii = new Float64Array(WALK_BINS);
  let maxRadius = 0;
  for (let k = 0; k < WALK_BINS; k++) {
    radii[k] = cnt[k] > 0 ? sum[k] / cnt[k] : NaN;
    if (cnt[k] > 0) maxRadius = Math.max(maxRadius, radii[k]);
  }
  const coverage = fillEmptyBins(radii);
  if (coverage === 0) return { coverage, centre: p, area: 0, perimeter: 0, maxRadius };
  const outline = outlineFromBins(radii);
  const [cx, cy] = centroid(outline);
  return {
    coverage,
    centre: [px + cx * ux + cy * vx, py + cx * uy + cy * vy, pz + cx * uz + cy * vz],
    area: signedArea(outline),
    perimeter: perimeter(outline),
    maxRadius,
  };
}

/** Where the wall ends beyond plane (c, t): median over angular bins of the farthest reach. */
function reachBeyond(grid: PointGrid, c: Vec3, t: Vec3, rMax: number, depth: number): number {
  const { u, v } = transportFrames([t]);
  const far = new Float64Array(WALK_BINS).fill(-Infinity);
  const pts = grid.pts;
  grid.near(add(c, scale(t, depth / 2)), Math.hypot(rMax, depth), (i) => {
    const d: Vec3 = [pts[3 * i] - c[0], pts[3 * i + 1] - c[1], pts[3 * i + 2] - c[2]];
    const s = dot(d, t);
    if (s < -depth || s > depth) return;
    const x = dot(d, u[0]);
    const y = dot(d, v[0]);
    if (x * x + y * y > rMax * rMax) return;
    const k = binOf(x, y, WALK_BINS);
    if (s > far[k]) far[k] = s;
  });
  const f = Array.from(far).filter(Number.isFinite).sort((a, b) => a - b);
  return f.length ? f[Math.floor(f.length / 2)] : 0;
}

const COVERED = 0.85;

/** Walks from the start section along ±t until the wall stops surrounding the walk. */
function walk(grid: PointGrid, first: Slice, t0: Vec3, step: number, halfWidth: number, maxSteps: number): { centres: Vec3[]; slices: Slice[]; end: Vec3 } {
  const centres: Vec3[] = [first.centre];
  const slices: Slice[] = [first];
  let t = t0;
  let rMax = 1.3 * first.maxRadius + 2;
  for (let k = 0; k < maxSteps; k++) {
    const last = centres[centres.length - 1];
    const next = sliceAt(grid, add(last, scale(t, step)), t, halfWidth, rMax);
    if (next.coverage < COVERED) break;
    centres.push(next.centre);
    slices.push(next);
    rMax = 1.3 * next.maxRadius + 2;
    // Direction: chord over the last few centres, blended with the previous direction.
    const back = centres[Math.max(0, centres.length - 4)];
    const chord = sub(next.centre, back);
    if (Math.hypot(chord[0], chord[1], chord[2]) > 0.5 * step) t = normalize(add(scale(t, 0.5), scale(normalize(chord), 0.5)));
  }
  const last = centres[centres.length - 1];
  const reach = reachBeyond(grid, last, t, rMax, 3 * step + 2 * halfWidth);
  return { centres, slices, end: add(last, scale(t, reach)) };
}

export function fitCenterline(sample: Float64Array, stats: CloudStats): CenterlineFit {
  const m = sample.length / 3;
  const axis = stats.principalAxis;
  const c0 = stats.centroid;
  const extent = Math.max(...[0, 1, 2].map((k) => stats.bounds.max[k] - stats.bounds.min[k]));
  const radius = Math.SQRT2 * Math.max(stats.principalSpreadMm[1], stats.principalSpreadMm[2]);
  const step = Math.min(4, Math.max(0.5, extent / 50));
  // Slab: at least ~12 sample points per angular bin on average.
  const surface = Math.max(extent * 2 * Math.PI * radius, 1e-6);
  const halfWidth = Math.max(step / 2, (12 * WALK_BINS * surface) / (2 * m * 2 * Math.PI * Math.max(radius, 1e-3)));
  const grid = new PointGrid(sample, stats.bounds.min, Math.max(step, radius / 5, extent / 80), stats.bounds.max);

  // Start: the slice across the principal axis nearest the middle whose wall surrounds it.
  let first: Slice | null = null;
  const tRange = [0, 1, 2].reduce((acc, k) => acc + Math.abs(axis[k]) * (stats.bounds.max[k] - stats.bounds.min[k]), 0);
  const rStart = 2 * radius + 2;
  for (let k = 0; k <= 20 && !first; k++) {
    for (const sign of k === 0 ? [1] : [1, -1]) {
      const p = add(c0, scale(axis, (sign * k * tRange) / 50));
      let sl = sliceAt(grid, p, axis, halfWidth, rStart);
      if (sl.coverage < COVERED) continue;
      // Re-centre twice: the first centre came from a point that may sit off the axis.
      for (let r = 0; r < 2; r++) sl = sliceAt(grid, sl.centre, axis, halfWidth, 1.3 * sl.maxRadius + 2);
      if (sl.coverage >= COVERED) {
        first = sl;
        break;
      }
    }
  }
  if (!first) return { ok: false, points: [], circularityStart: NaN, circularityEnd: NaN, meanPerimeterMm: 0 };
  const maxSteps = Math.ceil((4 * extent) / step);
  const ahead = walk(grid, first, axis, step, halfWidth, maxSteps);
  const behind = walk(grid, first, scale(axis, -1), step, halfWidth, maxSteps);
  const centres = [...behind.centres.slice(1).reverse(), ...ahead.centres];
  const slices = [...behind.slices.slice(1).reverse(), ...ahead.slices];
  let pts = smoothPolyline(centres, 2);
  pts = moveEnds(pts.length >= 2 ? pts : [pts[0], add(pts[0], axis)], behind.end, ahead.end);
  pts = resamplePolyline(pts, step);
  const circ = (f: number) => {
    const sl = slices[Math.min(slices.length - 1, Math.max(0, Math.round(f * (slices.length - 1))))];
    return sl.perimeter > 0 ? (4 * Math.PI * sl.area) / sl.perimeter ** 2 : NaN;
  };
  return {
    ok: true,
    points: pts,
    circularityStart: circ(0.15),
    circularityEnd: circ(0.85),
    meanPerimeterMm: slices.reduce((a, b) => a + b.perimeter, 0) / slices.length,
  };
}

/**
 * [¼ ½ ¼] passes over interior points. An end point (whose section has points on one side only,
 * so its centroid is the noisiest) is pulled halfway towards the straight continuation of its
 * two neighbours.
 */
export function smoothPolyline(pts: Vec3[], passes: number): Vec3[] {
  let cur = pts.slice();
  for (let p = 0; p < passes; p++) {
    const next = cur.slice();
    const n = cur.length;
    if (n >= 3) {
      next[0] = lerp(cur[0], sub(scale(cur[1], 2), cur[2]), 0.5);
      next[n - 1] = lerp(cur[n - 1], sub(scale(cur[n - 2], 2), cur[n - 3]), 0.5);
    }
    for (let i = 1; i + 1 < cur.length; i++) {
      next[i] = [
        0.25 * cur[i - 1][0] + 0.5 * cur[i][0] + 0.25 * cur[i + 1][0],
        0.25 * cur[i - 1][1] + 0.5 * cur[i][1] + 0.25 * cur[i + 1][1],
        0.25 * cur[i - 1][2] + 0.5 * cur[i][2] + 0.25 * cur[i + 1][2],
      ];
    }
    cur = next;
  }
  return cur;
}

/** Arc-length parameter of the point of the polyline closest to q. */
export function closestLength(pts: Vec3[], q: Vec3): { s: number; distance: number } {
  let best = { s: 0, distance: Infinity };
  let acc = 0;
  for (let i = 1; i < pts.length; i++) {
    const a = pts[i - 1];
    const ab = sub(pts[i], a);
    const len2 = dot(ab, ab);
    const f = len2 > 0 ? Math.min(1, Math.max(0, dot(sub(q, a), ab) / len2)) : 0;
    const d = distance(q, add(a, scale(ab, f)));
    const seg = Math.sqrt(len2);
    if (d < best.distance) best = { s: acc + f * seg, distance: d };
    acc += seg;
  }
  return best;
}

/** The part of the polyline between arc lengths s0 < s1, with exact end points. */
export function slicePolyline(pts: Vec3[], s0: number, s1: number): Vec3[] {
  const out: Vec3[] = [pointAtLength(pts, s0)];
  let acc = 0;
  for (let i = 1; i < pts.length; i++) {
    acc += distance(pts[i - 1], pts[i]);
    if (acc > s0 && acc < s1) out.push(pts[i]);
  }
  out.push(pointAtLength(pts, s1));
  return out;
}
