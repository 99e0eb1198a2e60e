import { describe, expect, it } from "vitest";
import {
  analyzePort,
  bentTube,
  circleOutline,
  convexHull,
  GeometryInputError,
  intakePortShape,
  makeRandom,
  roundedRectOutline,
  sampleTubeCloud,
  signedArea,
  straightTube,
  tubeMesh,
  type Vec3,
} from "@/lib/geometry/index";

function refused(fn: () => unknown, code: string, pattern: RegExp) {
  let err: unknown = null;
  try {
    fn();
  } catch (e) {
    err = e;
  }
  expect(err).toBeInstanceOf(GeometryInputError);
  expect((err as GeometryInputError).code).toBe(code);
  expect((err as Error).message).toMatch(pattern);
}

describe("straight cylinder r = 15 mm, 100 mm long", () => {
  const r = 15;
  const shape = straightTube(100, () => circleOutline(r));
  const cloud = sampleTubeCloud(shape, { points: 150_000, seed: 3 });
  const valve = 30 / 0.88;
  const { report, pointStation: stations } = analyzePort(cloud, { valveDiameterMm: valve });
  const pointStation = stations!;

  it("every complete section has area πr² and the centerline is the axis", () => {
    const exact = Math.PI * r * r;
    expect(report.sections.length).toBe(51);
    for (const s of report.sections) {
      expect(s.complete).toBe(true);
      // Tolerance 0.25 %: an inscribed polygon of K ≥ 64 bins loses (2π/K)²/6 ≤ 0.16 %; probe
      // noise (±0.005 mm) averages out in each bin's mean radius.
      expect(Math.abs(s.areaMm2 - exact) / exact).toBeLessThan(0.0025);
      expect(s.equivalentDiameterMm).toBeCloseTo(30, 1);
      expect(Math.abs(s.hydraulicDiameterMm - 30)).toBeLessThan(0.1);
      expect(Math.hypot(s.centroid[1], s.centroid[2])).toBeLessThan(0.1);
    }
    expect(report.centerline.lengthMm).toBeCloseTo(100, 0);
  });

  it("minimum section against the valve, and the guideline shown (common practice, §9)", () => {
    const m = report.minSection!;
    expect(m.percentOfValve!).toBeCloseTo(88, 0);
    expect(m.percentOfValveArea!).toBeCloseTo(88 * 0.88, 0);
    expect(report.guideline).toMatchObject({ portKind: "intake", lowPercent: 85, highPercent: 90, verdict: "within" });
    expect(report.guideline.basis).toMatch(/common practice/);
  });

  it("volume from the section integral is πr²L", () => {
    // Same 0.25 % as the areas, plus the length within 0.5 mm.
    expect(Math.abs(report.volumeCc - (Math.PI * r * r * 100) / 1000) / 70.686).toBeLessThan(0.008);
  });

  it("is JSON-serialisable and each outline maps back onto the wall", () => {
    const copy = JSON.parse(JSON.stringify(report));
    expect(copy.sections[10].areaMm2).toBe(report.sections[10].areaMm2);
    for (const s of report.sections) {
      expect(s.outline.length).toBeLessThanOrEqual(128);
      expect(Math.hypot(...s.plane.normal)).toBeCloseTo(1, 9);
      for (const [x, y] of s.outline) {
        const p = [0, 1, 2].map((k) => s.plane.origin[k] + x * s.plane.u[k] + y * s.plane.v[k]);
        expect(Math.abs(Math.hypot(p[1], p[2]) - r)).toBeLessThan(0.1);
      }
    }
  });

  it("gives each point its nearest station, only when asked", () => {
    expect(analyzePort(cloud, { pointStations: false }).pointStation).toBeNull();
    expect(pointStation.length).toBe(cloud.count);
    const entryAtZero = report.centerline.entry[0] < 50;
    for (let i = 0; i < cloud.count; i += 997) {
      const x = cloud.positions[3 * i];
      const along = entryAtZero ? x : 100 - x;
      expect(Math.abs(pointStation[i] * 2 - along)).toBeLessThanOrEqual(1.01);
    }
  });

  it("the step option sets the stations; entry/exit points override the ends", () => {
    const five = analyzePort(cloud, { stepMm: 5 }).report;
    expect(five.sections.map((s) => s.stationMm)).toEqual(Array.from({ length: 21 }, (_, k) => 5 * k));
    const cut = analyzePort(cloud, { entry: [90, 0, 0], exit: [10, 0, 0] }).report;
    expect(cut.centerline.ends).toBe("user");
    expect(cut.centerline.lengthMm).toBeCloseTo(80, 6);
    expect(cut.sections[0].plane.origin[0]).toBeCloseTo(90, 6);
    expect(cut.sections[0].plane.normal[0]).toBeCloseTo(-1, 3);
    expect(cut.warnings.find((w) => w.code === "ends-guessed")).toBeUndefined();
  });
});

describe("bent tube: 90° bend of radius 30 mm, radius varying 12 → 15 → 12 mm", () => {
  const radiusAt = (s: number) => 12 + 3 * Math.sin((Math.PI * s) / 97.1);
  const shape = bentTube({ straightInMm: 30, bendRadiusMm: 30, bendDeg: 90, straightOutMm: 20 }, (s) => circleOutline(radiusAt(s)));
  const cloud = sampleTubeCloud(shape, { points: 200_000, seed: 5 });
  const { report } = analyzePort(cloud, { entry: [0, 0, 0] });

  it("follows the bend: centerline length and every station on the true centerline", () => {
    expect(Math.abs(report.centerline.lengthMm - shape.length) / shape.length).toBeLessThan(0.005);
    for (const s of report.sections) {
      const truth = shape.frameAt(Math.min(s.stationMm, shape.length)).origin;
      expect(Math.hypot(...(s.centroid.map((c, k) => c - truth[k]) as Vec3))).toBeLessThan(0.4);
    }
  });

  it("areas match the known radius along the port", () => {
    for (const s of report.sections.filter((x) => x.complete)) {
      const exact = signedArea(shape.outlineAt(s.stationMm));
      // 1 %: the slab (±h ≤ 0.5 mm) is one-sided at the open ends, so there the mean radius sits
      // h/2 along a wall of slope ≤ 0.1 (≈ 0.4 % of area); the rest is bin discretisation.
      expect(Math.abs(s.areaMm2 - exact) / exact).toBeLessThan(0.01);
    }
  });
});

