/**
 * Streaming polyline decimation for the preview: a bounded number of vertices, whatever the
 * program length, with a known bound on how far the drawn path strays from the programmed one.
 *
 * A vertex P between the last kept vertex A and the newest point N is dropped when its distance
 * to the segment A–N, added to the deviations already dropped since A, stays within the
 * tolerance. Removing one vertex moves the polyline by at most its distance to the new segment
 * (Hausdorff distance), and those moves add up, so every stretch stays within the tolerance.
 * When the buffer fills, the tolerance doubles and the kept vertices are filtered again; the
 * reported toleranceMm is the sum of all tolerances used, a safe bound on the total deviation.
 * Vertices where the segment kind (rapid/feed, tool, break) changes are always kept.
 */
import { PREVIEW_BREAK, type ToolpathPreview } from "./preview";

/** Far below what a viewer can show (a 100 mm part across 1000 pixels is 0.1 mm a pixel). */
const START_TOLERANCE_MM = 0.005;
/** After a refilter the buffer must be at most this full, so refilters stay rare. */
const REFILL_TARGET = 0.75;

export class PreviewDecimator {
  private readonly cap: number;
  private readonly xyz: Float32Array;
  private readonly flag: Uint8Array;
  private readonly line: Uint32Array;
  private count = 0;
  private tolerance = START_TOLERANCE_MM;
  private errorBound = START_TOLERANCE_MM;
  /** Deviation dropped since the last kept vertex; in a typed array so hot code never boxes doubles. */
  private readonly acc = new Float64Array(1);
  private hasPending = false;
  private readonly pend = new Float64Array(3);
  /** The last kept vertex, in full precision. */
  private readonly anchor = new Float64Array(3);
  private pf = 0;
  private pl = 0;

  constructor(maxVertices: number) {
    this.cap = Math.max(16, Math.floor(maxVertices));
    this.xyz = new Float32Array(this.cap * 3);
    this.flag = new Uint8Array(this.cap);
    this.line = new Uint32Array(this.cap);
  }

  /** Adds the end point src[0..2] of a segment whose kind is `flags` (see preview.ts). */
  add(src: Float64Array, flags: number, lineNo: number): void {
    const pend = this.pend;
    if (this.hasPending && flags === this.pf && (flags & PREVIEW_BREAK) === 0) {
      // distance from the pending point P to the segment anchor A – new point N
      const anc = this.anchor;
      const ax = anc[0];
      const ay = anc[1];
      const az = anc[2];
      const abx = src[0] - ax;
      const aby = src[1] - ay;
      const abz = src[2] - az;
      const apx = pend[0] - ax;
      const apy = pend[1] - ay;
      const apz = pend[2] - az;
      const len2 = abx * abx + aby * aby + abz * abz;
      let t = len2 > 0 ? (apx * abx + apy * aby + apz * abz) / len2 : 0;
      if (t < 0) t = 0;
      else if (t > 1) t = 1;
      const dx = apx - t * abx;
      const dy = apy - t * aby;
      const dz = apz - t * abz;
      // Measured (1M-line file, 9 A/B processes of 8 in-memory passes): rejecting on the squared
      // distance before the square root (a third of the points are rejected) stayed within noise.
      const total = this.acc[0] + Math.sqrt(dx * dx + dy * dy + dz * dz);
      if (total <= this.tolerance) {
        this.acc[0] = total;
        pend[0] = src[0];
        pend[1] = src[1];
        pend[2] = src[2];
        this.pl = lineNo;
        return;
      }
    }
    this.addSlow(src, flags, lineNo);
  }

  private addSlow(src: Float64Array, flags: number, lineNo: number): void {
    if (this.hasPending) {
      this.commit(this.pend, this.pf, this.pl);
    } else if (this.count === 0) {
      this.commit(src, flags | PREVIEW_BREAK, lineNo);
      return;
    }
    this.setPending(src, flags, lineNo);
  }

  finish(toolNumbers: number[]): ToolpathPreview {
    if (this.hasPending) {
      this.commit(this.pend, this.pf, this.pl);
      this.hasPending = false;
    }
    const n = this.count;
    return {
      positions: this.xyz.slice(0, 3 * n),
      flags: this.flag.slice(0, n),
      lineNumbers: this.line.slice(0, n),
      toolNumbers: [...toolNumbers],
      toleranceMm: this.errorBound,
    };
  }

  private setPending(src: Float64Array, f: number, l: number): void {
    const pend = this.pend;
    pend[0] = src[0];
    pend[1] = src[1];
    pend[2] = src[2];
    this.pf = f;
    this.pl = l;
    this.hasPending = true;
  }

