/** Linear interpolation on a measured curve, never past its ends: a bench curve says nothing there. */

export type CurvePoint = { x: number; y: number };

/** y at x by straight lines between neighbours; null outside the measured range. Points may be unsorted. */
export function interpolateAt(points: readonly CurvePoint[], x: number): number | null {
  if (points.length === 0) return null;
  const sorted = [...points].sort((a, b) => a.x - b.x);
  const first = sorted[0];
  const last = sorted[sorted.length - 1];
  if (x < first.x || x > last.x) return null;
  for (let i = 0; i < sorted.length - 1; i++) {
    const a = sorted[i];
    const b = sorted[i + 1];
    if (x >= a.x && x <= b.x) {
      if (b.x === a.x) return a.y;
      return a.y + ((b.y - a.y) * (x - a.x)) / (b.x - a.x);
    }
  }
  return last.y; // single point and x equals it
}
