/**
 * The toolpath preview cut into drawable groups, and the arithmetic of the scrubber.
 * Pure: no three.js here, so it is unit-tested and the browser only uploads what this returns.
 *
 * A preview vertex i (i ≥ 1) ends the segment from vertex i−1; its flag says whether that
 * segment was a rapid, which tool cut it, or that there is no segment (a break). Each group holds
 * the segments of one tool and one kind (feed or rapid) in program order, so toggling a tool hides
 * two objects, and the scrubber's draw range for a group is a binary search over its end vertices.
 */
import { PREVIEW_BREAK, PREVIEW_RAPID, PREVIEW_TOOL_SHIFT } from "@/lib/toolpath/preview";

export type SegmentGroup = {
  /** Index into the preview's toolNumbers (the flag's tool bits). */
  toolIndex: number;
  rapid: boolean;
  /** End vertex of every segment of the group, ascending (the start is end − 1). */
  ends: Uint32Array;
};

/** Groups ordered by tool index, feed before rapid. Groups with no segment are left out. */
export function groupSegments(flags: Uint8Array): SegmentGroup[] {
  const counts = new Map<number, number>();
  const key = (flag: number) => ((flag >>> PREVIEW_TOOL_SHIFT) << 1) | (flag & PREVIEW_RAPID ? 1 : 0);
  for (let i = 1; i < flags.length; i++) {
    if (flags[i] & PREVIEW_BREAK) continue;
    const k = key(flags[i]);
    counts.set(k, (counts.get(k) ?? 0) + 1);
  }
  const groups = new Map<number, { group: SegmentGroup; fill: number }>();
  for (const [k, n] of counts) groups.set(k, { group: { toolIndex: k >>> 1, rapid: (k & 1) === 1, ends: new Uint32Array(n) }, fill: 0 });
  for (let i = 1; i < flags.length; i++) {
    if (flags[i] & PREVIEW_BREAK) continue;
    const g = groups.get(key(flags[i]))!;
    g.group.ends[g.fill++] = i;
  }
  return [...groups.entries()].sort((a, b) => a[0] - b[0]).map(([, g]) => g.group);
}

/** Number of the group's segments that end at or before vertex `upTo` (binary search). */
export function segmentsUpTo(ends: Uint32Array, upTo: number): number {
  let lo = 0;
  let hi = ends.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (ends[mid] <= upTo) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Index buffer (pairs of vertex indices) for a group drawn as indexed line segments. */
export function segmentIndex(ends: Uint32Array): Uint32Array {
  const out = new Uint32Array(ends.length * 2);
  for (let k = 0; k < ends.length; k++) {
    out[2 * k] = ends[k] - 1;
    out[2 * k + 1] = ends[k];
  }
  return out;
}

/**
 * Unindexed copy of a group's segments with the distance along each segment, for a dashed line
 * (dashes restart at every segment, so a short rapid still shows as dashed).
 */
export function dashedSegments(positions: Float32Array, ends: Uint32Array): { positions: Float32Array; lineDistances: Float32Array } {
  const out = new Float32Array(ends.length * 6);
  const dist = new Float32Array(ends.length * 2);
  for (let k = 0; k < ends.length; k++) {
    const b = ends[k] * 3;
    const a = b - 3;
    for (let c = 0; c < 3; c++) {
      out[6 * k + c] = positions[a + c];
      out[6 * k + 3 + c] = positions[b + c];
    }
    dist[2 * k + 1] = Math.hypot(positions[b] - positions[a], positions[b + 1] - positions[a + 1], positions[b + 2] - positions[a + 2]);
  }
  return { positions: out, lineDistances: dist };
}

/**
 * The scrubber runs over vertices 0 … n−1; position p shows every segment ending at or before p.
 * These convert between the slider's value and a vertex without off-by-one surprises.
 */
export function clampVertex(value: number, vertexCount: number): number {
  if (vertexCount <= 0 || !Number.isFinite(value)) return 0;
  return Math.min(vertexCount - 1, Math.max(0, Math.round(value)));
}

/** Fraction of the program shown at vertex `upTo`, 0 … 1. */
export function scrubFraction(upTo: number, vertexCount: number): number {
  return vertexCount <= 1 ? 1 : clampVertex(upTo, vertexCount) / (vertexCount - 1);
}

/**
 * Vertex whose program line is the first at or after `line` (lines rise through a program; the
 * preview keeps them in order). The last vertex when the line is beyond the end.
 */
export function vertexAtLine(lineNumbers: Uint32Array, line: number): number {
  if (lineNumbers.length === 0) return 0;
  let lo = 0;
  let hi = lineNumbers.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (lineNumbers[mid] < line) lo = mid + 1;
    else hi = mid;
  }
  return Math.min(lo, lineNumbers.length - 1);
}

/** Vertices advanced per animation frame so a play-through lasts about `seconds` at 60 frames/s. */
export function playStep(vertexCount: number, seconds = 20): number {
  return Math.max(1, Math.ceil(vertexCount / (seconds * 60)));
}

export type CoarseSegments = {
  /** Index pairs (start vertex, end vertex) of the merged segments. */
  index: Uint32Array;
  /** Last original end vertex each merged segment covers, ascending (for the scrubber). */
  ends: Uint32Array;
};

/**
 * A lighter stand-in for a group while the camera moves: runs of `k` consecutive segments (no
 * break or other group in between) become one segment from the run's first start to its last
 * end. Decimated previews are already dense along the path, so the shape holds at a quarter of
 * the segments; at rest the full group is drawn again.
 */
export function coarseSegments(ends: Uint32Array, k: number): CoarseSegments {
  const step = Math.max(1, Math.floor(k));
  const index: number[] = [];
  const last: number[] = [];
  let j = 0;
  while (j < ends.length) {
    // Extend the run while the next segment starts where this one ended.
    let r = j;
    while (r + 1 < ends.length && r - j + 1 < step && ends[r + 1] === ends[r] + 1) r++;
    index.push(ends[j] - 1, ends[r]);
    last.push(ends[r]);
    j = r + 1;
  }
  return { index: Uint32Array.from(index), ends: Uint32Array.from(last) };
}
