/**
 * Comparing flow tests at matched lifts. Two tests rarely share every lift point, so both curves
 * are interpolated linearly at the union of their lifts inside the range both cover. Comparisons
 * use the corrected figure (28 inH₂O, standard air), so tests from different depressions line up.
 */
import { interpolateAt } from "./interpolate";
import { RATIO_GUIDELINE } from "./labels";

/** What a comparison needs of a test; a FlowTestResult fits. */
export type ComparableTest = { points: ReadonlyArray<{ liftMm: number; flowCfmAt28: number }> };

export type MatchedLift = { liftMm: number; baseCfmAt28: number; otherCfmAt28: number };

/** Lifts at which two tests can be compared without extrapolating (rounded to 1 µm to merge equal lifts). */
export function matchedLifts(a: ComparableTest, b: ComparableTest): number[] {
  if (a.points.length === 0 || b.points.length === 0) return [];
  const range = (t: ComparableTest) => {
    const lifts = t.points.map((p) => p.liftMm);
    return [Math.min(...lifts), Math.max(...lifts)] as const;
  };
  const [aMin, aMax] = range(a);
  const [bMin, bMax] = range(b);
  const low = Math.max(aMin, bMin);
  const high = Math.min(aMax, bMax);
  if (low > high) return [];
  const lifts = new Set<number>();
  for (const p of [...a.points, ...b.points]) {
    const rounded = Math.round(p.liftMm * 1000) / 1000;
    if (rounded >= low - 5e-4 && rounded <= high + 5e-4) lifts.add(Math.min(high, Math.max(low, rounded)));
  }
  return [...lifts].sort((x, y) => x - y);
}

function matched(base: ComparableTest, other: ComparableTest): MatchedLift[] {
  const curve = (t: ComparableTest) => t.points.map((p) => ({ x: p.liftMm, y: p.flowCfmAt28 }));
  const baseCurve = curve(base);
  const otherCurve = curve(other);
  return matchedLifts(base, other).map((liftMm) => ({
    liftMm,
    // Both are non-null: matchedLifts keeps only lifts inside both ranges.
    baseCfmAt28: interpolateAt(baseCurve, liftMm) as number,
    otherCfmAt28: interpolateAt(otherCurve, liftMm) as number,
  }));
}

export type GainRow = {
  liftMm: number;
  baselineCfmAt28: number;
  candidateCfmAt28: number;
  gainCfm: number;
  /** (candidate − baseline) / baseline × 100; null where the baseline flows nothing. */
  gainPercent: number | null;
};

export type FlowComparison = {
  rows: GainRow[];
  /** Lift range both tests cover, mm; null when they do not overlap. */
  overlapMm: [number, number] | null;
  meanGainPercent: number | null;
  /** Gain at the highest lift both tests reach. */
  gainAtTopLiftPercent: number | null;
  peakFlowGainPercent: number | null;
};

/** Gain of a candidate test against a chosen baseline, lift by lift. */
export function compareFlowTests(baseline: ComparableTest, candidate: ComparableTest): FlowComparison {
  const rows: GainRow[] = matched(baseline, candidate).map((m) => ({
    liftMm: m.liftMm,
    baselineCfmAt28: m.baseCfmAt28,
    candidateCfmAt28: m.otherCfmAt28,
    gainCfm: m.otherCfmAt28 - m.baseCfmAt28,
    gainPercent: m.baseCfmAt28 > 0 ? ((m.otherCfmAt28 - m.baseCfmAt28) / m.baseCfmAt28) * 100 : null,
  }));
  const gains = rows.map((r) => r.gainPercent).filter((g): g is number => g !== null);
  const peak = (t: ComparableTest) => Math.max(...t.points.map((p) => p.flowCfmAt28));
  const basePeak = baseline.points.length ? peak(baseline) : 0;
  return {
    rows,
    overlapMm: rows.length ? [rows[0].liftMm, rows[rows.length - 1].liftMm] : null,
    meanGainPercent: gains.length ? gains.reduce((s, g) => s + g, 0) / gains.length : null,
    gainAtTopLiftPercent: rows.length ? rows[rows.length - 1].gainPercent : null,
    peakFlowGainPercent: basePeak > 0 && candidate.points.length ? ((peak(candidate) - basePeak) / basePeak) * 100 : null,
  };
}

export type RatioRow = { liftMm: number; intakeCfmAt28: number; exhaustCfmAt28: number; ratio: number | null };

export type PortRatio = {
  rows: RatioRow[];
  meanRatio: number | null;
  /** Ratio at the highest lift both tests reach. */
  ratioAtTopLift: number | null;
  guideline: typeof RATIO_GUIDELINE;
  /** Whether the mean ratio sits inside the common-practice band; null without a ratio. */
  withinGuideline: boolean | null;
};

/** Exhaust flow over intake flow at equal lift (mm), both corrected to 28 inH₂O. */
export function exhaustIntakeRatio(exhaust: ComparableTest, intake: ComparableTest): PortRatio {
  const rows: RatioRow[] = matched(intake, exhaust).map((m) => ({
    liftMm: m.liftMm,
    intakeCfmAt28: m.baseCfmAt28,
    exhaustCfmAt28: m.otherCfmAt28,
    ratio: m.baseCfmAt28 > 0 ? m.otherCfmAt28 / m.baseCfmAt28 : null,
  }));
  const ratios = rows.map((r) => r.ratio).filter((r): r is number => r !== null);
  const meanRatio = ratios.length ? ratios.reduce((s, r) => s + r, 0) / ratios.length : null;
  return {
    rows,
    meanRatio,
    ratioAtTopLift: rows.length ? rows[rows.length - 1].ratio : null,
    guideline: RATIO_GUIDELINE,
    withinGuideline: meanRatio === null ? null : meanRatio >= RATIO_GUIDELINE.low && meanRatio <= RATIO_GUIDELINE.high,
  };
}
