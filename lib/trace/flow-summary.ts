/** The one figure a trace page shows per flow test: peak flow moved to 28 inH2O, with its lift. */
import type { FlowTestTrace } from "@/db/queries/trace";
import { tryComputeFlowTest } from "../flow";

export type FlowPeak = { peakCfmAt28: number; atLiftMm: number; meanCdValve: number } | null;

export function flowPeak(test: Pick<FlowTestTrace, "valveDiameterMm" | "depressionInH2O" | "tempC" | "baroKpa" | "rhPct" | "points">): FlowPeak {
  if (test.points.length === 0) return null;
  const ambient =
    test.tempC != null && test.baroKpa != null
      ? { temperature: test.tempC, temperatureUnit: "C" as const, pressure: test.baroKpa, pressureUnit: "kPa" as const, relativeHumidityPercent: test.rhPct ?? undefined }
      : undefined;
  const computed = tryComputeFlowTest({
    valveDiameter: test.valveDiameterMm,
    lengthUnit: "mm",
    depression: test.depressionInH2O,
    depressionUnit: "inH2O",
    ambient,
    liftUnit: "mm",
    flowUnit: "cfm",
    points: test.points,
  });
  if (!computed.ok) return null;
  const s = computed.result.summary;
  return { peakCfmAt28: s.peakFlowCfmAt28, atLiftMm: s.peakFlowLiftMm, meanCdValve: s.meanCdValve };
}
