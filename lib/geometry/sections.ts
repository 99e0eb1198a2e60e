import { fillEmptyBins, outlineFromBins } from "./angularOutline";
import { centroid, perimeter, signedArea } from "./polygon";
import type { Bounds } from "./stats";
import type { Vec3 } from "./types";

/*
 * Section outlines, and why this way.
 * Points within ±h of a station's plane are projected into it and binned by angle around the
 * centerline point (the centerline was fitted to section centroids, so it sits inside). In each
 * bin the outline radius is the mean of the points near the *nearest* wall seen from the centre
 * (within a band above the bin's third-smallest radius). That is the outline's visible part from
 * the centre: a fin or a flattened floor is followed, where a convex hull would bridge across.
 * Using the near band rather than all points keeps a fin's side walls (which lie at larger radii
 * in the same bins as its tip) from pulling the outline outwards; the third-smallest rather than
 * the smallest radius keeps one stray point inside the port from doing the opposite.
 * Limits: the section must be star-shaped from the centre. Parts of the port hidden behind a
 * feature as seen from the centre (the pockets beside a fin's root, an undercut) are missed,
 * which under-states the area by the hidden part; a fin lying edge-on to the centre is followed
 * exactly. The slab half-width h trades noise for smearing along the port: a wall whose radius
 * changes linearly across the slab averages to the radius at the plane.
 */

export type StationFrames = {
  /** Stations along the centerline, mm from the entry. */
  stationMm: Float64Array;
  /** Per station: origin, tangent (plane normal), u, v, 3 numbers each. */
  origin: Float64Array;
  normal: Float64Array;
  u: Float64Array;
  v: Float64Array;
};

export type RawSection = {
  index: number;
  stationMm: number;
  /** Points in the slab. */
  pointCount: number;
  /** Fraction of angular bins that had points. */
  coverage: number;
  /** Fraction of slab points within the near-wall band (≈1 for a wall, low for a filled blob). */
  wallFraction: number;
  areaMm2: number;
  perimeterMm: number;
  /** Outline in plane coordinates (u, v), mm, relative to the station origin, one vertex per bin. */
  outline: number[];
  /** Area centroid in plane coordinates. */
  centroidUV: [number, number];
};

export type SectionPassOptions = {
  /** Also return each point's nearest station (the preview's colours). */
  pointStations: boolean;
  bins: number;
  halfWidthMm: number;
  bounds: Bounds;
};

/** Maps grid cells to their nearest station so each point finds its plane in O(1). */
function nearestStationGrid(frames: StationFrames, bounds: Bounds, maxCells = 16_384) {
  const pad = 1;
  const min: Vec3 = [bounds.min[0] - pad, bounds.min[1] - pad, bounds.min[2] - pad];
  const size: Vec3 = [bounds.max[0] - bounds.min[0] + 2 * pad, bounds.max[1] - bounds.min[1] + 2 * pad, bounds.max[2] - bounds.min[2] + 2 * pad];
  const cell = Math.max(Math.cbrt((size[0] * size[1] * size[2]) / maxCells), 1e-3);
  const nx = Math.max(1, Math.ceil(size[0] / cell));
  const ny = Math.max(1, Math.ceil(size[1] / cell));
  const nz = Math.max(1, Math.ceil(size[2] / cell));
  const grid = new Uint16Array(nx * ny * nz);
  const o = frames.origin;
  const ns = frames.stationMm.length;
  for (let iz = 0; iz < nz; iz++) {
    const z = min[2] + (iz + 0.5) * cell;
    for (let iy = 0; iy < ny; iy++) {
      const y = min[1] + (iy + 0.5) * cell;
      for (let ix = 0; ix < nx; ix++) {
        const x = min[0] + (ix + 0.5) * cell;
        let best = 0;
        let bestD = Infinity;
        for (let j = 0; j < ns; j++) {
          const dx = x - o[3 * j];
          const dy = y - o[3 * j + 1];
          const dz = z - o[3 * j + 2];
          const d = dx * dx + dy * dy + dz * dz;
          if (d < bestD) {
            bestD = d;
            best = j;
          }
        }
        grid[(iz * ny + iy) * nx + ix] = best;
      }
    }
  }
  return { grid, min, cell, nx, ny, nz };
}

/**
 * One pass over all points: each gets its nearest station (for colouring) and, when it lies in a
 * station's slab, joins that section. A second, cheap pass over the slab points only forms the
 * outlines.
 */
