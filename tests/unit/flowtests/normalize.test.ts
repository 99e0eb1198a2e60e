import { describe, expect, it } from "vitest";
import { computeFlowTest } from "@/lib/flow";
import { computeStored, recordToStored, storedToRecordInput } from "@/lib/flowtests/normalize";
import { flowTestRecordSchema, toFlowInput, type FlowTestRecordInput } from "@/lib/flowtests/schema";

const inchRecord: FlowTestRecordInput = {
  headTypeId: 1,
  subject: "master",
  masterId: 3,
  revisionId: 9, // not this subject's link: dropped when stored
  port: "intake",
  cylinder: 2,
  testedOn: "2025-03-04",
  depression: 10,
  depressionUnit: "inH2O",
  ambient: { temperature: 80, temperatureUnit: "F", pressure: 29.92, pressureUnit: "inHg", relativeHumidityPercent: 60 },
  valveDiameter: 1.8,
  seatDiameter: 1.6,
  lengthUnit: "in",
  minSectionArea: 2.0,
  areaUnit: "in2",
  liftUnit: "in",
  flowUnit: "L/s",
  points: [
    { lift: 0.3, flow: 60 },
    { lift: 0.1, flow: 25 },
    // Measured at its own depression (25 inH₂O, same unit as the test's).
    { lift: 0.45, flow: 120, depression: 25 },
  ],
};

describe("stored units", () => {
  const record = flowTestRecordSchema.parse(inchRecord);
  const { test, points } = recordToStored(record, 7);

  it("converts to mm, cfm, inH₂O, °C and kPa", () => {
    expect(test.valveDiameterMm).toBe(45.72); // 1.8 in × 25.4 (exact inch)
    expect(test.seatIdMm).toBe(40.64);
    expect(test.minSectionMm2).toBe(1290.32); // 2 in² × 645.16 (exact)
    expect(test.depressionInH2O).toBe(10);
    expect(test.tempC).toBeCloseTo(26.6667, 4); // domain.md §4: 80 °F = 26.6667 °C
    expect(test.baroKpa).toBeCloseTo(101.32076, 4); // domain.md §1: 29.92 inHg = 101 320.75 Pa
    expect(test.rhPct).toBe(60);
    expect(points.map((p) => p.liftMm)).toEqual([2.54, 7.62, 11.43]); // sorted by lift
    // 25 L/s in cfm: 0.025 / 4.719474432e-4 (NIST SP 811 exact cfm)
    expect(points[0].flowCfm).toBeCloseTo(0.025 / 4.719474432e-4, 9);
  });

  it("moves a point measured at its own depression to the test depression by the square-root law", () => {
    const cfmAt25 = 0.12 / 4.719474432e-4;
    expect(points[2].flowCfm).toBeCloseTo(cfmAt25 * Math.sqrt(10 / 25), 8);
  });

  it("keeps only the link of the subject, and names the recorder as operator when none is given", () => {
    expect(test.masterId).toBe(3);
    expect(test.revisionId).toBeNull();
    expect(test.headId).toBeNull();
    expect(test.operatorId).toBe(7);
  });

  it("computes the same figures from the stored record as from the typed one", () => {
    const typed = computeFlowTest(toFlowInput(record));
    const stored = computeStored(test, points);
    expect(stored.ok).toBe(true);
    if (!stored.ok) return;
    expect(stored.result.points).toHaveLength(3);
    stored.result.points.forEach((p, i) => {
      expect(p.flowCfmAt28).toBeCloseTo(typed.points[i].flowCfmAt28, 6);
      expect(p.cdValve).toBeCloseTo(typed.points[i].cdValve, 9);
      expect(p.cdCurtain).toBeCloseTo(typed.points[i].cdCurtain, 9);
    });
    expect(stored.result.densityKgM3).toBeCloseTo(typed.densityKgM3, 9);
  });

  it("reads back into the form in stored units, and that round-trips", () => {
    const again = recordToStored(flowTestRecordSchema.parse(storedToRecordInput(test, points)), null);
    expect(again.test).toEqual(test);
    expect(again.points).toEqual(points);
  });

  it("says why a test without points cannot be computed instead of throwing", () => {
    const r = computeStored(test, []);
    expect(r.ok).toBe(false);
  });
});
