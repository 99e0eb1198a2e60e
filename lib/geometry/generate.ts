import type { Vec3 } from "./types";

/**
 * Invented port geometry for the demo seed, the tests and the benchmark. A tube is a centerline
 * with a frame (t along the port, u and v across it, u × v = t) and a closed outline polygon in
 * (u, v) at every arc length s. Shapes are analytic, so tests know the exact answer.
 */
export type Frame = { origin: Vec3; t: Vec3; u: Vec3; v: Vec3 };

export type TubeShape = {
  /** Centerline arc length, mm. */
  length: number;
  frameAt(s: number): Frame;
  /** Closed outline, counter-clockwise in (u, v), flat [u0, v0, u1, v1, …], mm. */
  outlineAt(s: number): number[];
};

/** Deterministic PRNG (mulberry32): the same seed gives the same cloud on every machine. */
export function makeRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function circleOutline(radius: number, segments = 256, cu = 0, cv = 0): number[] {
  const out: number[] = [];
  for (let k = 0; k < segments; k++) {
    const a = (2 * Math.PI * k) / segments;
    out.push(cu + radius * Math.cos(a), cv + radius * Math.sin(a));
  }
  return out;
}

export type Fin = { widthMm: number; depthMm: number };

/**
 * Rounded rectangle of half-width a (u), half-height c (v) and corner radius rc, counter-clockwise
 * from (a, 0). An optional fin hangs from the middle of the top edge (+v) towards the centre, as
 * a guide-boss remnant does: its sides are parallel, so the outline is not convex.
 */
export function roundedRectOutline(a: number, c: number, rc: number, cornerSegments = 16, fin?: Fin): number[] {
  const r = Math.min(rc, a, c);
  const out: number[] = [];
  const corner = (cx: number, cy: number, start: number) => {
    for (let k = 0; k <= cornerSegments; k++) {
      const ang = start + (Math.PI / 2) * (k / cornerSegments);
      out.push(cx + r * Math.cos(ang), cy + r * Math.sin(ang));
    }
  };
  out.push(a, 0);
  corner(a - r, c - r, 0); // top right
  if (fin) {
    const hw = fin.widthMm / 2;
    out.push(hw, c, hw, c - fin.depthMm, -hw, c - fin.depthMm, -hw, c);
  }
  corner(-(a - r), c - r, Math.PI / 2); // top left
  out.push(-a, 0);
  corner(-(a - r), -(c - r), Math.PI); // bottom left
  corner(a - r, -(c - r), (3 * Math.PI) / 2); // bottom right
  return dedupe(out);
}

function dedupe(xy: number[]): number[] {
  const out: number[] = [];
  for (let i = 0; i < xy.length; i += 2) {
    const n = out.length;
    if (n >= 2 && Math.abs(out[n - 2] - xy[i]) < 1e-12 && Math.abs(out[n - 1] - xy[i + 1]) < 1e-12) continue;
    out.push(xy[i], xy[i + 1]);
  }
  if (out.length >= 4 && Math.abs(out[0] - out[out.length - 2]) < 1e-12 && Math.abs(out[1] - out[out.length - 1]) < 1e-12) out.length -= 2;
  return out;
}

/** Straight along +x from the origin. */
export function straightTube(length: number, outlineAt: (s: number) => number[]): TubeShape {
  return {
    length,
    frameAt: (s) => ({ origin: [s, 0, 0], t: [1, 0, 0], u: [0, 1, 0], v: [0, 0, 1] }),
    outlineAt,
  };
}

export type BendPath = { straightInMm: number; bendRadiusMm: number; bendDeg: number; straightOutMm: number };

/**
 * Along +x for straightIn, then a circular bend of bendDeg turning down (towards −z, as an intake
 * port turns towards its valve), then straight again. u = +y throughout; v = t × u is the roof.
 */
