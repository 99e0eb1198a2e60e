/**
 * The worked examples of RS274/NGC v3 (NISTIR 6556, Kramer, Proctor & Messina 2000) as listed
 * in the engineering notes §10, checked to 1e-6. The expected figures are the notes' own
 * (computed there with python3 from the standard's geometry), not values produced by this code.
 */
import { describe, expect, it } from "vitest";
import { analyzeLines, expectNear } from "./helpers";

/** Runs `block` from `start` (x, y, z) after the start state G21 (or G20) G17 G90 G94. */
function fromPoint(start: [number, number, number], block: string, units = "G21") {
  const [x, y, z] = start;
  return analyzeLines([`${units} G17 G90 G94`, "T1 M6", "S10000 M3", `G0 X${x} Y${y} Z${z}`, block, "M2"]);
}

describe("RS274/NGC v3 worked examples (NISTIR 6556 §3.5.3, §3.5.19, §2.1.2.6; notes §10)", () => {
  it("centre-form clockwise quarter arc: 15.707963 mm, 1.570796 s", () => {
    const r = fromPoint([10, 0, 0], "G2 X0 Y-10 I-10 J0 F600");
    expectNear(r.feedLengthMm, 15.707963);
    expectNear(r.feedTimeS, 1.570796);
    expect(r.arcs).toBe(1);
    expect(r.warnings).toEqual([]);
  });

  it("radius-form of the same arc gives the same length and time", () => {
    const r = fromPoint([10, 0, 0], "G2 X0 Y-10 R10 F600");
    expectNear(r.feedLengthMm, 15.707963);
    expectNear(r.feedTimeS, 1.570796);
  });

  it("R10 counter-clockwise from (0,0) to (10,0): centre (5, 8.660254), 60°, 10.471976 mm", () => {
    const r = fromPoint([0, 0, 0], "G3 X10 Y0 R10 F600");
    expectNear(r.feedLengthMm, 10.471976);
    expectNear(r.feedTimeS, 1.047198);
    // the 60° arc about (5, 8.660254) dips to y = 8.660254 − 10 at its middle (x = 5)
    expectNear(r.bounds.Y!.min, 8.660254 - 10);
  });

  it("negative R takes the long way: 300°, 52.359878 mm, 5.235988 s", () => {
    const r = fromPoint([0, 0, 0], "G3 X10 Y0 R-10 F600");
    expectNear(r.feedLengthMm, 52.359878);
    expectNear(r.feedTimeS, 5.235988);
    // centre (5, −8.660254): the arc reaches y = −8.660254 − 10 at its bottom
    expectNear(r.bounds.Y!.min, -8.660254 - 10);
  });

  it("full circle (start = end, centre form): 62.831853 mm, 6.283185 s", () => {
    const r = fromPoint([10, 0, 0], "G2 X10 Y0 I-10 J0 F600");
    expectNear(r.feedLengthMm, 62.831853);
    expectNear(r.feedTimeS, 6.283185);
    expectNear(r.bounds.X!.min, -10);
    expectNear(r.bounds.Y!.max, 10);
  });

  it("helix: F applies along the helix (§2.1.2.6): 16.484542 mm, 1.648454 s", () => {
    const r = fromPoint([10, 0, 0], "G2 X0 Y-10 Z-5 I-10 J0 F600");
    expectNear(r.feedLengthMm, 16.484542);
    expectNear(r.feedTimeS, 1.648454);
    expectNear(r.bounds.Z!.min, -5);
  });

  it("straight feed: 50 mm at F1200 in 2.5 s", () => {
    const r = fromPoint([0, 0, 0], "G1 X30 Y40 F1200");
    expectNear(r.feedLengthMm, 50);
    expectNear(r.feedTimeS, 2.5);
    expect(r.arcs).toBe(0);
  });

  it("inverse time (§3.5.19): G93 F30 lasts 1/30 min = 2 s whatever the length", () => {
    const r = fromPoint([0, 0, 0], "G93 G1 X30 Y40 F30");
    expectNear(r.feedLengthMm, 50);
    expectNear(r.feedTimeS, 2);
    expect(r.inverseTimeBlocks).toBe(1);
    // 50 mm in 2 s is 1500 mm/min
    expectNear(r.tools[0].feedMmPerMin!.max, 1500);
  });

  it("inch program: 1.570796 in (39.8982 mm) at 20 in/min in 4.712389 s", () => {
    const r = fromPoint([1, 0, 0], "G3 X0 Y1 I-1 J0 F20", "G20");
    expectNear(r.feedLengthMm / 25.4, 1.570796);
    expectNear(r.feedLengthMm, 39.8982, 1e-4); // the notes give 4 decimals here
    expectNear(r.feedTimeS, 4.712389);
    expect(r.units).toBe("inch");
    // all output in mm: the start point X1 is 25.4 mm
    expectNear(r.bounds.X!.max, 25.4);
  });
});