describe("rounded-square section with a fin (non-convex outline)", () => {
  // Half-size 15, corner radius 5; a fin 4 mm wide hangs 6 mm from the roof (tip 9 mm from the centre).
  const outline = roundedRectOutline(15, 15, 5, 16, { widthMm: 4, depthMm: 6 });
  const shape = straightTube(60, () => outline);
  const cloud = sampleTubeCloud(shape, { points: 200_000, seed: 9 });
  const { report } = analyzePort(cloud);
  const exact = signedArea(outline); // shoelace of the exact outline (§12)
  const hull = signedArea(convexHull(outline));
  // Tolerance: seen from the centre, the corners of the fin tip hide a sliver beside each side
  // wall of area w/2·(R − t)²/(2t) (R = 15 wall, t = 9 tip, w = 4): 2 mm²·36/18 = 4 mm² per side,
  // which the star-shaped outline cannot see; plus 0.5 % for bins and noise.
  const hidden = 2 * ((4 / 2) * (15 - 9) ** 2) / (2 * 9);
  const tolerance = hidden + 0.005 * exact;

  it("follows the fin instead of bridging it like a convex hull", () => {
    expect(hull - exact).toBeGreaterThan(tolerance); // the test can tell a hull from the outline
    const complete = report.sections.filter((s) => s.complete);
    expect(complete.length).toBeGreaterThan(25);
    for (const s of complete) {
      expect(s.areaMm2).toBeLessThan(exact + 0.005 * exact);
      expect(s.areaMm2).toBeGreaterThan(exact - tolerance);
    }
  });
});

describe("invented intake port", () => {
  const shape = intakePortShape({ valveDiameterMm: 46, throatPercent: 87 });
  const cloud = sampleTubeCloud(shape, { points: 250_000, seed: 21 });

  it("finds the throat where the shape has its smallest section, near 87 % of the valve", () => {
    let best = { s: 0, area: Infinity };
    for (let s = 0; s <= shape.length; s += 0.5) {
      const a = signedArea(shape.outlineAt(s));
      if (a < best.area) best = { s, area: a };
    }
    const { report } = analyzePort(cloud, { valveDiameterMm: 46, entry: [0, 0, 0] });
    const m = report.minSection!;
    expect(Math.abs(m.stationMm - best.s)).toBeLessThanOrEqual(4); // a flat minimum, sampled every 2 mm
    expect(Math.abs(m.areaMm2 - best.area) / best.area).toBeLessThan(0.01);
    expect(m.percentOfValve!).toBeGreaterThan(86);
    expect(m.percentOfValve!).toBeLessThan(88);
    expect(report.centerline.lengthMm).toBeCloseTo(shape.length, 0);
  });

  it("puts station 0 at the oval end when no entry is given", () => {
    const { report } = analyzePort(cloud);
    expect(Math.hypot(...report.centerline.entry)).toBeLessThan(1);
    expect(report.warnings.some((w) => w.code === "ends-guessed")).toBe(true);
  });

  it("reports an open mesh for a wall mesh with faces", () => {
    const mesh = tubeMesh(shape, 1, 96);
    const { report } = analyzePort(mesh);
    expect(report.mesh).toMatchObject({ closed: false, signedVolumeMm3: null, volumeCc: null });
    expect(report.warnings.some((w) => w.code === "mesh-open")).toBe(true);
    expect(report.volumeCc).toBeGreaterThan(0);
  });
});

describe("bad input for the analysis", () => {
  const rand = makeRandom(4);
  const make = (n: number, f: () => number[]) => {
    const positions = new Float32Array(n * 3);
    for (let i = 0; i < n; i++) positions.set(f(), 3 * i);
    return { positions, count: n };
  };

  it("fewer than 100 points", () => {
    refused(() => analyzePort(make(99, () => [rand(), rand(), rand()])), "too-few-points", /99 points/);
  });
  it("a flat sheet of points", () => {
    refused(() => analyzePort(make(5000, () => [rand() * 100, rand() * 40, 0])), "not-a-tube", /line or a plane/);
  });
  it("a filled solid instead of a wall", () => {
    const solid = make(60_000, () => {
      const a = rand() * 2 * Math.PI;
      const rr = 15 * Math.sqrt(rand());
      return [rand() * 100, rr * Math.cos(a), rr * Math.sin(a)];
    });
    refused(() => analyzePort(solid), "not-a-tube", /not .*port/);
  });
  it("a box of random noise", () => {
    refused(() => analyzePort(make(30_000, () => [rand() * 100, rand() * 30, rand() * 30])), "not-a-tube", /port/);
  });
  it("options out of range", () => {
    const cloud = sampleTubeCloud(straightTube(50, () => circleOutline(10)), { points: 5000 });
    refused(() => analyzePort(cloud, { stepMm: 0 }), "bad-option", /step/);
    refused(() => analyzePort(cloud, { valveDiameterMm: -3 }), "bad-option", /valve/);
    refused(() => analyzePort(cloud, { entry: [Number.NaN, 0, 0] }), "bad-option", /entry/);
  });
});
