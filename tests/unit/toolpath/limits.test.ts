/**
 * Checks against a machine profile and a plate envelope, and the parts of the cycle time that
 * come from the machine (rapid rates with the slowest axis governing, tool-change time).
 */
import { describe, expect, it } from "vitest";
import type { MachineProfile, PlateEnvelope } from "@/lib/toolpath/types";
import { START, analyzeLines, expectNear, warningCodes } from "./helpers";

const MACHINE: MachineProfile = {
  name: "test mill",
  axes: ["X", "Y", "Z", "A", "B"],
  travelMm: { X: { min: 0, max: 500 }, Y: { min: 0, max: 400 }, Z: { min: -400, max: 0 } },
  rotaryLimitsDeg: { B: { min: -30, max: 30 } },
  rapidRate: { X: 10000, Y: 500, Z: 8000, A: 3600, B: 1800 },
  maxFeedMmPerMin: 20000,
  maxSpindleRpm: 24000,
  toolChangeTimeS: 5,
  homeMm: { X: 0, Y: 0, Z: 0 },
};
const PLATE: PlateEnvelope = {
  name: "test plate",
  min: { X: -60, Y: -60, Z: -80 },
  max: { X: 60, Y: 60, Z: 100 },
  workOffsetMm: { X: 300, Y: 200, Z: -300 },
};
const HEAD = [START, "T1 M6", "S12000 M3", "G0 X0 Y0 Z50"];
type Profiles = { machine?: MachineProfile; plate?: PlateEnvelope };
/** Runs the body after HEAD; with no profiles argument, both MACHINE and PLATE apply. */
const run = (body: string[], profiles: Profiles = { machine: MACHINE, plate: PLATE }) =>
  analyzeLines([...HEAD, ...body, "M30"], profiles);
const machineOnly: Profiles = { machine: MACHINE };

describe("machine travel", () => {
  it("with the plate's work offset, travel is checked point by point in work coordinates", () => {
    // X travel 0…500 machine = −300…200 work; Z travel −400…0 machine = −100…300 work
    const r = run(["G1 X40 F1000", "G0 Z280", "G0 Z310", "G0 Z320", "G0 Z50"], { machine: MACHINE, plate: { ...PLATE, max: { X: 60, Y: 60, Z: 400 } } });
    expect(r.checks.travel).toBe("absolute");
    const z = r.violations.find((v) => v.kind === "travel" && v.axis === "Z");
    expect(z).toMatchObject({ side: "max", limit: 300, worst: 320, count: 2, firstLine: HEAD.length + 3, worstLine: HEAD.length + 4 });
    expect(z!.message).toMatch(/machine 20/);
  });

  it("without a work offset only the program's span is compared with the travel", () => {
    const r = run(["G1 X-300 F1000", "G1 X300"], {
      machine: MACHINE,
      plate: { min: { X: -1000, Y: -1000, Z: -1000 }, max: { X: 1000, Y: 1000, Z: 1000 } },
    });
    expect(r.checks.travel).toBe("span-only");
    expect(r.violations).toEqual([expect.objectContaining({ kind: "travel-span", axis: "X", worst: 600, limit: 500 })]);
  });

  it("a program that fits is clean, and says which checks ran", () => {
    const r = run(["G1 X10 Y-10 Z-20 B20 F1000"]);
    expect(r.violations).toEqual([]);
    expect(r.checks).toEqual({ travel: "absolute", rotaryLimits: true, plateEnvelope: true, maxFeed: true, maxSpindle: true });
  });

  it("without a machine nothing is checked and the assumed rates are named", () => {
    const r = run(["G1 X9000 F100000", "S90000"], {});
    expect(r.violations).toEqual([]);
    expect(r.checks.travel).toBe("not-checked");
    expect(r.machineProfile).toMatch(/assumed/);
  });
});

describe("rotary limits, plate box, feed, spindle, axes", () => {
  it("B beyond ±30° is a violation; A without limits is continuous", () => {
    const r = run(["G1 A400 B-45 F1000"]);
    expect(r.violations).toEqual([expect.objectContaining({ kind: "rotary-limit", axis: "B", side: "min", worst: -45 })]);
  });

  it("leaving the plate's box is a violation, also in the middle of an arc", () => {
    // a full circle about (0,0) of radius 70 from (70,0): both ends inside X ≤ 60? no — so use
    // a circle whose end points sit inside the box while its far side crosses Y = 60
    const r = run(["G1 X0 Y-10 Z0 F1000", "G3 X0 Y-10 I0 J40"]);
    const y = r.violations.find((v) => v.kind === "plate-envelope" && v.axis === "Y");
    expect(y).toMatchObject({ side: "max", limit: 60, count: 1 });
    expectNear(y!.worst, 70);
  });

  it("a feed above the machine's maximum, also when written in inch/min", () => {
    const mm = run(["G1 X10 F25000"]);
    expect(mm.violations).toEqual([expect.objectContaining({ kind: "max-feed", worst: 25000, limit: 20000 })]);
    const inch = run(["G20", "G1 X1 F1000"]); // 25 400 mm/min
    expectNear(inch.violations.find((v) => v.kind === "max-feed")!.worst, 25400, 1e-9);
    expect(run(["G20", "G1 X1 F700"]).violations).toEqual([]); // 17 780 mm/min
  });

  it("a spindle speed above the maximum is flagged at its S word", () => {
    const r = run(["S30000", "G1 X5 F100"]);
    expect(r.violations).toEqual([expect.objectContaining({ kind: "max-spindle", worst: 30000, firstLine: HEAD.length + 1 })]);
  });

  it("an axis the machine does not have", () => {
    const r = run(["G1 C90 F100"]);
    expect(r.violations).toEqual([expect.objectContaining({ kind: "missing-axis", axis: "C", firstLine: HEAD.length + 1 })]);
  });
});

