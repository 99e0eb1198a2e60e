import { describe, expect, it } from "vitest";
import { compareFlowTests, exhaustIntakeRatio, matchedLifts } from "@/lib/flow/compare";
import { computeFlowTest } from "@/lib/flow/compute";
import { interpolateAt } from "@/lib/flow/interpolate";

const curve = (pairs: Array<[number, number]>) => ({ points: pairs.map(([liftMm, flowCfmAt28]) => ({ liftMm, flowCfmAt28 })) });

describe("interpolateAt", () => {
  const pts = [
    { x: 3, y: 30 },
    { x: 1, y: 10 },
    { x: 2, y: 40 },
  ];
  it("interpolates linearly between neighbours, whatever the order", () => {
    expect(interpolateAt(pts, 1.5)).toBeCloseTo(25, 12);
    expect(interpolateAt(pts, 2.5)).toBeCloseTo(35, 12);
    expect(interpolateAt(pts, 2)).toBe(40);
  });
  it("never extrapolates", () => {
    expect(interpolateAt(pts, 0.99)).toBeNull();
    expect(interpolateAt(pts, 3.01)).toBeNull();
    expect(interpolateAt([], 1)).toBeNull();
  });
});

describe("compareFlowTests", () => {
  // Hand-worked: baseline 100/200/300 cfm at 1/2/3 mm; candidate 160/260/360 at 1.5/2.5/3.5 mm.
  const baseline = curve([
    [1, 100],
    [2, 200],
    [3, 300],
  ]);
  const candidate = curve([
    [1.5, 160],
    [2.5, 260],
    [3.5, 360],
  ]);
  const c = compareFlowTests(baseline, candidate);

  it("matches at the union of lifts inside the common range", () => {
    expect(matchedLifts(baseline, candidate)).toEqual([1.5, 2, 2.5, 3]);
    expect(c.overlapMm).toEqual([1.5, 3]);
  });
  it("gain in percent against the baseline at each matched lift", () => {
    expect(c.rows.map((r) => r.baselineCfmAt28)).toEqual([150, 200, 250, 300]);
    expect(c.rows.map((r) => r.candidateCfmAt28)).toEqual([160, 210, 260, 310]);
    expect(c.rows.map((r) => r.gainPercent)).toEqual([10 / 1.5, 5, 4, 10 / 3].map((g) => expect.closeTo(g, 10)));
    expect(c.meanGainPercent).toBeCloseTo((10 / 1.5 + 5 + 4 + 10 / 3) / 4, 10);
    expect(c.gainAtTopLiftPercent).toBeCloseTo(10 / 3, 10);
    expect(c.peakFlowGainPercent).toBeCloseTo(20, 10); // 360 against 300
  });
  it("returns no rows when the lift ranges do not overlap", () => {
    const far = compareFlowTests(baseline, curve([[5, 100], [6, 120]]));
    expect(far.rows).toEqual([]);
    expect(far.overlapMm).toBeNull();
    expect(far.meanGainPercent).toBeNull();
  });
  it("compares tests run at different depressions on the corrected figure", () => {
    const common = { valveDiameter: 45, points: [] as { lift: number; flow: number }[] };
    const at28 = computeFlowTest({ ...common, depression: 28, points: [{ lift: 5, flow: 100 }, { lift: 10, flow: 180 }] });
    const at10 = computeFlowTest({
      ...common,
      depression: 10,
      points: [{ lift: 5, flow: 100 * Math.sqrt(10 / 28) }, { lift: 10, flow: 180 * Math.sqrt(10 / 28) }],
    });
    for (const row of compareFlowTests(at28, at10).rows) expect(row.gainPercent).toBeCloseTo(0, 10);
  });
});

describe("exhaustIntakeRatio", () => {
  it("ratio at equal lift, judged against the common-practice 70–80 % band", () => {
    const intake = curve([
      [2, 100],
      [4, 200],
    ]);
    const exhaust = curve([
      [2, 75],
      [3, 112.5],
      [4, 150],
    ]);
    const r = exhaustIntakeRatio(exhaust, intake);
    expect(r.rows.map((row) => row.liftMm)).toEqual([2, 3, 4]);
    for (const row of r.rows) expect(row.ratio).toBeCloseTo(0.75, 12);
    expect(r.meanRatio).toBeCloseTo(0.75, 12);
    expect(r.withinGuideline).toBe(true); // domain.md §9 [CP]: ~70–80 %
    expect(r.guideline.label).toContain("common practice");
  });
  it("flags a ratio outside the band", () => {
    const r = exhaustIntakeRatio(curve([[2, 50], [4, 100]]), curve([[2, 100], [4, 200]]));
    expect(r.withinGuideline).toBe(false);
  });
});
