/**
 * Writers for the formats we read, as generators of byte chunks (≈ 1 MiB each) so a 5 M-point
 * file is written without building it whole in memory. Pipe them to a file or collect them.
 */
const CHUNK_POINTS = 1 << 16;
const encoder = new TextEncoder();

export type MeshLike = { positions: Float32Array; count: number; faces?: Uint32Array };

export type PlyLayout = "ascii" | "binary_little_endian" | "binary_big_endian";

export function plyHeader(layout: PlyLayout, count: number, faceCount: number, comment = "invented sample port, Portolan"): string {
  let h = `ply\nformat ${layout} 1.0\ncomment ${comment}\nelement vertex ${count}\nproperty float x\nproperty float y\nproperty float z\n`;
  if (faceCount > 0) h += `element face ${faceCount}\nproperty list uchar int vertex_indices\n`;
  return `${h}end_header\n`;
}

/** Shortest text that reads back to the same float32. */
function f32(x: number): string {
  const v = Math.fround(x);
  for (let p = 6; p < 10; p++) {
    const s = v.toPrecision(p);
    if (Math.fround(Number(s)) === v) return String(Number(s));
  }
  return String(v);
}

export function* writePly(mesh: MeshLike, layout: PlyLayout = "binary_little_endian"): Generator<Uint8Array> {
  const faceCount = mesh.faces ? mesh.faces.length / 3 : 0;
  yield encoder.encode(plyHeader(layout, mesh.count, faceCount));
  const p = mesh.positions;
  if (layout === "ascii") {
    for (let s = 0; s < mesh.count; s += CHUNK_POINTS) {
      const lines: string[] = [];
      for (let i = s; i < Math.min(mesh.count, s + CHUNK_POINTS); i++) lines.push(`${f32(p[3 * i])} ${f32(p[3 * i + 1])} ${f32(p[3 * i + 2])}\n`);
      yield encoder.encode(lines.join(""));
    }
    if (mesh.faces) {
      const f = mesh.faces;
      for (let s = 0; s < faceCount; s += CHUNK_POINTS) {
        const lines: string[] = [];
        for (let i = s; i < Math.min(faceCount, s + CHUNK_POINTS); i++) lines.push(`3 ${f[3 * i]} ${f[3 * i + 1]} ${f[3 * i + 2]}\n`);
        yield encoder.encode(lines.join(""));
      }
    }
    return;
  }
  const le = layout === "binary_little_endian";
  for (let s = 0; s < mesh.count; s += CHUNK_POINTS) {
    const n = Math.min(mesh.count - s, CHUNK_POINTS);
    const out = new Uint8Array(n * 12);
    const dv = new DataView(out.buffer);
    for (let i = 0; i < n * 3; i++) dv.setFloat32(4 * i, p[3 * s + i], le);
    yield out;
  }
  if (mesh.faces) {
    const f = mesh.faces;
    for (let s = 0; s < faceCount; s += CHUNK_POINTS) {
      const n = Math.min(faceCount - s, CHUNK_POINTS);
      const out = new Uint8Array(n * 13);
      const dv = new DataView(out.buffer);
      for (let i = 0; i < n; i++) {
        dv.setUint8(13 * i, 3);
        for (let k = 0; k < 3; k++) dv.setInt32(13 * i + 1 + 4 * k, f[3 * (s + i) + k], le);
      }
      yield out;
    }
  }
}

function triangleCorners(mesh: MeshLike): { tri: number; corner: (t: number, k: number) => number } {
  if (mesh.faces) {
    const f = mesh.faces;
    return { tri: f.length / 3, corner: (t, k) => f[3 * t + k] };
  }
  return { tri: Math.floor(mesh.count / 3), corner: (t, k) => 3 * t + k };
}

