/**
 * Circular and helical arc geometry in the active plane (RS274/NGC v3, NISTIR 6556 §3.5.3).
 * Coordinates are the plane's two axes (u, v), ordered so that a positive angle is
 * counter-clockwise seen from the positive end of the plane's normal axis:
 * G17 (u, v) = (X, Y), G18 (u, v) = (Z, X), G19 (u, v) = (Y, Z).
 */

export type ArcGeometry = {
  cu: number;
  cv: number;
  /** Radius at the start and at the end; they differ by at most the tolerance unless flagged. */
  startRadius: number;
  endRadius: number;
  startAngle: number;
  /** Signed sweep in radians: positive counter-clockwise (G3), negative clockwise (G2). */
  sweep: number;
  /** Length in the plane (before any helical rise). */
  planarLength: number;
};

export type ArcProblem = {
  code: "arc-radius-mismatch" | "arc-radius-too-small" | "arc-full-circle-with-r";
  detail: string;
};

export type ArcOutcome = { arc: ArcGeometry | null; problem: ArcProblem | null };

const TWO_PI = 2 * Math.PI;
/** Start and end closer than this (mm) make a full circle in the centre form. */
const SAME_POINT_MM = 1e-9;

/** Centre form: (ou, ov) is the centre's offset from the start point (I/J/K, always incremental). */
export function arcFromCentre(
  su: number, sv: number, eu: number, ev: number,
  ou: number, ov: number, clockwise: boolean, toleranceMm: number,
): ArcOutcome {
  const cu = su + ou;
  const cv = sv + ov;
  const r0 = Math.hypot(su - cu, sv - cv);
  const r1 = Math.hypot(eu - cu, ev - cv);
  const arc = sweepAround(cu, cv, su, sv, eu, ev, r0, r1, clockwise);
  const mismatch = Math.abs(r0 - r1);
  // §3.5.3.2: the start and end radii may differ by at most 0.002 mm (0.0002 in)
  const problem: ArcProblem | null =
    mismatch > toleranceMm
      ? {
          code: "arc-radius-mismatch",
          detail: `end point is ${fmt(mismatch)} mm off the arc (radius ${fmt(r0)} at the start, ${fmt(r1)} at the end)`,
        }
      : null;
  return { arc, problem };
}

/**
 * Radius form: R > 0 sweeps at most 180°, R < 0 more than 180° (§3.5.3.1).
 * A chord a hair longer than the diameter (within the tolerance) is taken as a half circle.
 */
export function arcFromRadius(
  su: number, sv: number, eu: number, ev: number,
  radius: number, clockwise: boolean, toleranceMm: number,
): ArcOutcome {
  const du = eu - su;
  const dv = ev - sv;
  const chord = Math.hypot(du, dv);
  if (chord < SAME_POINT_MM) {
    return {
      arc: null,
      problem: { code: "arc-full-circle-with-r", detail: "start and end coincide: a full circle needs the centre form (I/J/K)" },
    };
  }
  const r = Math.abs(radius);
  const half = chord / 2;
  let problem: ArcProblem | null = null;
  let h2 = r * r - half * half;
  if (h2 < 0) {
    if (half - r > toleranceMm) {
      problem = {
        code: "arc-radius-too-small",
        detail: `R ${fmt(r)} cannot reach an end point ${fmt(chord)} mm away; drawn as a half circle`,
      };
    }
    h2 = 0;
  }
  const h = Math.sqrt(h2);
  // Left normal of the chord; the centre of a short counter-clockwise arc lies on the left.
  const nu = -dv / chord;
  const nv = du / chord;
  const side = (clockwise ? -1 : 1) * (radius < 0 ? -1 : 1);
  const cu = su + du / 2 + side * h * nu;
  const cv = sv + dv / 2 + side * h * nv;
  const rs = Math.hypot(su - cu, sv - cv);
  const re = Math.hypot(eu - cu, ev - cv);
  return { arc: sweepAround(cu, cv, su, sv, eu, ev, rs, re, clockwise), problem };
}

function sweepAround(
  cu: number, cv: number, su: number, sv: number, eu: number, ev: number,
  r0: number, r1: number, clockwise: boolean,
): ArcGeometry {
  const a0 = Math.atan2(sv - cv, su - cu);
  let sweep: number;
  if (Math.hypot(eu - su, ev - sv) < SAME_POINT_MM) {
    sweep = clockwise ? -TWO_PI : TWO_PI;
  } else {
    const a1 = Math.atan2(ev - cv, eu - cu);
    sweep = a1 - a0;
    if (clockwise) {
      while (sweep >= 0) sweep -= TWO_PI;
    } else {
      while (sweep <= 0) sweep += TWO_PI;
    }
  }
  // A spiral from r0 to r1 (only when the end is off the circle) is measured at the mean radius.
  const planarLength = Math.abs(sweep) * (r0 + r1) / 2;
  return { cu, cv, startRadius: r0, endRadius: r1, startAngle: a0, sweep, planarLength };
}

/** Point at fraction t (0…1) of the arc, in plane coordinates. */
export function arcPointAt(arc: ArcGeometry, t: number): [number, number] {
  const angle = arc.startAngle + arc.sweep * t;
  const r = arc.startRadius + (arc.endRadius - arc.startRadius) * t;
  return [arc.cu + r * Math.cos(angle), arc.cv + r * Math.sin(angle)];
}

/**
 * Extent of the arc in the plane: [minU, minV, maxU, maxV], taking the quadrant points the
 * arc passes through into account (a straight bounding box of the end points would miss them).
 */
export function arcExtent(arc: ArcGeometry, su: number, sv: number, eu: number, ev: number): [number, number, number, number] {
  let minU = Math.min(su, eu);
  let maxU = Math.max(su, eu);
  let minV = Math.min(sv, ev);
  let maxV = Math.max(sv, ev);
  const r = Math.max(arc.startRadius, arc.endRadius);
  for (let q = 0; q < 4; q++) {
    const angle = (q * Math.PI) / 2;
    if (!angleInSweep(angle, arc.startAngle, arc.sweep)) continue;
    const pu = arc.cu + r * Math.cos(angle);
    const pv = arc.cv + r * Math.sin(angle);
    if (pu < minU) minU = pu;
    if (pu > maxU) maxU = pu;
    if (pv < minV) minV = pv;
    if (pv > maxV) maxV = pv;
  }
  return [minU, minV, maxU, maxV];
}

function angleInSweep(angle: number, start: number, sweep: number): boolean {
  if (Math.abs(sweep) >= TWO_PI) return true;
  // distance travelled from start to angle in the sweep's direction, in [0, 2π)
  let d = sweep >= 0 ? angle - start : start - angle;
  d = ((d % TWO_PI) + TWO_PI) % TWO_PI;
  return d <= Math.abs(sweep);
}

/** Segments needed to draw the arc within `chordToleranceMm` of the true curve. */
export function arcSegments(arc: ArcGeometry, chordToleranceMm: number, maxSegments: number): number {
  const r = Math.max(arc.startRadius, arc.endRadius);
  if (r <= chordToleranceMm) return 1;
  const step = 2 * Math.acos(1 - chordToleranceMm / r);
  return Math.max(1, Math.min(maxSegments, Math.ceil(Math.abs(arc.sweep) / step)));
}

function fmt(v: number): string {
  return Number(v.toFixed(4)).toString();
}
