/**
 * Side-by-side differences of two revisions' analyses: cycle time, path lengths, per-axis
 * bounds, tools, and — when both came from scans — the section-area profile along the port.
 * Pure: takes the stored JSON reports, so the page, the API and the CLI agree.
 */

type Range = { min: number; max: number };
type ToolLike = { number: number; feedMmPerMin: Range | null; spindleRpm: Range | null; feedLengthMm: number; feedTimeS: number };
/** The parts of a toolpath report the comparison reads. */
export type ToolpathReportLike = {
  lines: number;
  bounds: Partial<Record<string, Range>>;
  tools: ToolLike[];
  toolChanges: number;
  feedLengthMm: number;
  rapidLengthMm: number;
  feedTimeS: number;
  rapidTimeS: number;
  cycleTimeS: number;
  violations: unknown[];
  warningCounts?: Partial<Record<string, number>>;
};
/** The parts of a port (scan) report the comparison reads. */
export type PortReportLike = {
  sections: Array<{ stationMm: number; areaMm2: number }>;
  minSection: { stationMm: number; areaMm2: number; equivalentDiameterMm: number; percentOfValve: number | null } | null;
  volumeCc: number;
  centerline: { lengthMm: number };
};

export type RevisionAnalyses = { toolpaths: ToolpathReportLike[]; scan: PortReportLike | null };

export type Delta = { a: number | null; b: number | null; diff: number | null; percent: number | null };

export function delta(a: number | null | undefined, b: number | null | undefined): Delta {
  const x = a ?? null;
  const y = b ?? null;
  const diff = x === null || y === null ? null : y - x;
  return { a: x, b: y, diff, percent: diff === null || x === 0 || x === null ? null : (100 * diff) / Math.abs(x) };
}

export type ToolRow = { number: number; a: ToolLike | null; b: ToolLike | null; change: "added" | "removed" | "changed" | "same" };
export type AxisRow = { axis: string; a: Range | null; b: Range | null; minDiff: number | null; maxDiff: number | null };
export type SectionPoint = { stationMm: number; a: number | null; b: number | null; diff: number | null };

export type RevisionComparison = {
  toolpathFiles: { a: number; b: number };
  cycleTimeS: Delta;
  feedTimeS: Delta;
  rapidTimeS: Delta;
  feedLengthMm: Delta;
  rapidLengthMm: Delta;
  toolChanges: Delta;
  lines: Delta;
  violations: Delta;
  axes: AxisRow[];
  tools: ToolRow[];
  profile: null | {
    points: SectionPoint[];
    volumeCc: Delta;
    lengthMm: Delta;
    minAreaMm2: Delta;
    minStationMm: Delta;
    minPercentOfValve: Delta;
  };
};

/** Several toolpath files of one revision act as one program run in sequence. */
export function combineToolpaths(reports: ToolpathReportLike[]) {
  if (reports.length === 0) return null;
  const sum = (f: (r: ToolpathReportLike) => number) => reports.reduce((s, r) => s + f(r), 0);
  const bounds: Record<string, Range> = {};
  for (const r of reports) {
    for (const [axis, b] of Object.entries(r.bounds)) {
      if (!b) continue;
      const cur = bounds[axis];
      bounds[axis] = cur ? { min: Math.min(cur.min, b.min), max: Math.max(cur.max, b.max) } : { min: b.min, max: b.max };
    }
  }
  const tools = new Map<number, ToolLike>();
  for (const r of reports) {
    for (const t of r.tools) {
      const cur = tools.get(t.number);
      tools.set(t.number, cur ? { ...cur, feedLengthMm: cur.feedLengthMm + t.feedLengthMm, feedTimeS: cur.feedTimeS + t.feedTimeS, feedMmPerMin: merge(cur.feedMmPerMin, t.feedMmPerMin), spindleRpm: merge(cur.spindleRpm, t.spindleRpm) } : t);
    }
  }
  return {
    lines: sum((r) => r.lines),
    cycleTimeS: sum((r) => r.cycleTimeS),
    feedTimeS: sum((r) => r.feedTimeS),
    rapidTimeS: sum((r) => r.rapidTimeS),
    feedLengthMm: sum((r) => r.feedLengthMm),
    rapidLengthMm: sum((r) => r.rapidLengthMm),
    toolChanges: sum((r) => r.toolChanges),
    violations: sum((r) => r.violations.length),
    bounds,
    tools,
  };
}

function merge(a: Range | null, b: Range | null): Range | null {
  if (!a) return b;
  if (!b) return a;
  return { min: Math.min(a.min, b.min), max: Math.max(a.max, b.max) };
}

const sameRange = (a: Range | null, b: Range | null) => (a === null && b === null) || (!!a && !!b && a.min === b.min && a.max === b.max);

