import { describe, expect, it } from "vitest";
import { ZodError } from "zod";
import { computeFlowTest, tryComputeFlowTest } from "@/lib/flow/compute";
import { COMPRESSIBILITY_NOTE, ESTIMATE_CAUTION, INCH_OF_WATER, DENSITY_LAW } from "@/lib/flow/labels";
import type { FlowTestInput } from "@/lib/flow/schema";

/** domain.md §5 case: 1.80 in valve, 220 cfm at 28 inH2O in 0.075 lb/ft³ air. */
const inchTest: FlowTestInput = {
  valveDiameter: 1.8,
  seatDiameter: 1.62,
  lengthUnit: "in",
  depression: 28,
  depressionUnit: "inH2O",
  standardAir: "fan075",
  liftUnit: "in",
  flowUnit: "cfm",
  points: [
    { lift: 0.45, flow: 220 },
    { lift: 0.3, flow: 220 },
  ],
};

describe("computeFlowTest: per-point columns", () => {
  const result = computeFlowTest(inchTest);

  it("sorts points by lift and gives lift in both units and L/D", () => {
    expect(result.points.map((p) => p.liftIn)).toEqual([0.3, 0.45].map((v) => expect.closeTo(v, 12)));
    expect(result.points[1].liftMm).toBeCloseTo(11.43, 10); // 0.45 in × 25.4
    expect(result.points[1].ld).toBeCloseTo(0.25, 12);
  });
  it("flow coefficients on curtain, valve and seat", () => {
    const [low, high] = result.points;
    expect(low.cdCurtain).toBeCloseTo(0.88039, 5); // domain.md §5, curtain at L = 0.300 in
    expect(high.cdValve).toBeCloseTo(0.58693, 5); // domain.md §5, valve-head basis
    expect(high.cdCurtain).toBeCloseTo(0.58693, 5); // domain.md §5: Ac = Av at L/D = 0.25
    expect(high.cdSeat).toBeCloseTo(0.7246, 5); // domain.md §5, 90 % throat 1.62 in
  });
  it("ideal velocity and flow per square inch", () => {
    expect(result.points[0].idealVelocityMs).toBeCloseTo(107.7532, 4); // domain.md §3, 0.075 lb/ft³
    expect(result.points[0].cfmPerSqInValve).toBeCloseTo(220 / 2.54469, 3); // valve area from domain.md §5
    expect(result.summary.idealCfmPerSqInAt28).toBeCloseTo(147.3, 3); // domain.md §3
  });
  it("has no section figures without a section", () => {
    expect(result.points[0].sectionVelocityMs).toBeNull();
    expect(result.summary.minSectionAreaMm2).toBeNull();
  });
  it("uses standard air when no ambient readings are given", () => {
    expect(result.densitySource).toBe("standard-air");
    expect(result.densityKgM3).toBeCloseTo(1.201385, 6); // domain.md §3, 0.075 lb/ft³
    expect(result.points[0].flowCfmAt28).toBeCloseTo(220, 10);
  });
  it("summary", () => {
    expect(result.summary.valveAreaMm2).toBeCloseTo(1641.73, 2); // domain.md §5
    expect(result.summary.peakCdValve).toBeCloseTo(0.58693, 5);
    expect(result.summary.flowCfmAt28AtLd025).toBeCloseTo(220, 10);
    expect(result.summary.pointCount).toBe(2);
  });
  it("carries the conventions and the caution", () => {
    expect(result.conventions.inchOfWater).toBe(INCH_OF_WATER.label);
    expect(result.conventions.densityLaw).toBe(DENSITY_LAW.name);
    expect(result.notes).toEqual([COMPRESSIBILITY_NOTE, ESTIMATE_CAUTION]);
  });
});

