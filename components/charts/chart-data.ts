/**
 * Data shaping for the charts: series merged on one station axis, the valve reference areas, the
 * per-station difference of two profiles. Pure, so the numbers under every chart are tested.
 */
import { alignProfiles, type SectionPoint } from "@/lib/programs/compare";

export type AreaPoint = { stationMm: number; areaMm2: number };
export type AreaSeries = { label: string; sections: AreaPoint[]; min?: AreaPoint | null };

/** Stations are compared to the micrometre: float noise must not split one station in two. */
const key = (s: number) => Math.round(s * 1000) / 1000;

/** One row per station holding every series' area under `s0`, `s1`, … (null where it has none). */
export function mergeOnStations(series: AreaSeries[]): Array<Record<string, number | null>> {
  const stations = [...new Set(series.flatMap((s) => s.sections.map((p) => key(p.stationMm))))].sort((a, b) => a - b);
  const lookups = series.map((s) => new Map(s.sections.map((p) => [key(p.stationMm), p.areaMm2])));
  return stations.map((st) => {
    const row: Record<string, number | null> = { stationMm: st };
    lookups.forEach((m, i) => (row[`s${i}`] = m.get(st) ?? null));
    return row;
  });
}

export type ReferenceArea = { label: string; areaMm2: number; kind: "valve" | "guideline" };

/**
 * Horizontal reference lines: the valve head area π·d²/4 and, when the analysis gives its throat
 * guideline (common practice: intake 85–90 %, exhaust 85–88 % of the valve diameter), the areas of
 * those diameters, i.e. (p/100)² of the valve area.
 */
export function valveReferenceAreas(valveDiameterMm: number | null | undefined, guideline?: { lowPercent: number; highPercent: number } | null): ReferenceArea[] {
  if (!valveDiameterMm || !(valveDiameterMm > 0)) return [];
  const valve = (Math.PI * valveDiameterMm * valveDiameterMm) / 4;
  const out: ReferenceArea[] = [{ label: `Valve head ${valveDiameterMm.toFixed(1)} mm`, areaMm2: valve, kind: "valve" }];
  if (guideline) {
    for (const p of [guideline.highPercent, guideline.lowPercent]) out.push({ label: `${p} % throat`, areaMm2: valve * (p / 100) ** 2, kind: "guideline" });
  }
  return out;
}

export type DifferencePoint = SectionPoint & { percent: number | null };

/** B − A per station on a common grid (every `stepMm`), with the change in percent of A. */
export function profileDifference(a: AreaPoint[], b: AreaPoint[], stepMm = 2): DifferencePoint[] {
  return alignProfiles(a, b, stepMm).map((p) => ({ ...p, percent: p.diff !== null && p.a ? (100 * p.diff) / p.a : null }));
}

/** The stations where B gained and lost the most area (null when nothing is comparable). */
export function extremes(points: DifferencePoint[]): { gain: DifferencePoint | null; loss: DifferencePoint | null } {
  let gain: DifferencePoint | null = null;
  let loss: DifferencePoint | null = null;
  for (const p of points) {
    if (p.diff === null) continue;
    if (p.diff > 0 && (!gain || p.diff > gain.diff!)) gain = p;
    if (p.diff < 0 && (!loss || p.diff < loss.diff!)) loss = p;
  }
  return { gain, loss };
}

/** Round axis maximum (1, 2, 2.5, 5 × 10ⁿ steps) at or above `max`, for readable ticks. */
export function niceMax(max: number): number {
  if (!(max > 0) || !Number.isFinite(max)) return 1;
  const p = 10 ** Math.floor(Math.log10(max));
  for (const m of [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10]) if (m * p >= max) return m * p;
  return 10 * p;
}
