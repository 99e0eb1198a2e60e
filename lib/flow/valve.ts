/**
 * Valve geometry and flow coefficients. All inputs in SI (m, m³/s, Pa, kg/m³).
 * A flow coefficient only means something together with its reference area, so every Cd the
 * app reports carries the name of the area it was computed on.
 */
import { idealVelocity } from "./orifice";

/** Curtain area π·D·L: the cylinder the valve head lifts out of the seat. */
export function curtainArea(valveDiameterM: number, liftM: number): number {
  return Math.PI * valveDiameterM * liftM;
}

/** Area of a circle from its diameter: valve head, inner seat or throat. */
export function circleArea(diameterM: number): number {
  return (Math.PI * diameterM * diameterM) / 4;
}

/** Lift over valve diameter. */
export function liftOverDiameter(liftM: number, valveDiameterM: number): number {
  return liftM / valveDiameterM;
}

export const REFERENCE_AREAS = ["curtain", "valve", "seat", "section"] as const;
export type ReferenceArea = (typeof REFERENCE_AREAS)[number];

/** Cd = Q / (A_ref·√(2ΔP/ρ)): measured flow over the ideal flow through the reference area. */
export function flowCoefficient(flowM3s: number, referenceAreaM2: number, depressionPa: number, densityKgM3: number): number {
  return flowM3s / (referenceAreaM2 * idealVelocity(depressionPa, densityKgM3));
}

/** Ideal flow through an area, A·√(2ΔP/ρ), in m³/s (the denominator of every Cd). */
export function idealFlow(areaM2: number, depressionPa: number, densityKgM3: number): number {
  return areaM2 * idealVelocity(depressionPa, densityKgM3);
}

/** Mean velocity through a section from continuity, v = Q/A (m/s). */
export function meanSectionVelocity(flowM3s: number, sectionAreaM2: number): number {
  return flowM3s / sectionAreaM2;
}
