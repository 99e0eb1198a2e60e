import { describe, expect, it } from "vitest";
import { exhaustIntakeRatio } from "@/lib/flow/compare";
import { computeFlowTest } from "@/lib/flow/compute";
import { defaultDemoLifts, demoFlowCurve } from "@/lib/flow/demo";

const asTest = (valveMm: number, points: { liftMm: number; flowCfm: number }[]) =>
  computeFlowTest({ valveDiameter: valveMm, depression: 28, points: points.map((p) => ({ lift: p.liftMm, flow: p.flowCfm })) });

describe("demoFlowCurve (invented data for the demo)", () => {
  it("is repeatable for a seed and differs between seeds", () => {
    const a = demoFlowCurve({ valveMm: 51.3, kind: "ported", seed: 3 });
    expect(demoFlowCurve({ valveMm: 51.3, kind: "ported", seed: 3 })).toEqual(a);
    expect(demoFlowCurve({ valveMm: 51.3, kind: "ported", seed: 4 })).not.toEqual(a);
  });
  it("rises with lift and flattens (clean curve)", () => {
    const pts = demoFlowCurve({ valveMm: 51.3, kind: "stock", scatter: 0 });
    for (let i = 1; i < pts.length; i++) expect(pts[i].flowCfm).toBeGreaterThan(pts[i - 1].flowCfm);
    const firstStep = pts[1].flowCfm - pts[0].flowCfm;
    const lastStep = pts[pts.length - 1].flowCfm - pts[pts.length - 2].flowCfm;
    expect(lastStep).toBeLessThan(firstStep / 3);
  });
  it("default lifts step 0.050 in up to L/D 0.35", () => {
    const lifts = defaultDemoLifts(51.3);
    expect(lifts[0]).toBeCloseTo(1.27, 3);
    expect(lifts[lifts.length - 1]).toBeLessThanOrEqual(0.35 * 51.3);
    expect(lifts[lifts.length - 1] + 1.27).toBeGreaterThan(0.35 * 51.3);
  });
  it("intake valve-area Cd at top lift lands in the common-practice 0.45–0.70 band, ported above stock", () => {
    // domain.md §5 [CP]: about 0.45 (stock) to 0.70 (well ported), valve-head basis, max lift.
    const stock = asTest(51.3, demoFlowCurve({ valveMm: 51.3, kind: "stock" })).summary.peakCdValve;
    const ported = asTest(51.3, demoFlowCurve({ valveMm: 51.3, kind: "ported" })).summary.peakCdValve;
    expect(stock).toBeGreaterThanOrEqual(0.45);
    expect(ported).toBeLessThanOrEqual(0.7);
    expect(ported).toBeGreaterThan(stock + 0.05);
  });
  it("exhaust/intake ratio near the common-practice 70–80 % for usual valve sizes", () => {
    for (const kind of ["stock", "ported"] as const) {
      const intake = asTest(51.3, demoFlowCurve({ valveMm: 51.3, kind }));
      const exhaust = asTest(40.6, demoFlowCurve({ valveMm: 40.6, kind, port: "exhaust" }));
      const ratio = exhaustIntakeRatio(exhaust, intake).meanRatio;
      expect(ratio).toBeGreaterThanOrEqual(0.7); // domain.md §9 [CP]
      expect(ratio).toBeLessThanOrEqual(0.8);
    }
  });
});
