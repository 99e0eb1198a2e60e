import { describe, expect, it } from "vitest";
import { signedArea, perimeter, equivalentDiameter, hydraulicDiameter, convexHull, roundedRectOutline, circleOutline } from "@/lib/geometry/index";
import { simplifyPolygon, centroid } from "@/lib/geometry/polygon";

describe("shoelace area (domain reference §12)", () => {
  it("2×1 rectangle: 2.0 counter-clockwise, −2.0 clockwise", () => {
    expect(signedArea([0, 0, 2, 0, 2, 1, 0, 1])).toBe(2.0);
    expect(signedArea([0, 0, 0, 1, 2, 1, 2, 0])).toBe(-2.0);
  });
  it("L-shape (0,0)(3,0)(3,1)(1,1)(1,2)(0,2) is 4.0", () => {
    expect(signedArea([0, 0, 3, 0, 3, 1, 1, 1, 1, 2, 0, 2])).toBe(4.0);
  });
  it("regular 64-gon of r = 0.9 is 2.540604", () => {
    expect(signedArea(circleOutline(0.9, 64))).toBeCloseTo(2.540604, 6);
  });
  it("2.0×1.0 rectangle with 0.25 corner radii sampled at 16 segments per corner is 1.9460343 (exact 1.9463495)", () => {
    const outline = roundedRectOutline(1.0, 0.5, 0.25, 16);
    expect(signedArea(outline)).toBeCloseTo(1.9460343, 7);
    // The exact figure 4ac − (4 − π)r² from §12, approached as the corners get finer.
    expect(signedArea(roundedRectOutline(1.0, 0.5, 0.25, 2048))).toBeCloseTo(1.9463495, 6);
  });
});

describe("section measures", () => {
  it("equivalent diameter √(4A/π) and hydraulic diameter 4A/P of a circle are its diameter", () => {
    const a = Math.PI * 15 * 15;
    expect(equivalentDiameter(a)).toBeCloseTo(30, 12);
    expect(hydraulicDiameter(a, 2 * Math.PI * 15)).toBeCloseTo(30, 12);
  });
  it("1.800 in circle: 1641.73 mm² (domain reference §12 table)", () => {
    const d = 1.8 * 25.4;
    expect((Math.PI * d * d) / 4).toBeCloseTo(1641.73, 2);
    expect(equivalentDiameter(1641.73) / 25.4).toBeCloseTo(1.8, 4);
  });
  it("perimeter of the 2×1 rectangle is 6", () => {
    expect(perimeter([0, 0, 2, 0, 2, 1, 0, 1])).toBe(6);
  });
  it("centroid of the L-shape", () => {
    // Two rectangles: 3×1 centred (1.5, 0.5), area 3; 1×1 centred (0.5, 1.5), area 1.
    const [cx, cy] = centroid([0, 0, 3, 0, 3, 1, 1, 1, 1, 2, 0, 2]);
    expect(cx).toBeCloseTo((3 * 1.5 + 0.5) / 4, 12);
    expect(cy).toBeCloseTo((3 * 0.5 + 1.5) / 4, 12);
  });
  it("a convex hull bridges a fin: its area exceeds the true outline's", () => {
    const withFin = roundedRectOutline(15, 15, 5, 16, { widthMm: 4, depthMm: 6 });
    const without = roundedRectOutline(15, 15, 5, 16);
    expect(signedArea(convexHull(withFin))).toBeCloseTo(signedArea(without), 6);
    expect(signedArea(withFin)).toBeCloseTo(signedArea(without) - 24, 6); // fin 4 × 6 mm
  });
  it("simplification keeps fin corners and stays within the vertex budget", () => {
    const fine = roundedRectOutline(15, 15, 5, 64, { widthMm: 4, depthMm: 6 });
    const s = simplifyPolygon(fine, 40);
    expect(s.length / 2).toBe(40);
    expect(Math.abs(signedArea(s) - signedArea(fine)) / signedArea(fine)).toBeLessThan(0.01);
    // The fin tip (±2, 9) survives.
    const has = (x: number, y: number) => s.some((_, i) => i % 2 === 0 && Math.abs(s[i] - x) < 1e-9 && Math.abs(s[i + 1] - y) < 1e-9);
    expect(has(2, 9) && has(-2, 9)).toBe(true);
  });
});
