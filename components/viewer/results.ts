/** Small readings of a stored geometry result that several views need. */
import type { Vec3 } from "./camera";
import type { GeometryResultLite } from "./types";

/** The throat guideline percentages the analysis used, when it recorded them. */
export function guidelineOf(result: GeometryResultLite): { lowPercent: number; highPercent: number } | null {
  const g = result.guideline;
  return g && g.lowPercent != null && g.highPercent != null ? { lowPercent: g.lowPercent, highPercent: g.highPercent } : null;
}

/** Unit direction from the centerline's entry to its valve end (null for a degenerate line). */
export function portAxisOf(result: GeometryResultLite): Vec3 | null {
  const pts = result.centerline.points;
  if (pts.length < 2) return null;
  const a = pts[0];
  const b = pts[pts.length - 1];
  const d: Vec3 = [b[0] - a[0], b[1] - a[1], b[2] - a[2]];
  const l = Math.hypot(...d);
  return l > 0 ? [d[0] / l, d[1] / l, d[2] / l] : null;
}
