/** Reading machine profiles and plate envelopes from JSON. */
import { describe, expect, it } from "vitest";
import { ProfileError, parseMachineProfile, parsePlateEnvelope } from "@/lib/toolpath/profile";

const MACHINE = {
  name: "  bench mill ",
  axes: ["x", "Y", "Z", "A", "B"],
  travelMm: { X: { min: 0, max: 600 } },
  rotaryLimitsDeg: { B: { min: -110, max: 110 } },
  rapidRate: { X: 30000, Y: 30000, Z: 20000, A: 9000, B: 9000 },
  maxFeedMmPerMin: 15000,
  maxSpindleRpm: 24000,
  toolChangeTimeS: 6.5,
  homeMm: { Z: 0 },
};

describe("parseMachineProfile", () => {
  it("accepts a full profile, trimming the name and upper-casing axes", () => {
    const p = parseMachineProfile(MACHINE);
    expect(p.name).toBe("bench mill");
    expect(p.axes).toEqual(["X", "Y", "Z", "A", "B"]);
    expect(p.travelMm).toEqual({ X: { min: 0, max: 600 } });
    expect(p.toolChangeTimeS).toBe(6.5);
    expect(p.homeMm).toEqual({ Z: 0 });
  });

  it.each([
    [{ ...MACHINE, rapidRate: { X: 1, Y: 1, Z: 1, A: 1 } }, /rapidRate.B is missing/],
    [{ ...MACHINE, rapidRate: { ...MACHINE.rapidRate, W: 5 } }, /unknown axis W/],
    [{ ...MACHINE, maxFeedMmPerMin: 0 }, /above zero/],
    [{ ...MACHINE, toolChangeTimeS: -1 }, /negative/],
    [{ ...MACHINE, travelMm: { X: { min: 5, max: 1 } } }, /min is above max/],
    [{ ...MACHINE, axes: ["X", "Q"] }, /unknown axis/],
    [{ ...MACHINE, maxSpindleRpm: "fast" }, /expected a number/],
    [[1, 2], /JSON object/],
  ])("refuses %j", (value, message) => {
    expect(() => parseMachineProfile(value)).toThrow(ProfileError);
    expect(() => parseMachineProfile(value)).toThrow(message);
  });
});

describe("parsePlateEnvelope", () => {
  it("accepts a box with an optional work offset", () => {
    const p = parsePlateEnvelope({ name: "intake plate", min: { X: -50, Y: -40, Z: -80 }, max: { X: 50, Y: 40, Z: 60 }, workOffsetMm: { X: 250, Y: 180, Z: -420 } });
    expect(p.workOffsetMm).toEqual({ X: 250, Y: 180, Z: -420 });
  });
  it("refuses an inside-out box and missing axes", () => {
    expect(() => parsePlateEnvelope({ min: { X: 5, Y: 0, Z: 0 }, max: { X: 1, Y: 1, Z: 1 } })).toThrow(/min.X is above max.X/);
    expect(() => parsePlateEnvelope({ min: { X: 0, Y: 0 }, max: { X: 1, Y: 1, Z: 1 } })).toThrow(/min.Z/);
  });
});
