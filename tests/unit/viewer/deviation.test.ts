import ndarray from "ndarray";
import createKDTree from "static-kdtree";
import { describe, expect, it } from "vitest";
import { binCounts, NearestGrid, niceLimit, signedDeviations, summarizeDeviation, symmetricEdges, type Vec3 } from "@/components/viewer/deviation";
import { makeRandom } from "@/lib/geometry/index";

/** Points on the wall of a straight round tube along X (radius r, length 60), with a station per point. */
function tube(r: number, n: number, seed: number) {
  const rnd = makeRandom(seed);
  const positions = new Float32Array(3 * n);
  const stations = new Uint16Array(n);
  for (let i = 0; i < n; i++) {
    const x = rnd() * 60;
    const t = rnd() * 2 * Math.PI;
    positions.set([x, r * Math.cos(t), r * Math.sin(t)], 3 * i);
    stations[i] = Math.round(x / 2);
  }
  return { positions, stations };
}
const centerline: Vec3[] = Array.from({ length: 31 }, (_, k) => [2 * k, 0, 0]);

describe("nearest point by spatial hash", () => {
  it("finds the same nearest distance as a k-d tree (static-kdtree as the reference)", () => {
    const a = tube(15, 20_000, 1);
    const grid = new NearestGrid(a.positions);
    const tree = createKDTree(ndarray(a.positions, [20_000, 3]));
    const rnd = makeRandom(5);
    for (let q = 0; q < 400; q++) {
      // Queries near and away from the wall, and a few well outside.
      const p: Vec3 = [rnd() * 70 - 5, rnd() * 40 - 20, rnd() * 40 - 20];
      const mine = grid.nearest(p[0], p[1], p[2], 1000);
      const ref = tree.nn(p) as number;
      const refD = Math.hypot(a.positions[3 * ref] - p[0], a.positions[3 * ref + 1] - p[1], a.positions[3 * ref + 2] - p[2]);
      expect(mine.distance).toBeCloseTo(refD, 4);
    }
    tree.dispose();
  });

  it("gives up beyond its search radius instead of scanning everything", () => {
    const grid = new NearestGrid(Float32Array.from([0, 0, 0, 1, 0, 0, 0, 1, 0]), 0.5);
    expect(grid.nearest(100, 100, 100, 4).index).toBe(-1);
    expect(grid.nearest(0.1, 0.1, 0, 4).index).toBe(0);
  });
});

describe("signed deviation of scan B from scan A", () => {
  const a = tube(15, 30_000, 2);
  const grid = new NearestGrid(a.positions);
  const sign = { stationsA: a.stations, centerlineA: centerline };

  it("a tube 0.5 mm wider shows +0.5 mm (more room), a narrower one −0.5 mm", () => {
    for (const [r, expected] of [[15.5, 0.5], [14.5, -0.5]] as const) {
      const b = tube(r, 5_000, 3);
      const out = new Float32Array(5_000);
      signedDeviations(grid, a.positions, b.positions, out, 0, 5_000, sign);
      const s = summarizeDeviation(out);
      // Nearest-point distance ≥ the radial gap; with ~0.5 mm spacing of A it stays within ~0.15 mm above.
      expect(s.meanAbsMm).toBeGreaterThanOrEqual(0.5 - 1e-4);
      expect(s.meanAbsMm).toBeLessThan(0.65);
      expect(s.outwardShare).toBe(expected > 0 ? 1 : 0);
    }
  });

  it("fills only the slice asked for (the viewer works in slices)", () => {
    const b = tube(15.5, 100, 4);
    const out = new Float32Array(100).fill(Number.NaN);
    signedDeviations(grid, a.positions, b.positions, out, 10, 20, sign);
    expect(out.slice(10, 20).every(Number.isFinite)).toBe(true);
    expect(Number.isNaN(out[9]) && Number.isNaN(out[20])).toBe(true);
  });
});

describe("deviation summary and scale", () => {
  it("summarizes absolute deviations and leaves unmatched points out", () => {
    const s = summarizeDeviation(Float32Array.from([0.1, -0.3, 0.2, Number.NaN, 0.4]));
    expect(s.measured).toBe(4);
    expect(s.unmatched).toBe(1);
    expect(s.meanAbsMm).toBeCloseTo(0.25, 6);
    expect(s.maxAbsMm).toBeCloseTo(0.4, 6);
    expect(s.p95AbsMm).toBeCloseTo(0.4, 6);
    expect(s.outwardShare).toBe(0.75);
  });

  it("picks round limits at or above a value", () => {
    expect(niceLimit(0.13)).toBeCloseTo(0.2, 12);
    expect(niceLimit(0.5)).toBeCloseTo(0.5, 12);
    expect(niceLimit(3.2)).toBe(5);
    expect(niceLimit(7)).toBe(10);
    expect(niceLimit(0)).toBe(0.1);
  });

  it("bins every measured value once, clamping the tails into the end bins", () => {
    const edges = symmetricEdges(1, 4);
    expect(edges).toEqual([-1, -0.5, 0, 0.5, 1]);
    const counts = binCounts(Float32Array.from([-3, -0.7, -0.5, 0, 0.2, 0.99, 1, 8, Number.NaN]), edges);
    expect(counts).toEqual([2, 1, 2, 3]);
    expect(counts.reduce((a, b) => a + b, 0)).toBe(8);
  });
});
