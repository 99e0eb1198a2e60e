import { fitCenterline, closestLength, polylineLength, polylineSampler, resamplePolyline, slicePolyline, subsample, transportFrames } from "./centerline";
import { GeometryInputError, type GeometryWarning } from "./errors";
import { meshReport, type MeshReport } from "./mesh";
import { equivalentDiameter, hydraulicDiameter, simplifyPolygon } from "./polygon";
import { sectionPass, type RawSection, type StationFrames } from "./sections";
import { cloudStats, type Bounds } from "./stats";
import type { Vec3 } from "./types";
import { distance, normalize, sub } from "./vec";

export type PortKind = "intake" | "exhaust";

export type AnalyzeOptions = {
  /** Distance between sections along the centerline, mm (default 2). */
  stepMm?: number;
  /** Valve head diameter, mm: gives the minimum section as a percentage of it. */
  valveDiameterMm?: number;
  portKind?: PortKind;
  /** Where the port starts (manifold face) and ends (valve seat); they override the found ends. */
  entry?: Vec3;
  exit?: Vec3;
  /** Use this centerline instead of fitting one (comparison of two scans along the same planes). */
  centerline?: Vec3[];
  /** Return each point's nearest station for colouring the preview (default true). */
  pointStations?: boolean;
};

export type SectionResult = {
  stationMm: number;
  areaMm2: number;
  perimeterMm: number;
  equivalentDiameterMm: number;
  hydraulicDiameterMm: number;
  /** Fraction of the outline that had probe points (the rest is interpolated). */
  coverage: number;
  /** coverage ≥ 0.9: only complete sections are considered for the minimum. */
  complete: boolean;
  pointCount: number;
  plane: { origin: Vec3; normal: Vec3; u: Vec3; v: Vec3 };
  /** Area centroid in 3D. */
  centroid: Vec3;
  /** Outline in plane coordinates: point = origin + x·u + y·v; ≤ 128 vertices, counter-clockwise. */
  outline: Array<[number, number]>;
};

export type MinSection = {
  stationMm: number;
  areaMm2: number;
  equivalentDiameterMm: number;
  /** Equivalent diameter as a percentage of the valve diameter (null without a valve). */
  percentOfValve: number | null;
  /** Area as a percentage of the valve head area. */
  percentOfValveArea: number | null;
};

export type ThroatGuideline = {
  portKind: PortKind;
  lowPercent: number;
  highPercent: number;
  basis: string;
  /** Where the minimum sits against the guideline (null without a valve). */
  verdict: "below" | "within" | "above" | null;
};

export type PortReport = {
  points: number;
  bounds: Bounds;
  centroid: Vec3;
  principalAxis: Vec3;
  stepMm: number;
  centerline: { lengthMm: number; points: Vec3[]; entry: Vec3; exit: Vec3; ends: "user" | "found" | "given-centerline" };
  sections: SectionResult[];
  minSection: MinSection | null;
  /** Integral of the section areas along the centerline, cc. */
  volumeCc: number;
  valveDiameterMm: number | null;
  guideline: ThroatGuideline;
  mesh: (MeshReport & { volumeCc: number | null }) | null;
  /** Slab half-width and angular bins used (for the record). */
  method: { slabHalfWidthMm: number; angularBins: number; fitSamplePoints: number };
  warnings: GeometryWarning[];
};

export type PortAnalysis = {
  report: PortReport;
  /** Nearest station of every point (colouring the preview), same order as the input; null when
   * `pointStations: false` was asked for. */
  pointStation: Uint16Array | null;
};

type CloudInput = { positions: Float32Array; count: number; faces?: Uint32Array; warnings?: GeometryWarning[] };

export const MIN_POINTS = 100;
const OUTLINE_MAX_VERTICES = 128;
const COMPLETE_COVERAGE = 0.9;
const KEEP_COVERAGE = 0.5;

