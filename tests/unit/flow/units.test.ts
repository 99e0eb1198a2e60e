import { describe, expect, it } from "vitest";
import {
  PA_PER_INCH_OF_WATER,
  area,
  density,
  flow,
  length,
  power,
  pressure,
  temperatureToCelsius,
  velocity,
  volume,
} from "@/lib/flow/units";

// Check values: domain.md §1, NIST SP 811 (2008) App. B.8 [S].
describe("pressure", () => {
  it("uses the conventional inch of water, 249.08891 Pa", () => {
    expect(PA_PER_INCH_OF_WATER).toBeCloseTo(249.08891, 5); // NIST SP 811 B.8: 2.490 889 E+02
  });
  it("converts bench depressions to pascals", () => {
    expect(pressure.toSi(28, "inH2O")).toBeCloseTo(6974.489, 3); // domain.md §1 (conv.)
    expect(pressure.toSi(10, "inH2O")).toBeCloseTo(2490.889, 3); // domain.md §1
    expect(pressure.toSi(25, "inH2O")).toBeCloseTo(6227.223, 3); // domain.md §1
  });
  it("converts barometric readings", () => {
    expect(pressure.toSi(29.92, "inHg")).toBeCloseTo(101320.75, 1); // domain.md §1, NIST conventional inHg
    expect(pressure.toSi(1, "inHg")).toBeCloseTo(3386.389, 3); // NIST SP 811 B.8: 3.386 389 E+03
    expect(pressure.fromSi(101325, "inHg")).toBeCloseTo(29.92126, 5); // domain.md §1
    expect(pressure.convert(101.325, "kPa", "hPa")).toBeCloseTo(1013.25, 10);
  });
  it("round-trips every unit", () => {
    for (const unit of ["Pa", "kPa", "hPa", "inH2O", "inHg"] as const) {
      expect(pressure.fromSi(pressure.toSi(12.34, unit), unit)).toBeCloseTo(12.34, 10);
    }
  });
});

describe("flow, length, area, volume", () => {
  it("cfm is exactly 4.719474432e-4 m³/s", () => {
    expect(flow.toSi(300, "cfm")).toBeCloseTo(0.14158423, 8); // domain.md §1 (NIST, exact)
    expect(flow.convert(1, "cfm", "L/s")).toBeCloseTo(0.4719474432, 10);
    expect(flow.convert(3600, "m3/h", "m3/s")).toBeCloseTo(1, 12);
  });
  it("inches and millimetres", () => {
    expect(length.convert(1.8, "in", "mm")).toBeCloseTo(45.72, 10); // 1 in = 25.4 mm exactly (NIST)
    expect(area.convert(1, "in2", "mm2")).toBeCloseTo(645.16, 10); // domain.md §12, exact
  });
  it("cubic inches and cc", () => {
    expect(volume.convert(350, "in3", "cc")).toBeCloseTo(5735.472, 3); // domain.md §1
    expect(volume.convert(1, "L", "in3")).toBeCloseTo(61.02374, 5); // domain.md §1
  });
  it("velocity, density and power for display", () => {
    expect(velocity.fromSi(107.7532, "ft/s")).toBeCloseTo(353.521, 3); // domain.md §3
    expect(density.toSi(0.075, "lb/ft3")).toBeCloseTo(1.201385, 6); // domain.md §3
    expect(power.toSi(500, "hp")).toBeCloseTo(372849.9, 1); // domain.md §1
  });
  it("temperatures", () => {
    expect(temperatureToCelsius(80, "F")).toBeCloseTo(26.6667, 4); // domain.md §4
    expect(temperatureToCelsius(293.15, "K")).toBeCloseTo(20, 10);
  });
});
