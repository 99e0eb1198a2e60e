import { describe, expect, it } from "vitest";
import {
  MACH_INDEX_THRESHOLD,
  inletMachIndex,
  meanPistonSpeed,
  minimumSectionForVelocity,
  portMeanVelocity,
  portVelocityRuleOfThumb,
  powerPotentialHp,
  rpmAtMachIndex,
} from "@/lib/flow/engine";
import { area, length, velocity } from "@/lib/flow/units";

const inch = (v: number) => length.toSi(v, "in");
const in2 = (v: number) => area.toSi(v, "in2");

describe("mean piston speed 2·S·N", () => {
  it("3.48 in stroke at 6500 rpm", () => {
    const sp = meanPistonSpeed(inch(3.48), 6500);
    expect(velocity.fromSi(sp, "ft/s")).toBeCloseTo(62.8333, 4); // domain.md §7
    expect(sp).toBeCloseTo(19.1516, 4); // domain.md §7
    expect(velocity.fromSi(sp, "ft/min")).toBeCloseTo(3770, 6); // domain.md §7
  });
  it("3.48 in at 6000 rpm", () => expect(meanPistonSpeed(inch(3.48), 6000)).toBeCloseTo(17.6784, 4)); // domain.md §6
});

describe("port velocity", () => {
  it("continuity: 4.00 in bore, 3.48 in stroke, 6500 rpm, 2.20 in²", () => {
    expect(velocity.fromSi(portMeanVelocity(inch(4), inch(3.48), 6500, in2(2.2)), "ft/s")).toBeCloseTo(358.9, 2); // domain.md §7
  });
  it("sizing rule of thumb (common practice) at 2.20 in²", () => {
    expect(velocity.fromSi(portVelocityRuleOfThumb(inch(4), inch(3.48), 6500, in2(2.2)), "ft/s")).toBeCloseTo(580.72, 2); // domain.md §7 [CP]
  });
  it("section for a 600 ft/s ceiling (common practice)", () => {
    const a = minimumSectionForVelocity(inch(4), inch(3.48), 6500, velocity.toSi(600, "ft/s"));
    expect(area.fromSi(a, "in2")).toBeCloseTo(2.1293, 4); // domain.md §7 [CP]
  });
});

// Taylor 1985 ch. 6 / Heywood 1988 ch. 6 [M]; check values domain.md §6 (Ci = 0.40 is an assumed input).
describe("inlet Mach index", () => {
  const engine = { boreM: inch(4), intakeValveDiameterM: inch(2.02), strokeM: inch(3.48), meanFlowCoefficient: 0.4, inletTemperatureK: 293.15 };
  it("Z at 6000 rpm", () => expect(inletMachIndex({ ...engine, rpm: 6000 })).toBeCloseTo(0.50491, 4)); // domain.md §6 (a from R = 287.05; ISO R shifts the 6th digit)
  it("reaches the 0.6 threshold at 7130 rpm", () => {
    expect(MACH_INDEX_THRESHOLD).toBe(0.6); // Taylor 1985 ch. 6 [M]
    expect(rpmAtMachIndex(engine, 0.6)).toBeCloseTo(7130.0, 0); // domain.md §6
  });
  it("is proportional to engine speed", () => {
    expect(inletMachIndex({ ...engine, rpm: 7000 }) / inletMachIndex({ ...engine, rpm: 3500 })).toBeCloseTo(2, 12);
  });
});

describe("power potential (common practice, an estimate)", () => {
  it.each([
    [250, 8, 514.0],
    [300, 8, 616.8],
    [180, 4, 185.04],
  ])("%d cfm@28 × %d cylinders", (cfm, cyl, hp) => expect(powerPotentialHp(cfm, cyl)).toBeCloseTo(hp, 2)); // domain.md §8 [CP]
});