/** Throat guideline (domain reference §9, common practice): intake 85–90 %, exhaust 85–88 %. */
export function throatGuideline(portKind: PortKind, percent: number | null): ThroatGuideline {
  const [lowPercent, highPercent] = portKind === "intake" ? [85, 90] : [85, 88];
  return {
    portKind,
    lowPercent,
    highPercent,
    basis: `common practice: ${portKind} throat ${lowPercent}–${highPercent} % of the valve head diameter; the flow bench decides`,
    verdict: percent === null ? null : percent < lowPercent ? "below" : percent > highPercent ? "above" : "within",
  };
}

function checkOptions(o: AnalyzeOptions): number {
  const step = o.stepMm ?? 2;
  if (!(step >= 0.1 && step <= 50)) throw new GeometryInputError("bad-option", `step must be between 0.1 and 50 mm (got ${o.stepMm})`);
  if (o.valveDiameterMm !== undefined && !(o.valveDiameterMm > 0 && o.valveDiameterMm < 500)) {
    throw new GeometryInputError("bad-option", `valve diameter must be a positive number of mm (got ${o.valveDiameterMm})`);
  }
  for (const [name, p] of [["entry", o.entry], ["exit", o.exit]] as const) {
    if (p && !(p.length === 3 && p.every(Number.isFinite))) throw new GeometryInputError("bad-option", `${name} must be three finite numbers`);
  }
  return step;
}

/** Cuts or extends the fitted centerline so it runs from the user's entry to the user's exit. */
function applyUserEnds(pts: Vec3[], entry: Vec3 | undefined, exit: Vec3 | undefined, warnings: GeometryWarning[]): Vec3[] {
  let line = pts;
  if (entry ? distance(entry, line[line.length - 1]) < distance(entry, line[0]) : exit ? distance(exit, line[0]) < distance(exit, line[line.length - 1]) : false) {
    line = line.slice().reverse();
  }
  const total = polylineLength(line);
  const s0 = entry ? closestLength(line, entry) : { s: 0, distance: 0 };
  const s1 = exit ? closestLength(line, exit) : { s: total, distance: 0 };
  if (s1.s - s0.s < 1) throw new GeometryInputError("bad-option", "the exit point does not lie beyond the entry point along the port");
  for (const [name, d] of [["entry", s0.distance], ["exit", s1.distance]] as const) {
    if (d > 15) warnings.push({ code: "far-end-point", message: `the ${name} point is ${d.toFixed(1)} mm from the port's centerline` });
  }
  const cut = slicePolyline(line, s0.s, s1.s);
  if (entry) cut[0] = entry;
  if (exit) cut[cut.length - 1] = exit;
  return cut;
}

function stationFrames(line: Vec3[], step: number): StationFrames {
  const { at, total } = polylineSampler(line);
  // A last station within 5 % of a step of the measured end still counts: the end itself is only
  // known to about the point spacing (≈ 0.1 mm).
  const n = Math.floor(total / step + 0.05) + 1;
  const eps = Math.min(step, 1) / 2;
  const origins: Vec3[] = [];
  const tangents: Vec3[] = [];
  for (let k = 0; k < n; k++) {
    const s = k * step;
    origins.push(at(s));
    tangents.push(normalize(sub(at(Math.min(total, s + eps)), at(Math.max(0, s - eps)))));
  }
  const { u, v } = transportFrames(tangents);
  const flat = (vs: Vec3[]) => Float64Array.from(vs.flat());
  return {
    stationMm: Float64Array.from({ length: n }, (_, k) => k * step),
    origin: flat(origins),
    normal: flat(tangents),
    u: flat(u),
    v: flat(v),
  };
}

const v3 = (a: Float64Array, j: number): Vec3 => [a[3 * j], a[3 * j + 1], a[3 * j + 2]];
const round = (x: number, d = 4) => Math.round(x * 10 ** d) / 10 ** d;

