import { describe, expect, it } from "vitest";
import { extremes, mergeOnStations, niceMax, profileDifference, valveReferenceAreas } from "@/components/charts/chart-data";

describe("chart data", () => {
  it("merges series on one station axis, leaving gaps as null", () => {
    const rows = mergeOnStations([
      { label: "A", sections: [{ stationMm: 0, areaMm2: 10 }, { stationMm: 2, areaMm2: 12 }] },
      // 2.0000001 is the same station as 2 (float noise from the centerline).
      { label: "B", sections: [{ stationMm: 2.0000001, areaMm2: 11 }, { stationMm: 4, areaMm2: 9 }] },
    ]);
    expect(rows).toEqual([
      { stationMm: 0, s0: 10, s1: null },
      { stationMm: 2, s0: 12, s1: 11 },
      { stationMm: 4, s0: null, s1: 9 },
    ]);
  });

  it("gives the valve head area π·d²/4 and the guideline throat areas (domain reference §12 table)", () => {
    // 1.800 in = 45.72 mm valve: 1641.73 mm²; 90 % throat 2.06120 in² = 1329.80 mm²; 85 %: 1.83854 in² = 1186.15 mm².
    const refs = valveReferenceAreas(45.72, { lowPercent: 85, highPercent: 90 });
    expect(refs[0].areaMm2).toBeCloseTo(1641.73, 2);
    expect(refs[1].label).toBe("90 % throat");
    expect(refs[1].areaMm2 / 645.16).toBeCloseTo(2.0612, 4);
    expect(refs[2].areaMm2 / 645.16).toBeCloseTo(1.83854, 4);
    expect(valveReferenceAreas(null)).toEqual([]);
    expect(valveReferenceAreas(40)).toHaveLength(1);
  });

  it("differences two profiles per station and finds the largest gain and loss", () => {
    const a = [0, 2, 4, 6].map((s) => ({ stationMm: s, areaMm2: 100 }));
    const b = [
      { stationMm: 0, areaMm2: 100 },
      { stationMm: 2, areaMm2: 110 },
      { stationMm: 4, areaMm2: 95 },
      { stationMm: 6, areaMm2: 103 },
      { stationMm: 8, areaMm2: 103 },
    ];
    const d = profileDifference(a, b);
    expect(d.map((p) => p.diff)).toEqual([0, 10, -5, 3, null]);
    expect(d[1].percent).toBeCloseTo(10, 12);
    const { gain, loss } = extremes(d);
    expect(gain!.stationMm).toBe(2);
    expect(loss!.stationMm).toBe(4);
    expect(extremes([]).gain).toBeNull();
  });

  it("rounds axis maxima up to readable values", () => {
    expect(niceMax(1234)).toBe(1500);
    expect(niceMax(2000)).toBe(2000);
    expect(niceMax(7.1)).toBe(8);
    expect(niceMax(0)).toBe(1);
  });
});
