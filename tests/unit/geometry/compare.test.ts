import { describe, expect, it } from "vitest";
import { compareScans, pointDeviation, intakePortShape, sampleTubeCloud, makeRandom } from "@/lib/geometry/index";

const shape = intakePortShape({});
const finned = intakePortShape({ fin: true });
const a = sampleTubeCloud(shape, { points: 120_000, seed: 1 });
const again = sampleTubeCloud(shape, { points: 120_000, seed: 2 });

function shifted(c: { positions: Float32Array; count: number }, dy: number) {
  const p = c.positions.slice();
  for (let i = 1; i < p.length; i += 3) p[i] += dy;
  return { positions: p, count: c.count };
}

describe("comparison of two scans in the plate's frame", () => {
  it("a re-scan of the same port: areas agree, deviation about the point spacing", () => {
    const c = compareScans(a, again, { entry: [0, 0, 0] });
    expect(c.stations.length).toBeGreaterThan(40);
    for (const s of c.stations) expect(Math.abs(s.differencePercent)).toBeLessThan(0.5);
    expect(Math.abs(c.volumeDifferenceCc)).toBeLessThan(0.5);
    // 120 000 points over ~13 000 mm² of wall: spacing ≈ 0.33 mm, nearest neighbour well below it.
    expect(c.deviation.meanMm).toBeLessThan(0.25);
    expect(c.deviation.p95Mm).toBeGreaterThanOrEqual(c.deviation.meanMm);
    expect(c.deviation.maxMm).toBeGreaterThanOrEqual(c.deviation.p95Mm);
  });

  it("a scan shifted 0.5 mm sideways deviates by about 0.5 mm", () => {
    const c = compareScans(a, shifted(again, 0.5), { entry: [0, 0, 0] });
    // Along the side walls the shift is normal to the wall (0.5 mm); on roof and floor it slides
    // along the wall (≈ 0): the mean lies between, the 95th percentile near 0.5.
    expect(c.deviation.meanMm).toBeGreaterThan(0.2);
    expect(c.deviation.p95Mm).toBeGreaterThan(0.4);
    expect(c.deviation.p95Mm).toBeLessThan(0.65);
  });

  it("a fin left in the new scan shows as lost area where the fin is", () => {
    const b = sampleTubeCloud(finned, { points: 120_000, seed: 3 });
    const c = compareScans(a, b, { entry: [0, 0, 0] });
    const worst = c.largestChange!;
    expect(worst.differenceMm2).toBeLessThan(-10);
    // The fin spans the last part of the bend and the bowl (generate.ts: 55 % of the arc to 3 mm short of the end).
    const arc = (32 * 70 * Math.PI) / 180;
    expect(worst.stationMm).toBeGreaterThan(40 + 0.55 * arc - 2);
    expect(c.deviation.maxMm).toBeGreaterThan(3);
  });

  it("nearest-point distances equal a brute-force search (reference for the k-d tree use)", () => {
    const rand = makeRandom(8);
    const mk = (n: number) => ({ positions: Float32Array.from({ length: 3 * n }, () => rand() * 10), count: n });
    const ref = mk(2000);
    const q = mk(300);
    const d = pointDeviation(ref, q);
    const brute: number[] = [];
    for (let i = 0; i < q.count; i++) {
      let best = Infinity;
      for (let j = 0; j < ref.count; j++) {
        best = Math.min(best, Math.hypot(q.positions[3 * i] - ref.positions[3 * j], q.positions[3 * i + 1] - ref.positions[3 * j + 1], q.positions[3 * i + 2] - ref.positions[3 * j + 2]));
      }
      brute.push(best);
    }
    brute.sort((x, y) => x - y);
    expect(d.maxMm).toBeCloseTo(brute[brute.length - 1], 9);
    expect(d.meanMm).toBeCloseTo(brute.reduce((s, x) => s + x, 0) / brute.length, 9);
    expect(d.p95Mm).toBeCloseTo(brute[Math.ceil(0.95 * brute.length) - 1], 9); // nearest-rank 95th percentile
  });
});
