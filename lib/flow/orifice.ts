/**
 * The incompressible orifice law the bench math rests on: v = √(2ΔP/ρ), and at a constant flow
 * coefficient the volume flow goes as √(ΔP/ρ). Compressibility is neglected on purpose (every
 * bench figure in the trade is quoted that way); `idealNozzleExpansibility` quantifies the error.
 */

/** Ideal (Bernoulli) velocity for a pressure drop, √(2ΔP/ρ), in m/s. */
export function idealVelocity(depressionPa: number, densityKgM3: number): number {
  return Math.sqrt((2 * depressionPa) / densityKgM3);
}

/** Flow at another bench depression, Q₂ = Q₁·√(ΔP₂/ΔP₁), same units in and out. */
export function flowAtDepression(flowValue: number, fromDepressionPa: number, toDepressionPa: number): number {
  return flowValue * Math.sqrt(toDepressionPa / fromDepressionPa);
}

/**
 * Volume flow the same restriction would pass, at the same depression, in air of another density:
 * Q_std = Q_test·√(ρ_test/ρ_std). This keeps the flow coefficient constant, which is what makes tests
 * taken on different days comparable.
 */
export function flowAtDensity(flowValue: number, testDensityKgM3: number, targetDensityKgM3: number): number {
  return flowValue * Math.sqrt(testDensityKgM3 / targetDensityKgM3);
}

/**
 * Expansibility ε of an ideal nozzle (ISO 5167-3 form with β → 0) for a depression below an
 * upstream absolute pressure. ε = 1 would mean no compressibility effect.
 */
export function idealNozzleExpansibility(depressionPa: number, upstreamPa = 101_325, kappa = 1.4): number {
  const tau = (upstreamPa - depressionPa) / upstreamPa;
  if (tau >= 1) return 1;
  const term1 = (kappa * tau ** (2 / kappa)) / (kappa - 1);
  const term2 = (1 - tau ** ((kappa - 1) / kappa)) / (1 - tau);
  return Math.sqrt(term1 * term2);
}

/**
 * Ratio of ideal mass flows between two depressions including expansibility, i.e. what the √ law
 * would give if compressibility were not neglected: ε₂√ΔP₂ / (ε₁√ΔP₁).
 */
export function compressibleFlowRatio(fromDepressionPa: number, toDepressionPa: number, upstreamPa = 101_325): number {
  const e1 = idealNozzleExpansibility(fromDepressionPa, upstreamPa);
  const e2 = idealNozzleExpansibility(toDepressionPa, upstreamPa);
  return (e2 * Math.sqrt(toDepressionPa)) / (e1 * Math.sqrt(fromDepressionPa));
}