export function sectionPass(
  positions: Float32Array,
  count: number,
  frames: StationFrames,
  options: SectionPassOptions,
): { sections: RawSection[]; pointStation: Uint16Array | null } {
  const ns = frames.stationMm.length;
  if (ns > 65_535) throw new Error("too many stations");
  const K = options.bins;
  const h = options.halfWidthMm;
  const { grid, min, cell, nx, ny, nz } = nearestStationGrid(frames, options.bounds);
  const o = frames.origin;
  const nrm = frames.normal;
  const U = frames.u;
  const V = frames.v;
  const pointStation = options.pointStations ? new Uint16Array(count) : null;
  const inv = 1 / cell;
  const mx = min[0];
  const my = min[1];
  const mz = min[2];
  // Slab points, compact: radius and (station·K + bin). Grows as needed.
  let cap = Math.max(1024, Math.min(count, Math.ceil(count * Math.min(1, (2.5 * h * ns) / Math.max(frames.stationMm[ns - 1] || 1, 1)))));
  let rad = new Float32Array(cap);
  let key = new Uint32Array(cap);
  let used = 0;
  // The three smallest radii per (station, bin), and counts.
  const small = new Float32Array(ns * K * 3).fill(Infinity);
  const binCount = new Uint32Array(ns * K);
  const slabCount = new Uint32Array(ns);
  const twoPi = 2 * Math.PI;
  // Plane offsets d_j = o_j·n_j, so a signed distance is x·n − d (one fewer subtraction per axis).
  const d = new Float64Array(ns);
  for (let j = 0; j < ns; j++) d[j] = o[3 * j] * nrm[3 * j] + o[3 * j + 1] * nrm[3 * j + 1] + o[3 * j + 2] * nrm[3 * j + 2];
  const nxny = nx * ny;
  for (let i = 0, p = 0; i < count; i++, p += 3) {
    const x = positions[p];
    const y = positions[p + 1];
    const z = positions[p + 2];
    // The grid is padded past the bounds of these very points: indices are in range, and
    // truncation is floor because the offsets are positive.
    const g = grid[((z - mz) * inv | 0) * nxny + ((y - my) * inv | 0) * nx + ((x - mx) * inv | 0)];
    // The grid guess is within a station or two: walk towards the plane the point is closest to.
    let best = g;
    let sb = x * nrm[3 * g] + y * nrm[3 * g + 1] + z * nrm[3 * g + 2] - d[g];
    let bestS = sb < 0 ? -sb : sb;
    const dir = sb > 0 ? 1 : -1;
    for (let j = g + dir, k = 0; k < 3 && j >= 0 && j < ns; j += dir, k++) {
      const s = x * nrm[3 * j] + y * nrm[3 * j + 1] + z * nrm[3 * j + 2] - d[j];
      const a = s < 0 ? -s : s;
      if (a >= bestS) break;
      bestS = a;
      best = j;
      sb = s;
    }
    if (pointStation) pointStation[i] = best;
    if (bestS > h) continue;
    const j3 = 3 * best;
    const dx = x - o[j3];
    const dy = y - o[j3 + 1];
    const dz = z - o[j3 + 2];
    const pu = dx * U[j3] + dy * U[j3 + 1] + dz * U[j3 + 2];
    const pv = dx * V[j3] + dy * V[j3 + 1] + dz * V[j3 + 2];
    let b = Math.floor(((Math.atan2(pv, pu) + Math.PI) / twoPi) * K);
    if (b >= K) b = K - 1;
    const r = Math.sqrt(pu * pu + pv * pv);
    const kb = best * K + b;
    if (used === cap) {
      cap = Math.ceil(cap * 1.5);
      const r2 = new Float32Array(cap);
      r2.set(rad);
      rad = r2;
      const k2 = new Uint32Array(cap);
      k2.set(key);
      key = k2;
    }
    rad[used] = r;
    key[used] = kb;
    used++;
    binCount[kb]++;
    slabCount[best]++;
    const s3 = 3 * kb;
    if (r < small[s3 + 2]) {
      if (r < small[s3 + 1]) {
        small[s3 + 2] = small[s3 + 1];
        if (r < small[s3]) {
          small[s3 + 1] = small[s3];
          small[s3] = r;
        } else {
          small[s3 + 1] = r;
        }
      } else {
        small[s3 + 2] = r;
      }
    }
  }
  // Near-wall band per bin: [base − δ, base + δ] around the third-smallest radius.
  const base = new Float32Array(ns * K);
  const band = new Float32Array(ns * K);
  for (let kb = 0; kb < ns * K; kb++) {
    const c = binCount[kb];
    const r = c >= 3 ? small[3 * kb + 2] : small[3 * kb];
    base[kb] = r;
    band[kb] = Math.max(0.5, 0.04 * r, 0.6 * h);
  }
  const sum = new Float64Array(ns * K);
  const inBand = new Uint32Array(ns * K);
  for (let q = 0; q < used; q++) {
    const kb = key[q];
    const r = rad[q];
    if (r >= base[kb] - band[kb] && r <= base[kb] + band[kb]) {
      sum[kb] += r;
      inBand[kb]++;
    }
  }
  const sections: RawSection[] = [];
  const radii = new Float64Array(K);
  for (let j = 0; j < ns; j++) {
    let wall = 0;
    for (let b = 0; b < K; b++) {
      const kb = j * K + b;
      radii[b] = inBand[kb] > 0 ? sum[kb] / inBand[kb] : NaN;
      wall += inBand[kb];
    }
    const coverage = fillEmptyBins(radii);
    const outline = coverage > 0 ? outlineFromBins(radii) : [];
    sections.push({
      index: j,
      stationMm: frames.stationMm[j],
      pointCount: slabCount[j],
      coverage,
      wallFraction: slabCount[j] > 0 ? wall / slabCount[j] : 0,
      areaMm2: coverage > 0 ? signedArea(outline) : 0,
      perimeterMm: coverage > 0 ? perimeter(outline) : 0,
      outline,
      centroidUV: coverage > 0 ? centroid(outline) : [0, 0],
    });
  }
  return { sections, pointStation };
}
