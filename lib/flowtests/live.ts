/**
 * Computed columns while a person is still typing: rows that are not numbers yet, and repeated
 * lifts, are left out instead of blocking the rest, and each computed point is handed back to
 * the row it came from. Pure, so the entry form runs it on every change.
 */
import { tryComputeFlowTest, type FlowPointResult, type FlowTestResult } from "@/lib/flow";
import { toFlowInput, type FlowInputSource } from "./schema";

type Loose<T> = { [K in keyof T]?: NonNullable<T[K]> extends object ? Loose<NonNullable<T[K]>> | null : T[K] | null };
/** Form values as they are mid-typing: anything may be missing or not a number yet. */
export type DraftValues = Loose<Omit<FlowInputSource, "points">> & { points?: Array<{ lift?: unknown; flow?: unknown; depression?: unknown } | null | undefined> };

export type LiveFigures = {
  result: FlowTestResult | null;
  /** The computed point of each form row, in form order; null for rows left out. */
  byRow: Array<FlowPointResult | null>;
  /** Why nothing could be computed yet (empty when `result` is there). */
  waitingFor: string[];
};

const num = (v: unknown): number | undefined => (typeof v === "number" && Number.isFinite(v) ? v : undefined);

export function liveFlowFigures(values: DraftValues): LiveFigures {
  const rows = values.points ?? [];
  const byRow: Array<FlowPointResult | null> = rows.map(() => null);
  const seen = new Set<number>();
  const usable: Array<{ index: number; lift: number; flow: number; depression?: number }> = [];
  rows.forEach((row, index) => {
    const lift = num(row?.lift);
    const flow = num(row?.flow);
    if (lift === undefined || flow === undefined || lift <= 0 || flow < 0 || seen.has(lift)) return;
    seen.add(lift);
    const depression = num(row?.depression);
    usable.push({ index, lift, flow, ...(depression !== undefined && depression > 0 ? { depression } : {}) });
  });
  if (usable.length === 0) return { result: null, byRow, waitingFor: ["Enter lift points, or import the bench's CSV."] };
  const valve = num(values.valveDiameter);
  const depression = num(values.depression);
  const waiting: string[] = [];
  if (valve === undefined || valve <= 0) waiting.push("Enter the valve diameter.");
  if (depression === undefined || depression <= 0) waiting.push("Enter the bench depression.");
  if (waiting.length) return { result: null, byRow, waitingFor: waiting };

  const air = values.ambient;
  const source = {
    valveDiameter: valve!,
    seatDiameter: num(values.seatDiameter) ?? null,
    lengthUnit: values.lengthUnit ?? "mm",
    minSectionArea: num(values.minSectionArea) ?? null,
    areaUnit: values.areaUnit ?? "mm2",
    depression: depression!,
    depressionUnit: values.depressionUnit ?? "inH2O",
    ambient:
      num(air?.temperature) !== undefined && num(air?.pressure) !== undefined
        ? {
            temperature: num(air!.temperature)!,
            temperatureUnit: air!.temperatureUnit ?? "C",
            pressure: num(air!.pressure)!,
            pressureUnit: air!.pressureUnit ?? "kPa",
            relativeHumidityPercent: num(air!.relativeHumidityPercent) ?? null,
          }
        : undefined,
    liftUnit: values.liftUnit ?? "mm",
    flowUnit: values.flowUnit ?? "cfm",
    points: usable.map(({ lift, flow, depression: d }) => (d === undefined ? { lift, flow } : { lift, flow, depression: d })),
  } satisfies FlowInputSource;
  const computed = tryComputeFlowTest(toFlowInput(source));
  if (!computed.ok) return { result: null, byRow, waitingFor: [...new Set(computed.issues.map((i) => i.message))] };
  // The math sorts by lift; the usable rows sorted the same way line up with its points.
  const order = [...usable].sort((a, b) => a.lift - b.lift);
  order.forEach((row, k) => (byRow[row.index] = computed.result.points[k]));
  return { result: computed.result, byRow, waitingFor: [] };
}