function toResult(raw: RawSection, frames: StationFrames): SectionResult {
  const j = raw.index;
  const origin = v3(frames.origin, j);
  const u = v3(frames.u, j);
  const v = v3(frames.v, j);
  const [cx, cy] = raw.centroidUV;
  const outline = simplifyPolygon(raw.outline, OUTLINE_MAX_VERTICES);
  const pairs: Array<[number, number]> = [];
  for (let i = 0; i < outline.length; i += 2) pairs.push([round(outline[i]), round(outline[i + 1])]);
  return {
    stationMm: raw.stationMm,
    areaMm2: raw.areaMm2,
    perimeterMm: raw.perimeterMm,
    equivalentDiameterMm: equivalentDiameter(raw.areaMm2),
    hydraulicDiameterMm: hydraulicDiameter(raw.areaMm2, raw.perimeterMm),
    coverage: raw.coverage,
    complete: raw.coverage >= COMPLETE_COVERAGE,
    pointCount: raw.pointCount,
    plane: { origin, normal: v3(frames.normal, j), u, v },
    centroid: [origin[0] + cx * u[0] + cy * v[0], origin[1] + cx * u[1] + cy * v[1], origin[2] + cx * u[2] + cy * v[2]],
    outline: pairs,
  };
}

/** Trapezoids between kept sections; the ends beyond the first/last kept section use its area. */
function integrateVolume(sections: SectionResult[], lengthMm: number): number {
  if (sections.length === 0) return 0;
  let v = sections[0].areaMm2 * sections[0].stationMm;
  for (let i = 1; i < sections.length; i++) {
    v += ((sections[i - 1].areaMm2 + sections[i].areaMm2) / 2) * (sections[i].stationMm - sections[i - 1].stationMm);
  }
  const last = sections[sections.length - 1];
  v += last.areaMm2 * Math.max(0, lengthMm - last.stationMm);
  return v / 1000;
}

/**
 * The cross-section profile of a digitized port: centerline, sections every step mm, the
 * smallest section against the valve, volume; for meshes also the closed-mesh volume.
 */
