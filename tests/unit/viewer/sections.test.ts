import { describe, expect, it } from "vitest";
import { minSectionIndex, nearestIndex, nearestSectionIndex, outlineExtent, outlineIn3d, outlinePath, percentOfValve, scaleBarMm, svgViewBox } from "@/components/viewer/sections";
import { analyzePort, intakePortShape, sampleTubeCloud, signedArea } from "@/lib/geometry/index";

// An invented intake port from the geometry engine's generator, analysed like a stored scan.
const shape = intakePortShape({ valveDiameterMm: 46, throatPercent: 88 });
const cloud = sampleTubeCloud(shape, { points: 30_000, seed: 11 });
const { report } = analyzePort(cloud, { entry: [0, 0, 0], valveDiameterMm: 46, portKind: "intake" });

describe("section slider lookups", () => {
  it("jumps to the analysis' minimum: that slider position shows the minimum's area", () => {
    const i = minSectionIndex(report.sections, report.minSection);
    expect(i).toBeGreaterThanOrEqual(0);
    expect(report.sections[i].areaMm2).toBe(report.minSection!.areaMm2);
    expect(report.sections[i].stationMm).toBe(report.minSection!.stationMm);
    expect(minSectionIndex(report.sections, null)).toBe(-1);
  });

  it("finds the nearest station", () => {
    const s = [{ stationMm: 0 }, { stationMm: 2 }, { stationMm: 4 }, { stationMm: 8 }];
    expect(nearestSectionIndex(s, 2.9)).toBe(1);
    expect(nearestSectionIndex(s, 6.5)).toBe(3);
    expect(nearestSectionIndex(s, -5)).toBe(0);
    expect(nearestSectionIndex([], 1)).toBe(-1);
  });

  it("gives percent of valve from the equivalent diameter, as the analysis does", () => {
    const m = report.minSection!;
    expect(percentOfValve(m.equivalentDiameterMm, 46)).toBeCloseTo(m.percentOfValve!, 9);
    expect(percentOfValve(40, null)).toBeNull();
    expect(percentOfValve(40, 0)).toBeNull();
  });
});

describe("outline drawing", () => {
  it("writes a closed SVG path with y flipped", () => {
    expect(outlinePath([[0, 0], [2, 0], [2, 1.5]])).toBe("M0.00 0.00 L2.00 0.00 L2.00 -1.50 Z");
    expect(outlinePath([])).toBe("");
    expect(svgViewBox(10, 1)).toBe("-10 -10 20 20");
  });

  it("uses one extent for every section, the widest", () => {
    expect(outlineExtent([{ outline: [[1, -3]] }, { outline: [[-7, 2]] }])).toBe(7);
  });

  it("picks round scale-bar lengths", () => {
    expect(scaleBarMm(25)).toBe(10);
    expect(scaleBarMm(9)).toBe(2);
    expect(scaleBarMm(3)).toBe(1);
  });

  it("the stored outline encloses about the section's area (shoelace, ≤ 128-vertex simplification)", () => {
    for (const s of report.sections.filter((x) => x.complete).slice(0, 10)) {
      const area = signedArea(s.outline.flat());
      expect(Math.abs(area - s.areaMm2) / s.areaMm2).toBeLessThan(0.03);
    }
  });

  it("places the outline on its plane in 3D, at the same distances from the centerline", () => {
    const s = report.sections[Math.floor(report.sections.length / 2)];
    const pts = outlineIn3d(s);
    const { origin: o, normal: n } = s.plane;
    s.outline.forEach(([x, y], i) => {
      const d = [0, 1, 2].map((k) => pts[3 * i + k] - o[k]);
      expect(Math.abs(d[0] * n[0] + d[1] * n[1] + d[2] * n[2])).toBeLessThan(1e-3);
      expect(Math.hypot(d[0], d[1], d[2])).toBeCloseTo(Math.hypot(x, y), 3);
    });
  });

  it("finds the nearest centerline point", () => {
    expect(nearestIndex([[0, 0, 0], [10, 0, 0], [20, 0, 0]], [12, 3, 0])).toBe(1);
  });
});
