/**
 * The section slider's arithmetic: which section a station means, where the smallest one is, the
 * 2D outline as an SVG path and the same outline placed in 3D on its plane.
 * Works on the geometry analysis' stored JSON (the parts typed below), never on the raw cloud.
 */

export type Vec3 = [number, number, number];

export type SectionLike = {
  stationMm: number;
  areaMm2: number;
  equivalentDiameterMm: number;
  perimeterMm?: number;
  coverage?: number;
  complete?: boolean;
  plane: { origin: Vec3; normal: Vec3; u: Vec3; v: Vec3 };
  centroid?: Vec3;
  /** Outline in plane coordinates (point = origin + x·u + y·v), counter-clockwise. */
  outline: Array<[number, number]>;
};

export type MinSectionLike = { stationMm: number; areaMm2: number; equivalentDiameterMm: number; percentOfValve: number | null };

/** Index of the section whose station is nearest `stationMm` (−1 when there are none). */
export function nearestSectionIndex(sections: ReadonlyArray<{ stationMm: number }>, stationMm: number): number {
  let best = -1;
  let bestDist = Infinity;
  for (let i = 0; i < sections.length; i++) {
    const d = Math.abs(sections[i].stationMm - stationMm);
    if (d < bestDist) {
      best = i;
      bestDist = d;
    }
  }
  return best;
}

/** The slider position of the analysis' minimum section (−1 without one). */
export function minSectionIndex(sections: ReadonlyArray<{ stationMm: number }>, min: { stationMm: number } | null | undefined): number {
  return min ? nearestSectionIndex(sections, min.stationMm) : -1;
}

/** Equivalent (same-area circle) diameter as a percentage of the valve head diameter. */
export function percentOfValve(equivalentDiameterMm: number, valveDiameterMm: number | null | undefined): number | null {
  return valveDiameterMm && valveDiameterMm > 0 ? (100 * equivalentDiameterMm) / valveDiameterMm : null;
}

/**
 * Half-size of a square, centred on the centerline, that holds every outline: one scale for the
 * whole slider, so a section that narrows looks narrower.
 */
export function outlineExtent(sections: ReadonlyArray<{ outline: Array<[number, number]> }>): number {
  let r = 0;
  for (const s of sections) for (const [x, y] of s.outline) r = Math.max(r, Math.abs(x), Math.abs(y));
  return r > 0 ? r : 1;
}

/**
 * SVG path of an outline in plane millimetres with y flipped (SVG's y runs down), closed.
 * Use with viewBox `svgViewBox(extent)`.
 */
export function outlinePath(outline: ReadonlyArray<[number, number]>, digits = 2): string {
  if (outline.length === 0) return "";
  const f = (n: number) => {
    const s = n.toFixed(digits);
    return s === `-${(0).toFixed(digits)}` ? (0).toFixed(digits) : s;
  };
  return outline.map(([x, y], i) => `${i === 0 ? "M" : "L"}${f(x)} ${f(-y)}`).join(" ") + " Z";
}

export function svgViewBox(extent: number, margin = 1.1): string {
  const r = extent * margin;
  return `${-r} ${-r} ${2 * r} ${2 * r}`;
}

/** A round scale-bar length (1, 2, 5 × 10ⁿ mm) near a quarter of the view's width. */
export function scaleBarMm(extent: number): number {
  const target = extent / 2;
  const p = 10 ** Math.floor(Math.log10(target));
  for (const m of [5, 2, 1]) if (m * p <= target) return m * p;
  return p;
}

/** The outline's points on the section plane in 3D, as xyz triples. */
export function outlineIn3d(section: Pick<SectionLike, "plane" | "outline">): Float32Array {
  const { origin: o, u, v } = section.plane;
  const out = new Float32Array(section.outline.length * 3);
  section.outline.forEach(([x, y], i) => {
    for (let k = 0; k < 3; k++) out[3 * i + k] = o[k] + x * u[k] + y * v[k];
  });
  return out;
}

/** A point of the centerline polyline nearest to `p` (its index), for signing deviations. */
export function nearestIndex(points: ReadonlyArray<Vec3>, p: Vec3): number {
  let best = 0;
  let bestD = Infinity;
  for (let i = 0; i < points.length; i++) {
    const d = (points[i][0] - p[0]) ** 2 + (points[i][1] - p[1]) ** 2 + (points[i][2] - p[2]) ** 2;
    if (d < bestD) {
      bestD = d;
      best = i;
    }
  }
  return best;
}

/** Station index of a section in the preview's per-point stations (station k sits k·step from the entry). */
export function stationIndexOf(stationMm: number, stepMm: number): number {
  return stepMm > 0 ? Math.round(stationMm / stepMm) : 0;
}

/** The preview points whose nearest station is `k`, as xyz triples (the slice the slider is on). */
export function pointsAtStation(positions: Float32Array, stations: Uint16Array | null, k: number): Float32Array {
  if (!stations) return new Float32Array(0);
  let n = 0;
  for (let i = 0; i < stations.length; i++) if (stations[i] === k) n++;
  const out = new Float32Array(3 * n);
  let o = 0;
  for (let i = 0; i < stations.length; i++) {
    if (stations[i] !== k) continue;
    out[o++] = positions[3 * i];
    out[o++] = positions[3 * i + 1];
    out[o++] = positions[3 * i + 2];
  }
  return out;
}
