import { readPointCloud, type ReadOptions } from "@/lib/geometry/index";

/** Feeds bytes to the reader in chunks of the given size, to exercise chunk boundaries. */
export async function* chunked(bytes: Uint8Array, size: number): AsyncGenerator<Uint8Array> {
  for (let i = 0; i < bytes.length; i += size) yield bytes.slice(i, i + size);
}

export function readChunked(bytes: Uint8Array, size: number, options: ReadOptions = {}) {
  return readPointCloud(chunked(bytes, size), { sizeBytes: bytes.length, ...options });
}

export const text = (s: string) => new TextEncoder().encode(s);

export function concat(...parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let o = 0;
  for (const p of parts) {
    out.set(p, o);
    o += p.length;
  }
  return out;
}

/** Unit cube [0,1]³ as 12 outward (counter-clockwise from outside) triangles. */
export function unitCube(offset: [number, number, number] = [0, 0, 0]) {
  const v = [
    [0, 0, 0], [1, 0, 0], [1, 1, 0], [0, 1, 0],
    [0, 0, 1], [1, 0, 1], [1, 1, 1], [0, 1, 1],
  ];
  const faces = [
    0, 2, 1, 0, 3, 2, // bottom z=0, normal −z
    4, 5, 6, 4, 6, 7, // top z=1
    0, 1, 5, 0, 5, 4, // y=0
    2, 3, 7, 2, 7, 6, // y=1
    1, 2, 6, 1, 6, 5, // x=1
    0, 4, 7, 0, 7, 3, // x=0
  ];
  const positions = new Float32Array(v.flatMap((p) => [p[0] + offset[0], p[1] + offset[1], p[2] + offset[2]]));
  return { positions, count: 8, faces: new Uint32Array(faces) };
}

/**
 * UV sphere as described in the domain reference §11: vertices at θi = πi/nlat, φj = 2πj/nlon,
 * fans at the poles, the other bands as quads split in two; 2·nlon·(nlat−1) triangles, outward.
 */
export function uvSphere(r: number, nlon: number, nlat: number) {
  const pos: number[] = [0, 0, r]; // north pole = 0
  for (let i = 1; i < nlat; i++) {
    const th = (Math.PI * i) / nlat;
    for (let j = 0; j < nlon; j++) {
      const ph = (2 * Math.PI * j) / nlon;
      pos.push(r * Math.sin(th) * Math.cos(ph), r * Math.sin(th) * Math.sin(ph), r * Math.cos(th));
    }
  }
  const south = pos.length / 3;
  pos.push(0, 0, -r);
  const ring = (i: number, j: number) => 1 + (i - 1) * nlon + (((j % nlon) + nlon) % nlon);
  const f: number[] = [];
  for (let j = 0; j < nlon; j++) f.push(0, ring(1, j), ring(1, j + 1));
  for (let i = 1; i < nlat - 1; i++) {
    for (let j = 0; j < nlon; j++) {
      const a = ring(i, j), b = ring(i, j + 1), c = ring(i + 1, j), d = ring(i + 1, j + 1);
      f.push(a, c, d, a, d, b);
    }
  }
  for (let j = 0; j < nlon; j++) f.push(south, ring(nlat - 1, j + 1), ring(nlat - 1, j));
  return { positions: new Float32Array(pos), count: pos.length / 3, faces: new Uint32Array(f) };
}

export function reverseWinding(faces: Uint32Array): Uint32Array {
  const out = faces.slice();
  for (let t = 0; t < out.length; t += 3) [out[t + 1], out[t + 2]] = [out[t + 2], out[t + 1]];
  return out;
}
