import { describe, expect, it } from "vitest";
import { analyzeToolpathText } from "@/lib/toolpath";
import { alignProfiles, areaAt, combineToolpaths, compareRevisions, delta } from "@/lib/programs/compare";

// Two small programs with known geometry (RS274/NGC worked examples, domain reference §10):
// G1 X30 Y40 F1200 from (0,0) is 50 mm in 2.5 s.
const progA = "G21 G17 G90 G94\nT1 M6\nS10000 M3\nG0 X0 Y0 Z5\nG1 Z0 F600\nG1 X30 Y40 F1200\nM30\n";
const progB = "G21 G17 G90 G94\nT1 M6\nS10000 M3\nG0 X0 Y0 Z5\nG1 Z0 F600\nG1 X30 Y40 F1200\nT2 M6\nS12000 M3\nG1 X60 Y80 F1200\nM30\n";

describe("compareRevisions", () => {
  const a = analyzeToolpathText(progA).report;
  const b = analyzeToolpathText(progB).report;
  const cmp = compareRevisions({ toolpaths: [a], scan: null }, { toolpaths: [b], scan: null });

  it("reports the cycle-time difference the engine computed for each", () => {
    expect(cmp.cycleTimeS.a).toBe(a.cycleTimeS);
    expect(cmp.cycleTimeS.b).toBe(b.cycleTimeS);
    expect(cmp.cycleTimeS.diff).toBeCloseTo(b.cycleTimeS - a.cycleTimeS, 9);
    // B adds one 50 mm line at 1200 mm/min = 2.5 s of feed (§10 worked example).
    expect(cmp.feedTimeS.diff).toBeCloseTo(2.5, 6);
    expect(cmp.feedLengthMm.diff).toBeCloseTo(50, 6);
  });

  it("lists a tool only B uses as added, and widens the X/Y bounds", () => {
    expect(cmp.tools.find((t) => t.number === 2)?.change).toBe("added");
    expect(cmp.tools.find((t) => t.number === 1)?.change).toBe("same");
    const x = cmp.axes.find((r) => r.axis === "X")!;
    expect(x.a?.max).toBe(30);
    expect(x.b?.max).toBe(60);
    expect(x.maxDiff).toBe(30);
  });

  it("has no profile unless both sides came from scans", () => {
    expect(cmp.profile).toBeNull();
  });
});

describe("combining the toolpath files of one revision", () => {
  it("adds times and lengths and merges bounds", () => {
    const a = analyzeToolpathText(progA).report;
    const both = combineToolpaths([a, a])!;
    expect(both.cycleTimeS).toBeCloseTo(2 * a.cycleTimeS, 9);
    expect(both.feedLengthMm).toBeCloseTo(2 * a.feedLengthMm, 9);
    expect(both.bounds.X).toEqual({ min: a.bounds.X!.min, max: a.bounds.X!.max });
  });
});

describe("section profiles", () => {
  const s = [
    { stationMm: 0, areaMm2: 1000 },
    { stationMm: 10, areaMm2: 800 },
    { stationMm: 20, areaMm2: 900 },
  ];

  it("interpolates linearly between stations and is null outside", () => {
    expect(areaAt(s, 5)).toBeCloseTo(900, 9);
    expect(areaAt(s, 15)).toBeCloseTo(850, 9);
    expect(areaAt(s, 25)).toBeNull();
  });

  it("aligns two profiles on one grid with B − A differences", () => {
    const t = s.map((p) => ({ ...p, areaMm2: p.areaMm2 + 50 }));
    const pts = alignProfiles(s, t, 5);
    expect(pts.map((p) => p.stationMm)).toEqual([0, 5, 10, 15, 20]);
    for (const p of pts) expect(p.diff).toBeCloseTo(50, 9);
  });

  it("gives percent change against A", () => {
    expect(delta(200, 150).percent).toBeCloseTo(-25, 9);
    expect(delta(null, 3).diff).toBeNull();
  });
});