export function bentTube(path: BendPath, outlineAt: (s: number) => number[]): TubeShape {
  const { straightInMm: l1, bendRadiusMm: rb, straightOutMm: l3 } = path;
  const theta = (path.bendDeg * Math.PI) / 180;
  const arc = rb * theta;
  const frame = (p: Vec3, t: Vec3): Frame => ({ origin: p, t, u: [0, 1, 0], v: [-t[2], 0, t[0]] });
  return {
    length: l1 + arc + l3,
    frameAt(s) {
      if (s <= l1) return frame([s, 0, 0], [1, 0, 0]);
      if (s <= l1 + arc) {
        const al = (s - l1) / rb;
        return frame([l1 + rb * Math.sin(al), 0, -rb + rb * Math.cos(al)], [Math.cos(al), 0, -Math.sin(al)]);
      }
      const end: Vec3 = [l1 + rb * Math.sin(theta), 0, -rb + rb * Math.cos(theta)];
      const t: Vec3 = [Math.cos(theta), 0, -Math.sin(theta)];
      const d = s - l1 - arc;
      return frame([end[0] + d * t[0], 0, end[2] + d * t[2]], t);
    },
    outlineAt,
  };
}

export type IntakePortOptions = {
  valveDiameterMm?: number;
  /** Throat (smallest section) diameter as a percentage of the valve. */
  throatPercent?: number;
  entryWidthMm?: number;
  entryHeightMm?: number;
  runnerMm?: number;
  bendDeg?: number;
  bendRadiusMm?: number;
  /** Straight part from the end of the bend to the seat. */
  bowlMm?: number;
  /** Seat circle diameter at the valve end, as a percentage of the valve. */
  seatPercent?: number;
  fin?: boolean;
};

const smooth = (x: number) => {
  const t = Math.min(1, Math.max(0, x));
  return t * t * (3 - 2 * t);
};

/**
 * An invented intake port: an oval-ish rounded-rectangle entry that narrows and rounds off
 * through a bend towards the valve, reaches its throat a few millimetres above the seat and opens
 * slightly to the seat circle. With `fin`, a guide-boss fin hangs from the roof in the bowl.
 */
export function intakePortShape(options: IntakePortOptions = {}): TubeShape & { throatStationMm: number; throatDiameterMm: number } {
  const valve = options.valveDiameterMm ?? 46;
  const throatD = (valve * (options.throatPercent ?? 87)) / 100;
  const seatD = (valve * (options.seatPercent ?? 91)) / 100;
  const w0 = options.entryWidthMm ?? 44;
  const h0 = options.entryHeightMm ?? 36;
  const path: BendPath = {
    straightInMm: options.runnerMm ?? 40,
    bendRadiusMm: options.bendRadiusMm ?? 32,
    bendDeg: options.bendDeg ?? 70,
    straightOutMm: options.bowlMm ?? 16,
  };
  const arc = (path.bendRadiusMm * path.bendDeg * Math.PI) / 180;
  const length = path.straightInMm + arc + path.straightOutMm;
  const throatS = length - 5;
  const finFrom = path.straightInMm + arc * 0.55;
  const finTo = length - 3;
  const outlineAt = (s: number): number[] => {
    // b: 0 at the entry → 1 at the throat; the shape rounds off as it narrows.
    const b = smooth(s / throatS);
    let a = (w0 / 2) * (1 - b) + (throatD / 2) * b;
    let c = (h0 / 2) * (1 - b) + (throatD / 2) * b;
    if (s > throatS) {
      const g = smooth((s - throatS) / (length - throatS));
      a = (throatD / 2) * (1 - g) + (seatD / 2) * g;
      c = a;
    }
    const rc = Math.min(a, c) * (0.45 + 0.55 * b);
    const fin = options.fin && s >= finFrom && s <= finTo ? { widthMm: 5, depthMm: 4 * Math.sin((Math.PI * (s - finFrom)) / (finTo - finFrom)) + 0.5 } : undefined;
    return roundedRectOutline(a, c, rc, 16, fin);
  };
  return { ...bentTube(path, outlineAt), throatStationMm: throatS, throatDiameterMm: throatD };
}

type Ring = { s: number; frame: Frame; xy: number[]; cum: Float64Array; perim: number };

function ringAt(shape: TubeShape, s: number): Ring {
  const xy = shape.outlineAt(s);
  const n = xy.length >> 1;
  const cum = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    cum[i + 1] = cum[i] + Math.hypot(xy[2 * j] - xy[2 * i], xy[2 * j + 1] - xy[2 * i + 1]);
  }
  return { s, frame: shape.frameAt(s), xy, cum, perim: cum[n] };
}

export type SampleOptions = {
  points: number;
  seed?: number;
  /** Spread of probe noise, mm (uniform in a cube of this half-width). */
  noiseMm?: number;
  /** Outlines are computed on rings this far apart; points are spread between them. */
  ringSpacingMm?: number;
};

