import ndarray from "ndarray";
import createKDTree from "static-kdtree";
import { analyzePort, type AnalyzeOptions, type MinSection, type PortReport } from "./analyze";
import type { GeometryWarning } from "./errors";
import type { Vec3 } from "./types";

/**
 * Two scans of the same port, both in the fixture plate's frame (no registration: a shift between
 * them is exactly what a machinist wants to see). Sections of the second scan are cut on the first
 * scan's centerline, so station n of both is the same plane. Point deviation is the distance from
 * each point of the second scan to the nearest point of the first (static-kdtree), so it includes
 * the first scan's point spacing: a perfect re-scan shows about half its spacing, not zero.
 */
export type CompareOptions = Omit<AnalyzeOptions, "centerline"> & {
  /** Points of the second scan queried for deviation (evenly spaced), default 200 000. */
  maxQueryPoints?: number;
  /** Points of the first scan put in the k-d tree, default 2 000 000. */
  maxReferencePoints?: number;
};

export type StationDifference = {
  stationMm: number;
  areaAMm2: number;
  areaBMm2: number;
  /** B − A. */
  differenceMm2: number;
  differencePercent: number;
};

export type DeviationStats = {
  direction: "b-to-a";
  queriedPoints: number;
  referencePoints: number;
  maxMm: number;
  meanMm: number;
  rmsMm: number;
  p95Mm: number;
};

export type ScanSummary = { points: number; volumeCc: number; minSection: MinSection | null; lengthMm: number };

export type ScanComparison = {
  stepMm: number;
  a: ScanSummary;
  b: ScanSummary;
  stations: StationDifference[];
  /** Largest |difference| among the stations. */
  largestChange: StationDifference | null;
  volumeDifferenceCc: number;
  deviation: DeviationStats;
  warnings: GeometryWarning[];
};

type CloudInput = { positions: Float32Array; count: number; faces?: Uint32Array; warnings?: GeometryWarning[] };

function summary(r: PortReport): ScanSummary {
  return { points: r.points, volumeCc: r.volumeCc, minSection: r.minSection, lengthMm: r.centerline.lengthMm };
}

/** Every k-th point so that at most `limit` remain, as a new Float32Array. */
function evenSample(positions: Float32Array, count: number, limit: number): { data: Float32Array; n: number } {
  if (count <= limit) return { data: positions.subarray(0, count * 3), n: count };
  const stride = count / limit;
  const data = new Float32Array(limit * 3);
  for (let k = 0; k < limit; k++) {
    const i = Math.floor(k * stride);
    data[3 * k] = positions[3 * i];
    data[3 * k + 1] = positions[3 * i + 1];
    data[3 * k + 2] = positions[3 * i + 2];
  }
  return { data, n: limit };
}

export function pointDeviation(a: CloudInput, b: CloudInput, maxQuery = 200_000, maxReference = 2_000_000): DeviationStats {
  const ref = evenSample(a.positions, a.count, maxReference);
  const tree = createKDTree(ndarray(ref.data, [ref.n, 3]));
  const q = evenSample(b.positions, b.count, maxQuery);
  const d = new Float64Array(q.n);
  const p: [number, number, number] = [0, 0, 0];
  let sum = 0;
  let sum2 = 0;
  let max = 0;
  for (let k = 0; k < q.n; k++) {
    p[0] = q.data[3 * k];
    p[1] = q.data[3 * k + 1];
    p[2] = q.data[3 * k + 2];
    const i = tree.nn(p);
    const dist = Math.hypot(p[0] - ref.data[3 * i], p[1] - ref.data[3 * i + 1], p[2] - ref.data[3 * i + 2]);
    d[k] = dist;
    sum += dist;
    sum2 += dist * dist;
    if (dist > max) max = dist;
  }
  tree.dispose();
  d.sort();
  // 95th percentile, nearest-rank definition.
  const p95 = q.n ? d[Math.min(q.n - 1, Math.ceil(0.95 * q.n) - 1)] : 0;
  return {
    direction: "b-to-a",
    queriedPoints: q.n,
    referencePoints: ref.n,
    maxMm: max,
    meanMm: q.n ? sum / q.n : 0,
    rmsMm: q.n ? Math.sqrt(sum2 / q.n) : 0,
    p95Mm: p95,
  };
}

export function compareScans(a: CloudInput, b: CloudInput, options: CompareOptions = {}): ScanComparison {
  const ra = analyzePort(a, { ...options, pointStations: false }).report;
  const centerline: Vec3[] = ra.centerline.points;
  const rb = analyzePort(b, { ...options, entry: undefined, exit: undefined, centerline, pointStations: false }).report;
  const byStation = new Map(rb.sections.map((s) => [s.stationMm.toFixed(6), s]));
  const stations: StationDifference[] = [];
  for (const sa of ra.sections) {
    const sb = byStation.get(sa.stationMm.toFixed(6));
    if (!sb || !sa.complete || !sb.complete) continue;
    const diff = sb.areaMm2 - sa.areaMm2;
    stations.push({ stationMm: sa.stationMm, areaAMm2: sa.areaMm2, areaBMm2: sb.areaMm2, differenceMm2: diff, differencePercent: (100 * diff) / sa.areaMm2 });
  }
  const largestChange = stations.length ? stations.reduce((x, y) => (Math.abs(y.differenceMm2) > Math.abs(x.differenceMm2) ? y : x)) : null;
  const warnings = [
    ...ra.warnings.map((w) => ({ code: w.code, message: `A: ${w.message}` })),
    ...rb.warnings.filter((w) => w.code !== "ends-guessed").map((w) => ({ code: w.code, message: `B: ${w.message}` })),
  ];
  return {
    stepMm: ra.stepMm,
    a: summary(ra),
    b: summary(rb),
    stations,
    largestChange,
    volumeDifferenceCc: rb.volumeCc - ra.volumeCc,
    deviation: pointDeviation(a, b, options.maxQueryPoints, options.maxReferencePoints),
    warnings,
  };
}
