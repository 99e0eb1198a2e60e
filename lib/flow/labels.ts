/**
 * The conventions the flow math uses and the words the screens show beside its figures.
 * Kept in one place so the UI, the CLI and stored records quote the same text.
 */
import { PA_PER_INCH_OF_WATER } from "./units";

/** One inch-of-water convention app-wide; its label is stored with every reading. */
export const INCH_OF_WATER = {
  id: "conventional",
  label: "inH₂O (conventional: 1000 kg/m³ water, standard gravity)",
  shortLabel: "inH₂O conv.",
  pascals: PA_PER_INCH_OF_WATER,
  source: "NIST SP 811 (2008), App. B.8: 2.490 889 E+02 Pa",
} as const;

export const DENSITY_LAW = {
  id: "cipm-2007",
  name: "CIPM-2007 equation for the density of moist air",
  source: "Picard, Davis, Gläser, Fujii, Metrologia 45 (2008) 149–155",
  assumption: "CO₂ mole fraction 0.0004; humidity taken as 0 % when not entered",
} as const;

export const FLOW_LAW = {
  id: "sqrt-depression",
  name: "Q ∝ √(ΔP/ρ) at a constant flow coefficient (incompressible orifice law)",
  source: "orifice equation of ISO 5167-1 with expansibility ε = 1",
} as const;

export const COMPRESSIBILITY_NOTE =
  "Compressibility is neglected: flows are converted between depressions and to standard air by the square-root law. " +
  "Across 10 → 28 inH₂O this overstates the ideal mass flow by about 2.5 % compared with an ideal compressible nozzle; " +
  "compare tests taken at the same depression where it matters.";

export const STANDARD_AIR = {
  iso2533: {
    id: "iso2533",
    label: "ISO 2533 sea level: 15 °C, 101.325 kPa, dry, 1.2250 kg/m³",
    densityKgM3: 1.225,
    source: "ISO 2533:1975 Standard Atmosphere",
  },
  fan075: {
    id: "fan075",
    label: "Fan-test standard air: 0.075 lb/ft³ (1.2014 kg/m³)",
    densityKgM3: 0.075 * (0.45359237 / 0.3048 ** 3),
    source: "ANSI/AMCA 210 / ASHRAE 51 (from memory, to verify)",
  },
} as const;
export type StandardAirId = keyof typeof STANDARD_AIR;
export const STANDARD_AIR_IDS = Object.keys(STANDARD_AIR) as StandardAirId[];

/** Label for every figure that comes from a trade rule of thumb rather than a published law. */
export const RULE_OF_THUMB_LABEL = "common practice, an estimate";

export const POWER_RULE_LABEL = `Power potential from intake flow at 28 inH₂O (${RULE_OF_THUMB_LABEL}; naturally aspirated gasoline)`;
export const PORT_VELOCITY_RULE_LABEL = `Peak port velocity, sizing rule (${RULE_OF_THUMB_LABEL})`;
export const MACH_INDEX_LABEL =
  "Inlet Mach index Z (Taylor 1985 ch. 6; Heywood 1988 ch. 6): volumetric efficiency falls steeply above about 0.6";
export const RATIO_GUIDELINE = {
  low: 0.7,
  high: 0.8,
  label: `Exhaust/intake flow at equal lift is usually 70–80 % for a naturally aspirated engine (${RULE_OF_THUMB_LABEL})`,
} as const;
export const MEAN_CD_NOTE =
  "Mean flow coefficient of the tested lift points, not weighted by a cam's lift curve, so the Mach index is an estimate.";

/** Shown wherever figures might guide metal removal. */
export const ESTIMATE_CAUTION =
  "These figures are estimates. The flow bench and the inspection decide: check wall thickness, seats and " +
  "water jackets before removing metal, and prove a first article before cutting customers' heads.";
