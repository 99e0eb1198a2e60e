/**
 * Index of the first point with a NaN or infinite coordinate, or −1. Summing first is one cheap
 * pass (NaN and ±Infinity poison the sum); only a poisoned sum pays for the search.
 */
export function findNonFinite(positions: Float32Array | Float64Array, count: number): number {
  let sum = 0;
  const n = count * 3;
  for (let i = 0; i < n; i++) sum += positions[i] * 0;
  if (sum === 0) return -1;
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(positions[i])) return Math.floor(i / 3);
  }
  return -1;
}