function normalOf(p: Float32Array, a: number, b: number, c: number): [number, number, number] {
  const ux = p[3 * b] - p[3 * a];
  const uy = p[3 * b + 1] - p[3 * a + 1];
  const uz = p[3 * b + 2] - p[3 * a + 2];
  const vx = p[3 * c] - p[3 * a];
  const vy = p[3 * c + 1] - p[3 * a + 1];
  const vz = p[3 * c + 2] - p[3 * a + 2];
  const nx = uy * vz - uz * vy;
  const ny = uz * vx - ux * vz;
  const nz = ux * vy - uy * vx;
  const len = Math.hypot(nx, ny, nz) || 1;
  return [nx / len, ny / len, nz / len];
}

/** Binary STL: 80-byte header, uint32 count, 50 bytes per triangle (3D Systems layout). */
export function* writeStlBinary(mesh: MeshLike, header = "Portolan invented sample port"): Generator<Uint8Array> {
  const { tri, corner } = triangleCorners(mesh);
  const head = new Uint8Array(84);
  head.set(encoder.encode(header).subarray(0, 80));
  new DataView(head.buffer).setUint32(80, tri, true);
  yield head;
  const p = mesh.positions;
  for (let s = 0; s < tri; s += CHUNK_POINTS) {
    const n = Math.min(tri - s, CHUNK_POINTS);
    const out = new Uint8Array(n * 50);
    const dv = new DataView(out.buffer);
    for (let i = 0; i < n; i++) {
      const t = s + i;
      const a = corner(t, 0);
      const b = corner(t, 1);
      const c = corner(t, 2);
      const nrm = normalOf(p, a, b, c);
      const o = 50 * i;
      for (let k = 0; k < 3; k++) dv.setFloat32(o + 4 * k, nrm[k], true);
      [a, b, c].forEach((v, j) => {
        for (let k = 0; k < 3; k++) dv.setFloat32(o + 12 + 12 * j + 4 * k, p[3 * v + k], true);
      });
    }
    yield out;
  }
}

export function* writeStlAscii(mesh: MeshLike, name = "port"): Generator<Uint8Array> {
  const { tri, corner } = triangleCorners(mesh);
  const p = mesh.positions;
  yield encoder.encode(`solid ${name}\n`);
  for (let s = 0; s < tri; s += CHUNK_POINTS) {
    const parts: string[] = [];
    for (let t = s; t < Math.min(tri, s + CHUNK_POINTS); t++) {
      const v = [corner(t, 0), corner(t, 1), corner(t, 2)];
      const n = normalOf(p, v[0], v[1], v[2]);
      parts.push(`facet normal ${n.map(f32).join(" ")}\n outer loop\n`);
      for (const i of v) parts.push(`  vertex ${f32(p[3 * i])} ${f32(p[3 * i + 1])} ${f32(p[3 * i + 2])}\n`);
      parts.push(" endloop\nendfacet\n");
    }
    yield encoder.encode(parts.join(""));
  }
  yield encoder.encode(`endsolid ${name}\n`);
}

export type XyzOptions = { separator?: " " | "," | "\t"; header?: boolean; scale?: number };

/** XYZ/CSV text, one point per line. `scale` converts on the way out (1/25.4 writes inches). */
export function* writeXyz(mesh: MeshLike, options: XyzOptions = {}): Generator<Uint8Array> {
  const sep = options.separator ?? " ";
  const k = options.scale ?? 1;
  if (options.header) yield encoder.encode(`x${sep}y${sep}z\n`);
  const p = mesh.positions;
  for (let s = 0; s < mesh.count; s += CHUNK_POINTS) {
    const lines: string[] = [];
    for (let i = s; i < Math.min(mesh.count, s + CHUNK_POINTS); i++) {
      lines.push(`${f32(p[3 * i] * k)}${sep}${f32(p[3 * i + 1] * k)}${sep}${f32(p[3 * i + 2] * k)}\n`);
    }
    yield encoder.encode(lines.join(""));
  }
}

/** Joins chunks into one array (tests and small files). */
export function collectBytes(chunks: Iterable<Uint8Array>): Uint8Array {
  const parts = Array.from(chunks);
  const out = new Uint8Array(parts.reduce((n, c) => n + c.length, 0));
  let o = 0;
  for (const c of parts) {
    out.set(c, o);
    o += c.length;
  }
  return out;
}
