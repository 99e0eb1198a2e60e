/**
 * Engine-level figures derived from a flow test. All are estimates for planning a port, never a
 * prediction of what an engine will make: the bench and the dyno decide.
 */
import { speedOfSound } from "./air";
import { M_PER_INCH } from "./units";

/** Mean piston speed S̄p = 2·S·N, in m/s (stroke in m, N in rpm). */
export function meanPistonSpeed(strokeM: number, rpm: number): number {
  return (2 * strokeM * rpm) / 60;
}

/**
 * Mean gas velocity in a port section from continuity: the piston sweeps (π·B²/4)·S̄p, and that
 * volume flow passes through the section. v = (π·B²/4)·S̄p / A_port, m/s.
 */
export function portMeanVelocity(boreM: number, strokeM: number, rpm: number, sectionAreaM2: number): number {
  return ((Math.PI * boreM * boreM) / 4) * meanPistonSpeed(strokeM, rpm) / sectionAreaM2;
}

/**
 * Port velocity by the common-practice sizing rule LPV[ft/s] = 0.00353·N·S·B²/CSA (inches, rpm):
 * the continuity velocity times ≈1.62 for the piston's peak over mean speed. Returns m/s.
 */
export function portVelocityRuleOfThumb(boreM: number, strokeM: number, rpm: number, sectionAreaM2: number): number {
  const boreIn = boreM / M_PER_INCH;
  const strokeIn = strokeM / M_PER_INCH;
  const areaIn2 = sectionAreaM2 / (M_PER_INCH * M_PER_INCH);
  const feetPerSecond = (0.00353 * rpm * strokeIn * boreIn * boreIn) / areaIn2;
  return feetPerSecond * 0.3048;
}

/** Section that keeps the rule-of-thumb port velocity at a ceiling (common practice ~600 ft/s), m². */
export function minimumSectionForVelocity(boreM: number, strokeM: number, rpm: number, maxVelocityMs: number): number {
  // The rule is inversely proportional to the area, so evaluate it at 1 m² and scale.
  return portVelocityRuleOfThumb(boreM, strokeM, rpm, 1) / maxVelocityMs;
}

export type MachIndexInput = {
  boreM: number;
  intakeValveDiameterM: number;
  strokeM: number;
  rpm: number;
  /** Mean inlet-valve flow coefficient over the open period, on the valve-head area π·D²/4. */
  meanFlowCoefficient: number;
  /** Inlet stagnation temperature; 20 °C unless given. */
  inletTemperatureK?: number;
};

/** Taylor's inlet Mach index Z = (B/Dᵢ)²·S̄p/(Cᵢ·aᵢ) (Taylor 1985, ch. 6; Heywood 1988, ch. 6). */
export function inletMachIndex(input: MachIndexInput): number {
  const sound = speedOfSound(input.inletTemperatureK ?? 293.15);
  const ratio = input.boreM / input.intakeValveDiameterM;
  return (ratio * ratio * meanPistonSpeed(input.strokeM, input.rpm)) / (input.meanFlowCoefficient * sound);
}

/** Z is proportional to engine speed, so the speed where Z reaches a threshold follows directly. */
export function rpmAtMachIndex(input: Omit<MachIndexInput, "rpm">, targetIndex: number): number {
  const atOneRpm = inletMachIndex({ ...input, rpm: 1 });
  return targetIndex / atOneRpm;
}

/** The usual threshold: volumetric efficiency falls steeply above Z ≈ 0.6. */
export const MACH_INDEX_THRESHOLD = 0.6;

/** Common-practice factor: horsepower per cfm at 28 inH2O per cylinder, naturally aspirated gasoline. */
export const POWER_PER_CFM_AT_28 = 0.257;

/** Power-potential rule of thumb (common practice, an estimate), hp = 0.257 × intake cfm@28″ × cylinders. */
export function powerPotentialHp(intakeCfmAt28: number, cylinders: number, factor = POWER_PER_CFM_AT_28): number {
  return factor * intakeCfmAt28 * cylinders;
}
