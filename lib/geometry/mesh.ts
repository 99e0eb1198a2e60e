/**
 * Mesh checks for STL and PLY-with-faces: welding of repeated corners, whether the surface is
 * closed, and the enclosed volume by the divergence theorem, V = (1/6)·Σ v0·(v1 × v2) over
 * outward-wound triangles (signed: inward winding gives a negative volume).
 */

/**
 * Gives every distinct position one index (exact bit equality of the float32 coordinates, which
 * is how repeated STL corners are written). Open addressing over a power-of-two table.
 */
export function weldVertices(positions: Float32Array, count: number): { remap: Uint32Array; unique: number } {
  const bits = new Uint32Array(positions.buffer, positions.byteOffset, count * 3);
  let size = 1;
  while (size < count * 2) size <<= 1;
  const mask = size - 1;
  const table = new Int32Array(size).fill(-1);
  const remap = new Uint32Array(count);
  const firstOf = new Uint32Array(count);
  let unique = 0;
  for (let i = 0; i < count; i++) {
    const a = bits[3 * i];
    const b = bits[3 * i + 1];
    const c = bits[3 * i + 2];
    let h = (Math.imul(a, 0x9e3779b1) ^ Math.imul(b, 0x85ebca77) ^ Math.imul(c, 0xc2b2ae3d)) >>> 0;
    h = (h ^ (h >>> 15)) & mask;
    for (;;) {
      const slot = table[h];
      if (slot < 0) {
        table[h] = unique;
        firstOf[unique] = i;
        remap[i] = unique++;
        break;
      }
      const f = firstOf[slot];
      if (bits[3 * f] === a && bits[3 * f + 1] === b && bits[3 * f + 2] === c) {
        remap[i] = slot;
        break;
      }
      h = (h + 1) & mask;
    }
  }
  return { remap, unique };
}

export type MeshReport = {
  triangles: number;
  /** Distinct corner positions. */
  vertices: number;
  /** Every edge shared by exactly two triangles that run it in opposite directions. */
  closed: boolean;
  /** Edges used by one triangle only (holes, open ends). */
  boundaryEdges: number;
  /** Edges used by more than two triangles, or twice in the same direction (flipped faces). */
  nonManifoldEdges: number;
  degenerateTriangles: number;
  /** Divergence-theorem volume, mm³; meaningful only for a closed mesh (null otherwise). */
  signedVolumeMm3: number | null;
};

export function signedVolume(positions: Float32Array, faces: Uint32Array): number {
  // About the first corner: translation does not change a closed mesh's volume, and small
  // numbers keep the sum precise far from the origin.
  const cx = faces.length ? positions[3 * faces[0]] : 0;
  const cy = faces.length ? positions[3 * faces[0] + 1] : 0;
  const cz = faces.length ? positions[3 * faces[0] + 2] : 0;
  let six = 0;
  for (let t = 0; t < faces.length; t += 3) {
    const a = 3 * faces[t];
    const b = 3 * faces[t + 1];
    const c = 3 * faces[t + 2];
    const ax = positions[a] - cx, ay = positions[a + 1] - cy, az = positions[a + 2] - cz;
    const bx = positions[b] - cx, by = positions[b + 1] - cy, bz = positions[b + 2] - cz;
    const qx = positions[c] - cx, qy = positions[c + 1] - cy, qz = positions[c + 2] - cz;
    six += ax * (by * qz - bz * qy) + ay * (bz * qx - bx * qz) + az * (bx * qy - by * qx);
  }
  return six / 6;
}

export function meshReport(positions: Float32Array, count: number, faces: Uint32Array): MeshReport {
  const { remap, unique } = weldVertices(positions, count);
  const triangles = faces.length / 3;
  // Directed edges as (min·2²⁶ + max)·2 + direction, sorted; exact in a double below 2²⁶ vertices.
  const keys = new Float64Array(faces.length);
  let n = 0;
  let degenerate = 0;
  const SHIFT = 67_108_864; // 2²⁶
  for (let t = 0; t < faces.length; t += 3) {
    const a = remap[faces[t]];
    const b = remap[faces[t + 1]];
    const c = remap[faces[t + 2]];
    if (a === b || b === c || a === c) {
      degenerate++;
      continue;
    }
    for (const [p, q] of [
      [a, b],
      [b, c],
      [c, a],
    ]) {
      keys[n++] = p < q ? (p * SHIFT + q) * 2 : (q * SHIFT + p) * 2 + 1;
    }
  }
  const sorted = keys.subarray(0, n).sort();
  let boundary = 0;
  let nonManifold = 0;
  for (let i = 0; i < n; ) {
    const edge = Math.floor(sorted[i] / 2);
    let forward = 0;
    let backward = 0;
    let j = i;
    while (j < n && Math.floor(sorted[j] / 2) === edge) {
      if (sorted[j] % 2 === 0) forward++;
      else backward++;
      j++;
    }
    const uses = forward + backward;
    if (uses === 1) boundary++;
    else if (uses > 2 || forward !== 1) nonManifold++;
    i = j;
  }
  const closed = n > 0 && boundary === 0 && nonManifold === 0 && unique < SHIFT;
  return {
    triangles,
    vertices: unique,
    closed,
    boundaryEdges: boundary,
    nonManifoldEdges: nonManifold,
    degenerateTriangles: degenerate,
    signedVolumeMm3: closed ? signedVolume(positions, faces) : null,
  };
}
