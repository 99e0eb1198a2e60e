/**
 * Outlines from angular bins. A section's wall points are binned by their angle around a centre
 * in the section plane; one radius per bin gives a star-shaped polygon with a vertex at each
 * bin's middle angle. Bin k covers angles [−π + k·2π/K, −π + (k+1)·2π/K).
 */
export function binOf(x: number, y: number, bins: number): number {
  const k = Math.floor(((Math.atan2(y, x) + Math.PI) / (2 * Math.PI)) * bins);
  return k >= bins ? bins - 1 : k < 0 ? 0 : k;
}

/**
 * Fills empty bins (NaN) by linear interpolation between the nearest filled bins on either side,
 * going round the circle. Returns the fraction of bins that had points (the coverage).
 */
export function fillEmptyBins(radii: Float64Array): number {
  const n = radii.length;
  const filled: number[] = [];
  for (let k = 0; k < n; k++) if (radii[k] === radii[k]) filled.push(k);
  if (filled.length === 0 || filled.length === n) return filled.length / n;
  for (let f = 0; f < filled.length; f++) {
    const a = filled[f];
    const b = filled[(f + 1) % filled.length];
    const gap = (b - a + n) % n || n; // a single filled bin spans the whole circle
    for (let d = 1; d < gap; d++) radii[(a + d) % n] = radii[a] + ((radii[b] - radii[a]) * d) / gap;
  }
  return filled.length / n;
}

/** Polygon (flat xy, counter-clockwise) with one vertex per bin at its middle angle. */
export function outlineFromBins(radii: Float64Array): number[] {
  const n = radii.length;
  const out: number[] = new Array(2 * n);
  for (let k = 0; k < n; k++) {
    const a = -Math.PI + ((k + 0.5) * 2 * Math.PI) / n;
    out[2 * k] = radii[k] * Math.cos(a);
    out[2 * k + 1] = radii[k] * Math.sin(a);
  }
  return out;
}
