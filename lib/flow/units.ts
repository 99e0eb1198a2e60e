/**
 * Unit conversions for the flow bench, from NIST SP 811 (2008), Appendix B.8–B.9.
 * Every quantity converts through its SI unit so that each factor is written once.
 */

/** Conventional inch of water: 0.0254 m × 1000 kg/m³ × 9.80665 m/s² (NIST SP 811 lists 2.490 889 E+02). */
export const PA_PER_INCH_OF_WATER = 0.0254 * 1000 * 9.80665;
/** Conventional inch of mercury: 0.0254 m × 13 595.1 kg/m³ × 9.80665 m/s² (NIST SP 811 lists 3.386 389 E+03). */
export const PA_PER_INCH_OF_MERCURY = 0.0254 * 13595.1 * 9.80665;
/** Exact: 1 ft³/min = 0.3048³ m³ / 60 s. */
export const M3S_PER_CFM = 4.719474432e-4;
export const M_PER_INCH = 0.0254;
export const M_PER_FOOT = 0.3048;
/** Exact: the international pound. */
export const KG_PER_POUND = 0.45359237;
/** Exact: 550 ft·lbf/s. */
export const W_PER_HORSEPOWER = 745.69987158227022;

type Table<U extends string> = Readonly<Record<U, number>>;

/** Builds a pair of converters from a table of "SI units per one of this unit". */
function converter<U extends string>(siPerUnit: Table<U>) {
  return {
    toSi: (value: number, unit: U): number => value * siPerUnit[unit],
    fromSi: (si: number, unit: U): number => si / siPerUnit[unit],
    convert: (value: number, from: U, to: U): number => (value * siPerUnit[from]) / siPerUnit[to],
  };
}

export const PRESSURE_UNITS = ["Pa", "kPa", "hPa", "inH2O", "inHg"] as const;
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export const pressure = converter<PressureUnit>({
  Pa: 1,
  kPa: 1000,
  hPa: 100,
  inH2O: PA_PER_INCH_OF_WATER,
  inHg: PA_PER_INCH_OF_MERCURY,
});

export const FLOW_UNITS = ["cfm", "L/s", "m3/s", "m3/h"] as const;
export type FlowUnit = (typeof FLOW_UNITS)[number];
/** Volume flow, SI unit m³/s. */
export const flow = converter<FlowUnit>({
  cfm: M3S_PER_CFM,
  "L/s": 1e-3,
  "m3/s": 1,
  "m3/h": 1 / 3600,
});

export const LENGTH_UNITS = ["mm", "in", "m"] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];
/** Length, SI unit m. */
export const length = converter<LengthUnit>({ mm: 1e-3, in: M_PER_INCH, m: 1 });

export const AREA_UNITS = ["mm2", "cm2", "in2", "m2"] as const;
export type AreaUnit = (typeof AREA_UNITS)[number];
/** Area, SI unit m² (1 in² = 645.16 mm² exactly). */
export const area = converter<AreaUnit>({ mm2: 1e-6, cm2: 1e-4, in2: M_PER_INCH * M_PER_INCH, m2: 1 });

export const VOLUME_UNITS = ["cc", "in3", "L", "m3"] as const;
export type VolumeUnit = (typeof VOLUME_UNITS)[number];
/** Volume, SI unit m³ (1 in³ = 16.387064 cm³ exactly). */
export const volume = converter<VolumeUnit>({ cc: 1e-6, in3: M_PER_INCH ** 3, L: 1e-3, m3: 1 });

export const VELOCITY_UNITS = ["m/s", "ft/s", "ft/min"] as const;
export type VelocityUnit = (typeof VELOCITY_UNITS)[number];
/** Velocity, SI unit m/s. */
export const velocity = converter<VelocityUnit>({ "m/s": 1, "ft/s": M_PER_FOOT, "ft/min": M_PER_FOOT / 60 });

export const DENSITY_UNITS = ["kg/m3", "lb/ft3"] as const;
export type DensityUnit = (typeof DENSITY_UNITS)[number];
/** Density, SI unit kg/m³. */
export const density = converter<DensityUnit>({ "kg/m3": 1, "lb/ft3": KG_PER_POUND / M_PER_FOOT ** 3 });

export const POWER_UNITS = ["W", "kW", "hp"] as const;
export type PowerUnit = (typeof POWER_UNITS)[number];
export const power = converter<PowerUnit>({ W: 1, kW: 1000, hp: W_PER_HORSEPOWER });

export const TEMPERATURE_UNITS = ["C", "F", "K"] as const;
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];
/** Temperature is affine, so it gets its own pair instead of a factor table. */
export function temperatureToCelsius(value: number, unit: TemperatureUnit): number {
  if (unit === "C") return value;
  if (unit === "K") return value - 273.15;
  return ((value - 32) * 5) / 9;
}
export function celsiusToKelvin(celsius: number): number {
  return celsius + 273.15;
}
