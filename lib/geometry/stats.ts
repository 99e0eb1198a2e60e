import type { Vec3 } from "./types";
import { symmetricEigen3 } from "./vec";

export type Bounds = { min: Vec3; max: Vec3 };

export type CloudStats = {
  count: number;
  bounds: Bounds;
  centroid: Vec3;
  /** Unit direction of greatest spread (first principal component). */
  principalAxis: Vec3;
  /** Spread along the three principal directions (standard deviations, mm), largest first. */
  principalSpreadMm: Vec3;
};

/** Bounds, centroid and principal axes in one pass (sums in doubles, about the first point to keep precision). */
export function cloudStats(positions: Float32Array, count: number): CloudStats {
  const min: Vec3 = [Infinity, Infinity, Infinity];
  const max: Vec3 = [-Infinity, -Infinity, -Infinity];
  if (count === 0) {
    return { count, bounds: { min: [0, 0, 0], max: [0, 0, 0] }, centroid: [0, 0, 0], principalAxis: [1, 0, 0], principalSpreadMm: [0, 0, 0] };
  }
  const ox = positions[0];
  const oy = positions[1];
  const oz = positions[2];
  let sx = 0, sy = 0, sz = 0, sxx = 0, syy = 0, szz = 0, sxy = 0, sxz = 0, syz = 0;
  let minx = Infinity, miny = Infinity, minz = Infinity, maxx = -Infinity, maxy = -Infinity, maxz = -Infinity;
  for (let i = 0, o = 0; i < count; i++, o += 3) {
    const X = positions[o];
    const Y = positions[o + 1];
    const Z = positions[o + 2];
    if (X < minx) minx = X;
    if (X > maxx) maxx = X;
    if (Y < miny) miny = Y;
    if (Y > maxy) maxy = Y;
    if (Z < minz) minz = Z;
    if (Z > maxz) maxz = Z;
    const x = X - ox;
    const y = Y - oy;
    const z = Z - oz;
    sx += x;
    sy += y;
    sz += z;
    sxx += x * x;
    syy += y * y;
    szz += z * z;
    sxy += x * y;
    sxz += x * z;
    syz += y * z;
  }
  min[0] = minx; min[1] = miny; min[2] = minz;
  max[0] = maxx; max[1] = maxy; max[2] = maxz;
  const mx = sx / count;
  const my = sy / count;
  const mz = sz / count;
  const cov = [
    [sxx / count - mx * mx, sxy / count - mx * my, sxz / count - mx * mz],
    [sxy / count - mx * my, syy / count - my * my, syz / count - my * mz],
    [sxz / count - mx * mz, syz / count - my * mz, szz / count - mz * mz],
  ];
  const { values, vectors } = symmetricEigen3(cov);
  return {
    count,
    bounds: { min, max },
    centroid: [mx + ox, my + oy, mz + oz],
    principalAxis: vectors[0],
    principalSpreadMm: values.map((v) => Math.sqrt(Math.max(v, 0))) as Vec3,
  };
}