describe("computeFlowTest: corrections", () => {
  const base = { valveDiameter: 51.3, lengthUnit: "mm", liftUnit: "mm", flowUnit: "cfm" } as const;

  it("moves a 10 inH₂O test to 28 inH₂O", () => {
    const r = computeFlowTest({ ...base, depression: 10, points: [{ lift: 12, flow: 250 }] });
    expect(r.points[0].flowCfmAt28).toBeCloseTo(418.33, 3); // domain.md §2
    expect(r.points[0].flowCfm).toBe(250);
  });
  it("a point with its own depression is corrected from that depression", () => {
    const r = computeFlowTest({ ...base, depression: 28, points: [{ lift: 5, flow: 100 }, { lift: 12, flow: 300, depression: 25 }] });
    expect(r.points[1].flowCfmAt28).toBeCloseTo(317.49, 3); // domain.md §2
    expect(r.points[1].depressionInH2O).toBeCloseTo(25, 10);
    expect(r.warnings.some((w) => w.includes("own depression"))).toBe(true);
  });
  it("Cd does not change when the same port is tested at another depression", () => {
    const at28 = computeFlowTest({ ...base, depression: 28, points: [{ lift: 12, flow: 250 }] });
    const at10 = computeFlowTest({ ...base, depression: 10, points: [{ lift: 12, flow: 250 * Math.sqrt(10 / 28) }] });
    expect(at10.points[0].cdValve).toBeCloseTo(at28.points[0].cdValve, 12);
    expect(at10.points[0].flowCfmAt28).toBeCloseTo(250, 10);
  });
  it("ambient air: CIPM-2007 density and correction to ISO 2533 standard air", () => {
    const r = computeFlowTest({
      ...base,
      depression: 28,
      ambient: { temperature: 20, temperatureUnit: "C", pressure: 101.325, pressureUnit: "kPa", relativeHumidityPercent: 50 },
      points: [{ lift: 12, flow: 200 }],
    });
    expect(r.densitySource).toBe("ambient");
    expect(r.densityKgM3).toBeCloseTo(1.19931, 5); // domain.md §4, CIPM-2007
    expect(r.ambient?.compressibilityZ).toBeCloseTo(0.999615, 6); // domain.md §4
    // Q_std = Q·√(ρ_test/ρ_std) with ρ_test from domain.md §4 and ρ_std = 1.2250 (ISO 2533, domain.md §3).
    expect(r.points[0].flowCfmAt28).toBeCloseTo(200 * Math.sqrt(1.19931 / 1.225), 3);
    // Cd uses the test air: ideal velocity √(2ΔP/ρ) with ρ = 1.19931.
    expect(r.points[0].idealVelocityMs).toBeCloseTo(Math.sqrt((2 * 6974.489) / 1.19931), 3);
    expect(r.warnings).toEqual([]);
  });
  it("ambient in °F and inHg", () => {
    const r = computeFlowTest({
      ...base,
      depression: 28,
      ambient: { temperature: 80, temperatureUnit: "F", pressure: 29.92, pressureUnit: "inHg", relativeHumidityPercent: 60 },
      points: [{ lift: 12, flow: 200 }],
    });
    expect(r.densityKgM3).toBeCloseTo(1.16845, 5); // domain.md §4
  });
  it("says when humidity was assumed and when CIPM-2007 is extrapolated", () => {
    const r = computeFlowTest({ ...base, depression: 28, ambient: { temperature: 35, pressure: 100 }, points: [{ lift: 12, flow: 200 }] });
    expect(r.ambient?.humidityAssumed).toBe(true);
    expect(r.warnings.some((w) => w.includes("dry"))).toBe(true);
    expect(r.warnings.some((w) => w.includes("outside"))).toBe(true);
  });
  it("section velocity and flow per square inch of section", () => {
    const r = computeFlowTest({ ...base, depression: 28, minSectionArea: 2.2, areaUnit: "in2", points: [{ lift: 12, flow: 220 }] });
    // v = Q/A: 220 cfm = 0.103828 m³/s (NIST factor), 2.2 in² = 1.419352e-3 m².
    expect(r.points[0].sectionVelocityMs).toBeCloseTo((220 * 4.719474432e-4) / (2.2 * 645.16e-6), 6);
    expect(r.points[0].cfmPerSqInSection).toBeCloseTo(100, 10);
    expect(r.summary.sectionToValveAreaRatio).toBeCloseTo(2.2 / (Math.PI * (51.3 / 25.4) ** 2 / 4), 6);
  });
  it("warns when a flow coefficient exceeds 1", () => {
    const r = computeFlowTest({ ...base, depression: 28, points: [{ lift: 12, flow: 900 }] });
    expect(r.warnings.some((w) => w.includes("above 1"))).toBe(true);
  });
  it("summary picks the peak and interpolates at L/D 0.25", () => {
    const r = computeFlowTest({
      ...base,
      valveDiameter: 40,
      depression: 28,
      points: [
        { lift: 8, flow: 100 },
        { lift: 12, flow: 140 },
        { lift: 4, flow: 50 },
      ],
    });
    expect(r.summary.peakFlowCfmAt28).toBe(140);
    expect(r.summary.peakFlowLiftMm).toBe(12);
    expect(r.summary.flowCfmAt28AtLd025).toBeCloseTo(120, 10); // lift 10 mm, halfway between 100 and 140
    expect(r.summary.meanCdValve).toBeCloseTo((r.points[0].cdValve + r.points[1].cdValve + r.points[2].cdValve) / 3, 12);
  });
});

describe("computeFlowTest: refused input", () => {
  const valid: FlowTestInput = { valveDiameter: 45, depression: 28, points: [{ lift: 10, flow: 150 }] };
  const issuesOf = (input: unknown) => {
    const r = tryComputeFlowTest(input);
    if (r.ok) throw new Error("expected refusal");
    return r.issues;
  };

  it("accepts the valid base case", () => expect(tryComputeFlowTest(valid).ok).toBe(true));
  it("a lift larger than the valve (units mixed up)", () => {
    expect(issuesOf({ ...valid, liftUnit: "in", points: [{ lift: 10, flow: 150 }] })).toEqual([
      expect.objectContaining({ path: "points.0.lift", message: expect.stringContaining("larger than the valve") }),
    ]);
  });
  it("the same lift twice", () => {
    const issues = issuesOf({ ...valid, points: [{ lift: 10, flow: 150 }, { lift: 10, flow: 151 }] });
    expect(issues[0].path).toBe("points.1.lift");
  });
  it("a depression that only makes sense in another unit", () => {
    expect(issuesOf({ ...valid, depressionUnit: "Pa" })[0].path).toBe("depression");
    expect(issuesOf({ ...valid, depression: 6974, depressionUnit: "inH2O" })[0].path).toBe("depression");
  });
  it("a barometer reading in the wrong unit", () => {
    expect(issuesOf({ ...valid, ambient: { temperature: 20, pressure: 101325, pressureUnit: "kPa" } })[0].path).toBe("ambient.pressure");
  });
  it("a seat no smaller than the valve", () => expect(issuesOf({ ...valid, seatDiameter: 45 })[0].path).toBe("seatDiameter"));
  it("negative flow, no points, unknown unit", () => {
    expect(issuesOf({ ...valid, points: [{ lift: 10, flow: -1 }] })[0].path).toBe("points.0.flow");
    expect(issuesOf({ ...valid, points: [] })[0].path).toBe("points");
    expect(issuesOf({ ...valid, flowUnit: "gpm" })[0].path).toBe("flowUnit");
  });
  it("computeFlowTest throws a ZodError", () => {
    expect(() => computeFlowTest({ ...valid, valveDiameter: -1 })).toThrow(ZodError);
  });
});
