/**
 * Density of moist air. The app uses the CIPM-2007 equation (Picard et al., Metrologia 45, 2008):
 * it is the metrology reference and costs nothing to evaluate. The ideal-gas mixture with a
 * Magnus vapour pressure is kept beside it so the two can be compared (they differ by ~0.05 %).
 */

const R_MOLAR = 8.314472; // J/(mol·K), value fixed by CIPM-2007
const M_VAPOUR = 18.01528e-3; // kg/mol
const DEFAULT_CO2_MOLE_FRACTION = 0.0004;

export type MoistAir = {
  pressurePa: number;
  temperatureC: number;
  /** 0–100 */
  relativeHumidityPercent: number;
  /** Mole fraction of CO₂; CIPM-2007 reference 0.0004. */
  co2MoleFraction?: number;
};

export type Cipm2007Density = {
  densityKgM3: number;
  /** Compressibility factor Z of the moist air. */
  compressibility: number;
  /** Mole fraction of water vapour x_v. */
  vapourMoleFraction: number;
  saturationVapourPressurePa: number;
};

/** Saturation vapour pressure over water, CIPM-2007 form (T in kelvin). */
export function saturationVapourPressureCipm(temperatureK: number): number {
  const A = 1.2378847e-5;
  const B = -1.9121316e-2;
  const C = 33.93711047;
  const D = -6.3431645e3;
  const T = temperatureK;
  return Math.exp(A * T * T + B * T + C + D / T);
}

/** Saturation vapour pressure, Magnus form of Alduchov & Eskridge (1996), t in °C, result in Pa. */
export function saturationVapourPressureMagnus(temperatureC: number): number {
  return 610.94 * Math.exp((17.625 * temperatureC) / (temperatureC + 243.04));
}

/** CIPM-2007 moist-air density with its intermediate values (for display and tests). */
export function cipm2007Density(air: MoistAir): Cipm2007Density {
  const p = air.pressurePa;
  const t = air.temperatureC;
  const T = t + 273.15;
  const xCo2 = air.co2MoleFraction ?? DEFAULT_CO2_MOLE_FRACTION;
  const phi = air.relativeHumidityPercent / 100;

  const psv = saturationVapourPressureCipm(T);
  const enhancement = 1.00062 + 3.14e-8 * p + 5.6e-7 * t * t;
  const xv = (phi * enhancement * psv) / p;

  const a0 = 1.58123e-6;
  const a1 = -2.9331e-8;
  const a2 = 1.1043e-10;
  const b0 = 5.707e-6;
  const b1 = -2.051e-8;
  const c0 = 1.9898e-4;
  const c1 = -2.376e-6;
  const d = 1.83e-11;
  const e = -0.765e-8;
  const Z =
    1 -
    (p / T) * (a0 + a1 * t + a2 * t * t + (b0 + b1 * t) * xv + (c0 + c1 * t) * xv * xv) +
    ((p * p) / (T * T)) * (d + e * xv * xv);

  const Ma = (28.96546 + 12.011 * (xCo2 - 0.0004)) * 1e-3;
  const rho = ((p * Ma) / (Z * R_MOLAR * T)) * (1 - xv * (1 - M_VAPOUR / Ma));
  return { densityKgM3: rho, compressibility: Z, vapourMoleFraction: xv, saturationVapourPressurePa: psv };
}

/** Ideal-gas mixture of dry air and vapour, ρ = (p − e)/(Rd·T) + e/(Rv·T), e from Magnus. */
export function idealGasMoistAirDensity(air: MoistAir): number {
  const Rd = 287.058;
  const Rv = 461.495;
  const T = air.temperatureC + 273.15;
  const e = (air.relativeHumidityPercent / 100) * saturationVapourPressureMagnus(air.temperatureC);
  return (air.pressurePa - e) / (Rd * T) + e / (Rv * T);
}

/** Specific gas constant of dry air in ISO 2533 (J/(kg·K)). */
export const R_DRY_AIR_ISO2533 = 287.05287;

/** Speed of sound of an ideal gas, a = √(κ·R·T); dry air by default. */
export function speedOfSound(temperatureK: number, gasConstant = R_DRY_AIR_ISO2533, kappa = 1.4): number {
  return Math.sqrt(kappa * gasConstant * temperatureK);
}

/**
 * Ranges within which CIPM-2007 was validated (600–1100 hPa, 15–27 °C; from memory of Picard et al.
 * 2008, to verify). Outside them the app still computes but says so.
 */
export const CIPM2007_VALID_RANGE = {
  pressurePa: [60_000, 110_000],
  temperatureC: [15, 27],
} as const;