  private commit(src: Float64Array, f: number, l: number): void {
    if (this.count === this.cap) this.shrink();
    const k = this.count++;
    this.xyz[3 * k] = src[0];
    this.xyz[3 * k + 1] = src[1];
    this.xyz[3 * k + 2] = src[2];
    this.anchor[0] = src[0];
    this.anchor[1] = src[1];
    this.anchor[2] = src[2];
    this.flag[k] = f;
    this.line[k] = l;
    this.acc[0] = 0;
  }

  /** Frees room: coarser tolerance first; plain thinning only if kind changes alone fill the buffer. */
  private shrink(): void {
    const target = Math.floor(this.cap * REFILL_TARGET);
    let factor = 2;
    for (let round = 0; round < 60 && this.count > target; round++) {
      this.tolerance *= factor;
      this.errorBound += this.tolerance;
      const before = this.count;
      this.refilter();
      // a pass that freed little says the tolerance is far too fine: grow faster
      factor = this.count > before * 0.9 ? 4 : 2;
    }
    while (this.count > target) this.thin();
    this.acc[0] = 0;
  }

  /** One pass of the same filter over the kept vertices, compacting them in place. */
  private refilter(): void {
    const { xyz, flag, line } = this;
    const tol = this.tolerance;
    const n = this.count;
    let w = 0; // slot of the last kept vertex (the anchor)
    let accum = 0;
    for (let r = 1; r < n - 1; r++) {
      // r is the candidate to drop, r + 1 the next vertex
      const f = flag[r];
      const g = flag[r + 1];
      if (f === g && (f & PREVIEW_BREAK) === 0) {
        const ax = xyz[3 * w];
        const ay = xyz[3 * w + 1];
        const az = xyz[3 * w + 2];
        const abx = xyz[3 * r + 3] - ax;
        const aby = xyz[3 * r + 4] - ay;
        const abz = xyz[3 * r + 5] - az;
        const apx = xyz[3 * r] - ax;
        const apy = xyz[3 * r + 1] - ay;
        const apz = xyz[3 * r + 2] - az;
        const len2 = abx * abx + aby * aby + abz * abz;
        let t = len2 > 0 ? (apx * abx + apy * aby + apz * abz) / len2 : 0;
        if (t < 0) t = 0;
        else if (t > 1) t = 1;
        const dx = apx - t * abx;
        const dy = apy - t * aby;
        const dz = apz - t * abz;
        const d = Math.sqrt(dx * dx + dy * dy + dz * dz);
        if (accum + d <= tol) {
          accum += d;
          continue;
        }
      }
      w++;
      if (w !== r) {
        xyz[3 * w] = xyz[3 * r];
        xyz[3 * w + 1] = xyz[3 * r + 1];
        xyz[3 * w + 2] = xyz[3 * r + 2];
        flag[w] = f;
        line[w] = line[r];
      }
      accum = 0;
    }
    if (n > 1) {
      w++;
      this.move(n - 1, w);
    }
    this.count = w + 1;
  }

  /** Last resort: keep every other vertex (the first and last always stay). */
  private thin(): void {
    const { xyz } = this;
    const last = this.count - 1;
    let w = 0;
    let kept = 0; // original index of the vertex now in slot w
    let worst = 0;
    for (let r = 2; ; r += 2) {
      if (r > last) r = last;
      for (let q = kept + 1; q < r; q++) {
        const d = distanceToSegment(
          xyz[3 * q], xyz[3 * q + 1], xyz[3 * q + 2],
          xyz[3 * w], xyz[3 * w + 1], xyz[3 * w + 2],
          xyz[3 * r], xyz[3 * r + 1], xyz[3 * r + 2],
        );
        if (d > worst) worst = d;
      }
      this.move(r, ++w);
      kept = r;
      if (r === last) break;
    }
    this.count = w + 1;
    this.errorBound += worst;
  }

  private move(from: number, to: number): void {
    if (from === to) return;
    this.xyz[3 * to] = this.xyz[3 * from];
    this.xyz[3 * to + 1] = this.xyz[3 * from + 1];
    this.xyz[3 * to + 2] = this.xyz[3 * from + 2];
    this.flag[to] = this.flag[from];
    this.line[to] = this.line[from];
  }
}

/** Distance from point P to the segment A–B in 3D. */
export function distanceToSegment(
  px: number, py: number, pz: number,
  ax: number, ay: number, az: number,
  bx: number, by: number, bz: number,
): number {
  const abx = bx - ax;
  const aby = by - ay;
  const abz = bz - az;
  const apx = px - ax;
  const apy = py - ay;
  const apz = pz - az;
  const len2 = abx * abx + aby * aby + abz * abz;
  let t = len2 > 0 ? (apx * abx + apy * aby + apz * abz) / len2 : 0;
  if (t < 0) t = 0;
  else if (t > 1) t = 1;
  const dx = apx - t * abx;
  const dy = apy - t * aby;
  const dz = apz - t * abz;
  return Math.sqrt(dx * dx + dy * dy + dz * dz);
}
