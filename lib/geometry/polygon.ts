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

/**
 * Keeps at most `maxVertices` by dropping the vertices that change the area least (Visvalingam),
 * so a fin's corners survive where a stride would cut them.
 */
export function simplifyPolygon(xy: ArrayLike<number>, maxVertices: number): number[] {
  const n = xy.length >> 1;
  const pts = Array.from(xy);
  if (n <= maxVertices) return pts;
  const prev = new Int32Array(n);
  const next = new Int32Array(n);
  const alive = new Uint8Array(n).fill(1);
  for (let i = 0; i < n; i++) {
    prev[i] = (i + n - 1) % n;
    next[i] = (i + 1) % n;
  }
  const weight = (i: number) => {
    const a = prev[i];
    const c = next[i];
    return Math.abs((pts[2 * a] - pts[2 * i]) * (pts[2 * c + 1] - pts[2 * i + 1]) - (pts[2 * c] - pts[2 * i]) * (pts[2 * a + 1] - pts[2 * i + 1]));
  };
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) w[i] = weight(i);
  let left = n;
  // O(n²) is fine: n ≤ a few hundred outline vertices.
  while (left > maxVertices) {
    let best = -1;
    for (let i = 0; i < n; i++) if (alive[i] && (best < 0 || w[i] < w[best])) best = i;
    alive[best] = 0;
    left--;
    const a = prev[best];
    const c = next[best];
    next[a] = c;
    prev[c] = a;
    w[a] = weight(a);
    w[c] = weight(c);
  }
  const out: number[] = [];
  for (let i = 0; i < n; i++) if (alive[i]) out.push(pts[2 * i], pts[2 * i + 1]);
  return out;
}
