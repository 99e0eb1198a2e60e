/**
 * Plane polygons stored flat: [x0, y0, x1, y1, …], closed implicitly (last vertex joins the first).
 */

/** Shoelace area: A = ½·Σ(x_i·y_{i+1} − x_{i+1}·y_i); positive when counter-clockwise. */
export function signedArea(xy: ArrayLike<number>): number {
  const n = xy.length >> 1;
  let twice = 0;
  for (let i = 0, j = n - 1; i < n; j = i++) twice += xy[2 * j] * xy[2 * i + 1] - xy[2 * i] * xy[2 * j + 1];
  return twice / 2;
}

export function perimeter(xy: ArrayLike<number>): number {
  const n = xy.length >> 1;
  let p = 0;
  for (let i = 0, j = n - 1; i < n; j = i++) p += Math.hypot(xy[2 * i] - xy[2 * j], xy[2 * i + 1] - xy[2 * j + 1]);
  return p;
}

/** Area centroid of a simple polygon (falls back to the vertex mean for a degenerate one). */
export function centroid(xy: ArrayLike<number>): [number, number] {
  const n = xy.length >> 1;
  let a2 = 0;
  let cx = 0;
  let cy = 0;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const cross = xy[2 * j] * xy[2 * i + 1] - xy[2 * i] * xy[2 * j + 1];
    a2 += cross;
    cx += (xy[2 * j] + xy[2 * i]) * cross;
    cy += (xy[2 * j + 1] + xy[2 * i + 1]) * cross;
  }
  if (Math.abs(a2) < 1e-12) {
    let mx = 0;
    let my = 0;
    for (let i = 0; i < n; i++) {
      mx += xy[2 * i];
      my += xy[2 * i + 1];
    }
    return [mx / Math.max(n, 1), my / Math.max(n, 1)];
  }
  return [cx / (3 * a2), cy / (3 * a2)];
}

/** Convex hull (monotone chain), counter-clockwise. Used only to show what a hull would overstate. */
export function convexHull(xy: ArrayLike<number>): number[] {
  const n = xy.length >> 1;
  const idx = Array.from({ length: n }, (_, i) => i).sort((a, b) => xy[2 * a] - xy[2 * b] || xy[2 * a + 1] - xy[2 * b + 1]);
  const cross = (o: number, a: number, b: number) =>
    (xy[2 * a] - xy[2 * o]) * (xy[2 * b + 1] - xy[2 * o + 1]) - (xy[2 * a + 1] - xy[2 * o + 1]) * (xy[2 * b] - xy[2 * o]);
  const lower: number[] = [];
  for (const i of idx) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], i) <= 0) lower.pop();
    lower.push(i);
  }
  const upper: number[] = [];
  for (let k = idx.length - 1; k >= 0; k--) {
    const i = idx[k];
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], i) <= 0) upper.pop();
    upper.push(i);
  }
  const hull = lower.slice(0, -1).concat(upper.slice(0, -1));
  return hull.flatMap((i) => [xy[2 * i], xy[2 * i + 1]]);
}

/** Area-equivalent circle diameter √(4A/π). */
export function equivalentDiameter(area: number): number {
  return Math.sqrt((4 * Math.max(area, 0)) / Math.PI);
}

/** Hydraulic diameter 4A/P. */
export function hydraulicDiameter(area: number, perim: number): number {
  return perim > 0 ? (4 * area) / perim : 0;
}

/** Twice the area of the triangle a vertex makes with its neighbours (Visvalingam's measure). */
function areaWeight(pts: number[], i: number, n: number): number {
  const a = (i + n - 1) % n;
  const c = (i + 1) % n;
  return Math.abs((pts[2 * a] - pts[2 * i]) * (pts[2 * c + 1] - pts[2 * i + 1]) - (pts[2 * c] - pts[2 * i]) * (pts[2 * a + 1] - pts[2 * i + 1]));
}

/**
 * Keeps at most `maxVertices` by dropping the vertices that change the area least (Visvalingam's
 * measure), so a fin's corners survive where a stride would cut them. Done in passes: each pass
 * drops the smallest-area vertices, never two neighbours at once, then re-measures.
 */
export function simplifyPolygon(xy: ArrayLike<number>, maxVertices: number): number[] {
  let pts = Array.from(xy);
  // Halving fast path for exactly twice the budget (256 bins → 128 vertices): of each neighbouring
  // pair keep the vertex that matters more to the area.
  if (pts.length / 2 === 2 * maxVertices) {
    const n = pts.length >> 1;
    const next: number[] = [];
    for (let i = 0; i + 1 < n; i += 2) {
      const k = areaWeight(pts, i, n) >= areaWeight(pts, i + 1, n) ? i : i + 1;
      next.push(pts[2 * k], pts[2 * k + 1]);
    }
    if (n % 2 === 1) next.push(pts[2 * (n - 1)], pts[2 * (n - 1) + 1]);
    pts = next;
  }
  while (pts.length / 2 > maxVertices) {
    const n = pts.length >> 1;
    // A pass drops at most a tenth of the vertices, so the measure stays close to sequential.
    const excess = Math.min(n - maxVertices, Math.max(1, Math.floor(n / 10)));
    const w = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const a = (i + n - 1) % n;
      const c = (i + 1) % n;
      w[i] = Math.abs((pts[2 * a] - pts[2 * i]) * (pts[2 * c + 1] - pts[2 * i + 1]) - (pts[2 * c] - pts[2 * i]) * (pts[2 * a + 1] - pts[2 * i + 1]));
    }
    const order = Array.from({ length: n }, (_, i) => i).sort((p, q) => w[p] - w[q]);
    const drop = new Uint8Array(n);
    let dropped = 0;
    for (const i of order) {
      if (dropped === excess) break;
      if (drop[(i + n - 1) % n] || drop[(i + 1) % n]) continue;
      drop[i] = 1;
      dropped++;
    }
    const next: number[] = [];
    for (let i = 0; i < n; i++) if (!drop[i]) next.push(pts[2 * i], pts[2 * i + 1]);
    pts = next;
  }
  return pts;
}