/** Linear interpolation of the area at `s` (null outside the measured stations). */
export function areaAt(sections: Array<{ stationMm: number; areaMm2: number }>, s: number): number | null {
  if (sections.length === 0 || s < sections[0].stationMm || s > sections[sections.length - 1].stationMm) return null;
  let lo = 0;
  let hi = sections.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (sections[mid].stationMm <= s) lo = mid;
    else hi = mid;
  }
  const a = sections[lo];
  const b = sections[hi];
  if (b.stationMm === a.stationMm) return a.areaMm2;
  return a.areaMm2 + ((b.areaMm2 - a.areaMm2) * (s - a.stationMm)) / (b.stationMm - a.stationMm);
}

/** Both profiles on one station grid (every `stepMm` over the union of their lengths). */
export function alignProfiles(a: PortReportLike["sections"], b: PortReportLike["sections"], stepMm = 2): SectionPoint[] {
  const sa = [...a].sort((x, y) => x.stationMm - y.stationMm);
  const sb = [...b].sort((x, y) => x.stationMm - y.stationMm);
  const start = Math.min(sa[0]?.stationMm ?? Infinity, sb[0]?.stationMm ?? Infinity);
  const end = Math.max(sa.at(-1)?.stationMm ?? -Infinity, sb.at(-1)?.stationMm ?? -Infinity);
  if (!Number.isFinite(start) || !Number.isFinite(end)) return [];
  const points: SectionPoint[] = [];
  for (let k = 0; start + k * stepMm <= end + 1e-9; k++) {
    const s = start + k * stepMm;
    const x = areaAt(sa, s);
    const y = areaAt(sb, s);
    points.push({ stationMm: s, a: x, b: y, diff: x === null || y === null ? null : y - x });
  }
  return points;
}

export function compareRevisions(a: RevisionAnalyses, b: RevisionAnalyses): RevisionComparison {
  const ca = combineToolpaths(a.toolpaths);
  const cb = combineToolpaths(b.toolpaths);
  const axes = [...new Set([...Object.keys(ca?.bounds ?? {}), ...Object.keys(cb?.bounds ?? {})])].sort((x, y) => "XYZABC".indexOf(x) - "XYZABC".indexOf(y));
  const numbers = [...new Set([...(ca?.tools.keys() ?? []), ...(cb?.tools.keys() ?? [])])].sort((x, y) => x - y);
  const tools: ToolRow[] = numbers.map((n) => {
    const ta = ca?.tools.get(n) ?? null;
    const tb = cb?.tools.get(n) ?? null;
    const change = !ta ? "added" : !tb ? "removed" : sameRange(ta.feedMmPerMin, tb.feedMmPerMin) && sameRange(ta.spindleRpm, tb.spindleRpm) && Math.abs(ta.feedLengthMm - tb.feedLengthMm) < 1e-6 ? "same" : "changed";
    return { number: n, a: ta, b: tb, change };
  });
  let profile: RevisionComparison["profile"] = null;
  if (a.scan && b.scan) {
    profile = {
      points: alignProfiles(a.scan.sections, b.scan.sections),
      volumeCc: delta(a.scan.volumeCc, b.scan.volumeCc),
      lengthMm: delta(a.scan.centerline.lengthMm, b.scan.centerline.lengthMm),
      minAreaMm2: delta(a.scan.minSection?.areaMm2, b.scan.minSection?.areaMm2),
      minStationMm: delta(a.scan.minSection?.stationMm, b.scan.minSection?.stationMm),
      minPercentOfValve: delta(a.scan.minSection?.percentOfValve, b.scan.minSection?.percentOfValve),
    };
  }
  return {
    toolpathFiles: { a: a.toolpaths.length, b: b.toolpaths.length },
    cycleTimeS: delta(ca?.cycleTimeS, cb?.cycleTimeS),
    feedTimeS: delta(ca?.feedTimeS, cb?.feedTimeS),
    rapidTimeS: delta(ca?.rapidTimeS, cb?.rapidTimeS),
    feedLengthMm: delta(ca?.feedLengthMm, cb?.feedLengthMm),
    rapidLengthMm: delta(ca?.rapidLengthMm, cb?.rapidLengthMm),
    toolChanges: delta(ca?.toolChanges, cb?.toolChanges),
    lines: delta(ca?.lines, cb?.lines),
    violations: delta(ca?.violations, cb?.violations),
    axes: axes.map((axis) => {
      const ra = ca?.bounds[axis] ?? null;
      const rb = cb?.bounds[axis] ?? null;
      return { axis, a: ra, b: rb, minDiff: ra && rb ? rb.min - ra.min : null, maxDiff: ra && rb ? rb.max - ra.max : null };
    }),
    tools,
    profile,
  };
}
