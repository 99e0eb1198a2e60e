/**
 * The hand-measured throat against the valve head: the porter's first check. The guideline is
 * common practice (intake 85–90 % of the valve head diameter, exhaust about 85–88 %), not a
 * published standard: the flow bench decides.
 */
import type { Port } from "@/db/enums";

export type ThroatCheck = {
  percentOfValve: number;
  /** Area ratio: the square of the diameter ratio. */
  percentOfValveArea: number;
  low: number;
  high: number;
  verdict: "below" | "within" | "above";
};

export const THROAT_GUIDELINE: Record<Port, { low: number; high: number }> = {
  intake: { low: 85, high: 90 },
  exhaust: { low: 85, high: 88 },
};

export function throatCheck(port: Port, throatMm: number | null | undefined, valveMm: number | null | undefined): ThroatCheck | null {
  if (throatMm == null || valveMm == null || !(throatMm > 0) || !(valveMm > 0)) return null;
  const ratio = throatMm / valveMm;
  const percentOfValve = ratio * 100;
  const { low, high } = THROAT_GUIDELINE[port];
  const shown = Math.round(percentOfValve * 100) / 100;
  return {
    percentOfValve,
    percentOfValveArea: ratio * ratio * 100,
    low,
    high,
    // Compared at 0.01 % so a reading exactly on the line (e.g. 1.62 / 1.80 in) counts as on it.
    verdict: shown < low ? "below" : shown > high ? "above" : "within",
  };
}

export function guidelineText(port: Port): string {
  const { low, high } = THROAT_GUIDELINE[port];
  return `Common practice: ${port} throat ${low}–${high} % of the valve head diameter. The flow bench decides.`;
}