export function analyzePort(cloud: CloudInput, options: AnalyzeOptions = {}): PortAnalysis {
  const step = checkOptions(options);
  const { positions, count } = cloud;
  if (count < MIN_POINTS) throw new GeometryInputError("too-few-points", `only ${count} points: at least ${MIN_POINTS} are needed for a port profile`);
  const warnings: GeometryWarning[] = [...(cloud.warnings ?? [])];
  const stats = cloudStats(positions, count);
  const [s1, , s3] = stats.principalSpreadMm;
  if (!(s1 > 1e-3) || !(s3 > 1e-3 * s1)) {
    throw new GeometryInputError("not-a-tube", "the points lie on a line or a plane, not on the wall of a port");
  }

  // Centerline: given, fitted, then cut to the user's ends or oriented by the round-end rule.
  const sample = subsample(positions, count);
  let line: Vec3[];
  let ends: PortReport["centerline"]["ends"];
  let meanPerimeter = 0;
  if (options.centerline && options.centerline.length >= 2) {
    line = options.centerline;
    ends = "given-centerline";
  } else {
    const fit = fitCenterline(sample, stats);
    if (!fit.ok) throw new GeometryInputError("not-a-tube", "no section of the cloud surrounds a centerline: the points are not the wall of a port");
    meanPerimeter = fit.meanPerimeterMm;
    line = fit.points;
    if (options.entry || options.exit) {
      line = applyUserEnds(line, options.entry, options.exit, warnings);
      ends = "user";
    } else {
      ends = "found";
      // The valve end of a port is round (the seat); the manifold end usually is not.
      if (fit.circularityEnd < fit.circularityStart) line = line.slice().reverse();
      warnings.push({
        code: "ends-guessed",
        message: "no entry point given: station 0 was put at the less round end (a port's valve end is the round one); give entry/exit points to be sure",
      });
    }
  }
  line = resamplePolyline(line, Math.min(1, step));
  const lengthMm = polylineLength(line);
  if (lengthMm < 2 * step) throw new GeometryInputError("not-a-tube", `the port is only ${lengthMm.toFixed(1)} mm long: too short for sections every ${step} mm`);

  // Slab half-width: enough points per section for the angular bins, no wider than half a step.
  const frames = stationFrames(line, step);
  const spacing = meanPerimeter > 0 ? Math.sqrt((lengthMm * meanPerimeter) / count) : 0;
  const h = Math.min(step / 2, Math.max(0.2, (3000 * lengthMm) / (2 * count), 1.5 * spacing));
  const perSection = (count * 2 * h) / lengthMm;
  const bins = perSection >= 256 * 6 ? 256 : perSection >= 128 * 5 ? 128 : 64;
  const { sections: raw, pointStation } = sectionPass(positions, count, frames, { bins, halfWidthMm: h, bounds: stats.bounds, pointStations: options.pointStations ?? true });

  // A tube shows a full ring of wall in (nearly) every section; a blob or a sheet does not.
  const median = (xs: number[]) => {
    const s = xs.slice().sort((a, b) => a - b);
    return s.length ? s[Math.floor(s.length / 2)] : 0;
  };
  const coverages = raw.map((r) => r.coverage);
  if (median(coverages) < 0.6) {
    throw new GeometryInputError("not-a-tube", `the points do not surround a centerline (median outline coverage ${(median(coverages) * 100).toFixed(0)} %): not a port wall`);
  }
  const wall = median(raw.filter((r) => r.coverage >= KEEP_COVERAGE).map((r) => r.wallFraction));
  if (wall < 0.5) {
    throw new GeometryInputError("not-a-tube", `points fill the inside instead of lying on a wall (${(wall * 100).toFixed(0)} % near the wall): not a port surface`);
  }

  const kept = raw.filter((r) => r.coverage >= KEEP_COVERAGE);
  const dropped = raw.length - kept.length;
  if (dropped > 0) warnings.push({ code: "sections-dropped", message: `${dropped} of ${raw.length} sections had less than half an outline and were left out` });
  const sections = kept.map((r) => toResult(r, frames));
  const partial = sections.filter((s) => !s.complete).length;
  if (partial > 0) warnings.push({ code: "sections-partial", message: `${partial} sections have gaps in their outline (interpolated); they are not used for the minimum` });

  const complete = sections.filter((s) => s.complete);
  let minSection: MinSection | null = null;
  const valve = options.valveDiameterMm ?? null;
  if (complete.length > 0) {
    const m = complete.reduce((a, b) => (b.areaMm2 < a.areaMm2 ? b : a));
    const valveArea = valve ? (Math.PI * valve * valve) / 4 : null;
    minSection = {
      stationMm: m.stationMm,
      areaMm2: m.areaMm2,
      equivalentDiameterMm: m.equivalentDiameterMm,
      percentOfValve: valve ? (100 * m.equivalentDiameterMm) / valve : null,
      percentOfValveArea: valveArea ? (100 * m.areaMm2) / valveArea : null,
    };
  } else {
    warnings.push({ code: "no-complete-section", message: "no section has a complete outline: no minimum section" });
  }

  let mesh: PortReport["mesh"] = null;
  if (cloud.faces && cloud.faces.length >= 3) {
    const r = meshReport(positions, count, cloud.faces);
    mesh = { ...r, volumeCc: r.signedVolumeMm3 === null ? null : r.signedVolumeMm3 / 1000 };
    if (!r.closed) warnings.push({ code: "mesh-open", message: `the mesh is open (${r.boundaryEdges} boundary edges): no enclosed volume, the section integral stands` });
    else if ((r.signedVolumeMm3 ?? 0) < 0) warnings.push({ code: "mesh-inward", message: "the mesh's triangles are wound inwards (negative volume)" });
  }

  return {
    report: {
      points: count,
      bounds: stats.bounds,
      centroid: stats.centroid,
      principalAxis: stats.principalAxis,
      stepMm: step,
      centerline: {
        lengthMm,
        points: resamplePolyline(line, step).map((p) => p.map((x) => round(x)) as Vec3),
        entry: line[0],
        exit: line[line.length - 1],
        ends,
      },
      sections,
      minSection,
      volumeCc: integrateVolume(sections, lengthMm),
      valveDiameterMm: valve,
      guideline: throatGuideline(options.portKind ?? "intake", minSection?.percentOfValve ?? null),
      mesh,
      method: { slabHalfWidthMm: h, angularBins: bins, fitSamplePoints: sample.length / 3 },
      warnings,
    },
    pointStation,
  };
}