/**
 * Random points on the tube wall, about uniform per unit of wall area (a probe scan has roughly
 * even spacing), returned as a flat Float32Array.
 */
export function sampleTubeCloud(shape: TubeShape, options: SampleOptions): { positions: Float32Array; count: number } {
  const rand = makeRandom(options.seed ?? 1);
  const noise = options.noiseMm ?? 0.005;
  const ds = options.ringSpacingMm ?? 0.2;
  const nRings = Math.max(2, Math.round(shape.length / ds) + 1);
  const rings: Ring[] = [];
  const ringWeight = new Float64Array(nRings + 1);
  for (let k = 0; k < nRings; k++) {
    const ring = ringAt(shape, (shape.length * k) / (nRings - 1));
    rings.push(ring);
    ringWeight[k + 1] = ringWeight[k] + ring.perim;
  }
  const total = ringWeight[nRings];
  const count = options.points;
  const positions = new Float32Array(count * 3);
  const step = shape.length / (nRings - 1);
  for (let p = 0; p < count; p++) {
    const k = upperBound(ringWeight, rand() * total) - 1;
    const ring = rings[Math.min(Math.max(k, 0), nRings - 1)];
    const along = ring.cum;
    const d = rand() * ring.perim;
    const i = Math.min(upperBound(along, d) - 1, (ring.xy.length >> 1) - 1);
    const j = (i + 1) % (ring.xy.length >> 1);
    const f = (d - along[i]) / Math.max(along[i + 1] - along[i], 1e-12);
    const x = ring.xy[2 * i] + f * (ring.xy[2 * j] - ring.xy[2 * i]);
    const y = ring.xy[2 * i + 1] + f * (ring.xy[2 * j + 1] - ring.xy[2 * i + 1]);
    // Spread along the axis between rings; ends stay inside [0, length].
    const ds0 = Math.min(Math.max((rand() - 0.5) * step, -ring.s), shape.length - ring.s);
    const { origin: o, t, u, v } = ring.frame;
    for (let c = 0; c < 3; c++) {
      positions[3 * p + c] = o[c] + ds0 * t[c] + x * u[c] + y * v[c] + (rand() * 2 - 1) * noise;
    }
  }
  return { positions, count };
}

/** First index with arr[index] > value (arr ascending). */
function upperBound(arr: Float64Array, value: number): number {
  let lo = 0;
  let hi = arr.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (arr[mid] <= value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * A wall mesh of the tube, open at both ends as a digitized port is: rings every ringSpacingMm,
 * each resampled to `around` points evenly along its outline, neighbouring rings joined by two
 * triangles per quad, wound so normals point out of the port (into the metal).
 */
export function tubeMesh(shape: TubeShape, ringSpacingMm = 1, around = 96): { positions: Float32Array; faces: Uint32Array; count: number } {
  const nRings = Math.max(2, Math.round(shape.length / ringSpacingMm) + 1);
  const positions = new Float32Array(nRings * around * 3);
  for (let k = 0; k < nRings; k++) {
    const ring = ringAt(shape, (shape.length * k) / (nRings - 1));
    const n = ring.xy.length >> 1;
    let i = 0;
    for (let m = 0; m < around; m++) {
      const d = (ring.perim * m) / around;
      while (i < n - 1 && ring.cum[i + 1] <= d) i++;
      const j = (i + 1) % n;
      const f = (d - ring.cum[i]) / Math.max(ring.cum[i + 1] - ring.cum[i], 1e-12);
      const x = ring.xy[2 * i] + f * (ring.xy[2 * j] - ring.xy[2 * i]);
      const y = ring.xy[2 * i + 1] + f * (ring.xy[2 * j + 1] - ring.xy[2 * i + 1]);
      const { origin: o, u, v } = ring.frame;
      const w = 3 * (k * around + m);
      for (let c = 0; c < 3; c++) positions[w + c] = o[c] + x * u[c] + y * v[c];
    }
  }
  const faces = new Uint32Array((nRings - 1) * around * 6);
  let f = 0;
  for (let k = 0; k + 1 < nRings; k++) {
    for (let m = 0; m < around; m++) {
      const a = k * around + m;
      const b = k * around + ((m + 1) % around);
      const c = a + around;
      const d = b + around;
      faces[f++] = a;
      faces[f++] = b;
      faces[f++] = c;
      faces[f++] = b;
      faces[f++] = d;
      faces[f++] = c;
    }
  }
  return { positions, faces, count: nRings * around };
}
