import { describe, expect, it } from "vitest";
import {
  cipm2007Density,
  idealGasMoistAirDensity,
  saturationVapourPressureCipm,
  saturationVapourPressureMagnus,
  speedOfSound,
} from "@/lib/flow/air";
import { pressure, temperatureToCelsius } from "@/lib/flow/units";

// Check values: domain.md §4 table, computed from Picard et al. 2008 (CIPM-2007) [S].
describe("CIPM-2007 moist-air density", () => {
  it("101 325 Pa, 20 °C, 50 % RH with its intermediate values", () => {
    const r = cipm2007Density({ pressurePa: 101325, temperatureC: 20, relativeHumidityPercent: 50 });
    expect(r.densityKgM3).toBeCloseTo(1.19931, 5); // domain.md §4, CIPM-2007
    expect(r.compressibility).toBeCloseTo(0.999615, 6); // domain.md §4, Z
    expect(r.vapourMoleFraction).toBeCloseTo(0.011589, 6); // domain.md §4, x_v
  });
  it.each([
    [101325, 15, 0, 1.22552],
    [101325, 20, 0, 1.20456],
    [98000, 30, 80, 1.11178],
  ])("p = %d Pa, t = %d °C, RH = %d %% → %f kg/m³", (p, t, rh, expected) => {
    expect(cipm2007Density({ pressurePa: p, temperatureC: t, relativeHumidityPercent: rh }).densityKgM3).toBeCloseTo(expected, 5); // domain.md §4
  });
  it("29.92 inHg, 80 °F, 60 % RH", () => {
    const rho = cipm2007Density({
      pressurePa: pressure.toSi(29.92, "inHg"),
      temperatureC: temperatureToCelsius(80, "F"),
      relativeHumidityPercent: 60,
    }).densityKgM3;
    expect(rho).toBeCloseTo(1.16845, 5); // domain.md §4
  });
  it("more CO₂ makes the air denser", () => {
    const base = cipm2007Density({ pressurePa: 101325, temperatureC: 20, relativeHumidityPercent: 0 }).densityKgM3;
    const co2 = cipm2007Density({ pressurePa: 101325, temperatureC: 20, relativeHumidityPercent: 0, co2MoleFraction: 0.001 }).densityKgM3;
    expect(co2).toBeGreaterThan(base);
  });
});

describe("saturation vapour pressure at 20 °C", () => {
  it("CIPM-2007 form", () => {
    expect(saturationVapourPressureCipm(293.15)).toBeCloseTo(2339.16, 2); // domain.md §4
  });
  it("Magnus (Alduchov & Eskridge 1996)", () => {
    expect(saturationVapourPressureMagnus(20)).toBeCloseTo(2333.44, 2); // domain.md §4
  });
});

describe("ideal-gas mixture with Magnus vapour pressure", () => {
  it.each([
    [101325, 20, 50, 1.19884],
    [101325, 15, 0, 1.22498],
    [101325, 20, 0, 1.20408],
    [98000, 30, 80, 1.11144],
  ])("p = %d Pa, t = %d °C, RH = %d %% → %f kg/m³", (p, t, rh, expected) => {
    expect(idealGasMoistAirDensity({ pressurePa: p, temperatureC: t, relativeHumidityPercent: rh })).toBeCloseTo(expected, 5); // domain.md §4
  });
});

describe("speed of sound", () => {
  it("matches the Mach-index check", () => {
    expect(speedOfSound(293.15, 287.05)).toBeCloseTo(343.232, 3); // domain.md §6, a = √(1.4·287.05·293.15)
  });
  it("ISO 2533 sea level", () => {
    expect(speedOfSound(288.15)).toBeCloseTo(340.294, 3); // domain.md §3, ISO 2533 [S]
  });
});