describe("cycle time parts from the machine", () => {
  it("a rapid takes as long as its slowest axis needs", () => {
    // X 100 mm at 10 000 mm/min = 0.6 s, Y 10 mm at 500 mm/min = 1.2 s: Y governs
    const r = run(["G0 X100 Y10"], machineOnly);
    expectNear(r.rapidTimeS, 1.2, 1e-9);
    expectNear(r.rapidLengthMm, Math.hypot(100, 10), 1e-9);
  });

  it("rotary rapids count at their own rate", () => {
    const r = run(["G0 A0 B0", "G0 B30"], machineOnly); // 30° at 1800°/min = 1 s
    expectNear(r.rapidTimeS, 1, 1e-9);
    expectNear(r.rotaryTravelDeg.B!, 30, 1e-9);
  });

  it("a rotary move from a never-programmed angle is not measured", () => {
    const r = run(["G0 B30"], machineOnly);
    expect(r.rapidTimeS).toBe(0);
    expect(r.unmeasuredMoves).toBe(2); // the first G0 of HEAD and this one
  });

  it("tool changes cost the machine's change time; the tool already loaded costs nothing", () => {
    const r = run(["T2 M6", "T2 M6", "T1 M6"], machineOnly);
    expect(r.toolChanges).toBe(3); // T1 at the start, T2, back to T1
    expectNear(r.toolChangeTimeS, 15, 1e-9);
  });

  it("dwell is in seconds (§3.5.4); a long one is flagged as a possible millisecond value", () => {
    const r = run(["G4 P2.5", "G4 P100"], machineOnly);
    expectNear(r.dwellTimeS, 102.5, 1e-9);
    expect(warningCodes(r)).toContain("long-dwell");
  });

  it("rotary-only feed moves run at F in degrees per minute (§2.1.2.5)", () => {
    const r = run(["G0 A0 B0", "G1 A30 B40 F600"], machineOnly); // √(30² + 40²) = 50° at 600°/min = 5 s
    expectNear(r.feedTimeS, 5, 1e-9);
    expect(r.feedLengthMm).toBe(0);
  });
});

describe("machine-referenced moves", () => {
  it("G53 and G28 are placed in work coordinates when the plate gives the work offset", () => {
    const r = run(["G53 G0 Z0", "G1 X10 F600", "G28 G91 Z0", "G90 G1 Z-10"]);
    expect(r.machineCoordinateMoves).toBe(1);
    expect(r.homeReturns).toBe(1);
    // machine Z0 = work Z 300 (offset −300); machine home Z0 likewise
    expect(r.bounds.Z!.max).toBe(300);
    expect(r.unmeasuredMoves).toBe(1); // only the first G0 from an unknown start
  });

  it("without the offset they leave the position unknown and their moves unmeasured", () => {
    const r = run(["G53 G0 Z0", "G1 X10 F600", "G1 Z-5", "G0 Z20", "G1 X20"], machineOnly);
    expect(r.bounds.Z!.max).toBe(50); // machine Z0 cannot be placed, so it is not in the extent
    // measured: X0 → X10 (Z does not matter for a move along X) and X10 → X20
    expectNear(r.feedLengthMm, 20, 1e-9);
    expect(r.unmeasuredMoves).toBe(3); // the first G0, the G53 move, the Z-5 cut from an unknown Z
    expect(r.warnings.find((w) => w.code === "feed-from-unknown-position")?.line).toBe(HEAD.length + 3);
  });

  it("a G53 move is held to the machine travel, not to the plate box", () => {
    const r = run(["G53 G0 Z0"]);
    expect(r.violations.filter((v) => v.kind === "plate-envelope")).toEqual([]);
  });
});

describe("tool list", () => {
  it("lists at most 1000 distinct tools and reports the rest together", () => {
    const body = Array.from({ length: 1003 }, (_, i) => `T${i + 1} M6\nG1 X${i % 7} F500`);
    const r = run(body, {});
    expect(r.tools).toHaveLength(1001);
    expect(r.tools[999].number).toBe(1000);
    expect(r.tools[1000].number).toBe(-1);
    expect(r.tools[1000].ranges.length).toBe(3); // tools 1001…1003 share the record
    expect(r.toolChanges).toBe(1003);
    expect(warningCodes(r)).toContain("too-many-tools");
  });
});
