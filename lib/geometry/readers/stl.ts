import type { ByteCursor } from "../bytes";
import { GeometryInputError, type GeometryWarning } from "../errors";
import { GrowableFloat32 } from "../growable";
import { TokenScanner } from "../textScan";
import type { PointCloud } from "../types";
import { findNonFinite } from "./finite";

/**
 * STL, binary and ASCII. Binary is decided by size (84 + 50·N bytes, the 3D Systems layout) when
 * the total size is known, because binary headers may begin with the word "solid". Positions are
 * the triangles' corners in file order (3 per triangle, shared corners repeated), as most readers
 * give them; `faces` is then simply 0,1,2,3,… so the mesh tools work on it unchanged.
 */
export const STL_HEADER_BYTES = 84;
export const STL_RECORD_BYTES = 50;

export function binaryStlSize(triangles: number): number {
  return STL_HEADER_BYTES + STL_RECORD_BYTES * triangles;
}

function startsWithSolid(b: Uint8Array, pos: number, end: number): boolean {
  let i = pos;
  while (i < end && (b[i] === 32 || b[i] === 9 || b[i] === 13 || b[i] === 10)) i++;
  const word = "solid";
  if (end - i < word.length) return false;
  for (let k = 0; k < word.length; k++) if ((b[i + k] | 32) !== word.charCodeAt(k)) return false;
  return true;
}

/** Without a known size: ASCII only if it starts with "solid" and its first bytes are plain text with a facet/endsolid keyword. */
function looksLikeAsciiStl(b: Uint8Array, pos: number, end: number): boolean {
  if (!startsWithSolid(b, pos, end)) return false;
  const n = Math.min(end - pos, 1024);
  for (let i = 0; i < n; i++) {
    const c = b[pos + i];
    if (c === 0 || c > 126 || (c < 32 && c !== 9 && c !== 10 && c !== 13)) return false;
  }
  const text = new TextDecoder("latin1").decode(b.subarray(pos, pos + n)).toLowerCase();
  return text.includes("facet") || text.includes("endsolid");
}

export async function readStl(cur: ByteCursor, scale: number, totalBytes: number | undefined): Promise<PointCloud> {
  await cur.fill(1024);
  if (cur.available === 0) throw new GeometryInputError("bad-header", "empty file");
  let binary: boolean;
  if (totalBytes !== undefined && cur.available >= STL_HEADER_BYTES) {
    const n = new DataView(cur.buf.buffer, cur.buf.byteOffset + cur.pos + 80, 4).getUint32(0, true);
    binary = binaryStlSize(n) === totalBytes;
    if (!binary && !startsWithSolid(cur.buf, cur.pos, cur.end)) {
      throw new GeometryInputError(
        "truncated",
        `STL: binary header announces ${n} triangles (${binaryStlSize(n)} bytes) but the file has ${totalBytes} bytes`,
      );
    }
  } else {
    binary = !looksLikeAsciiStl(cur.buf, cur.pos, cur.end);
  }
  return binary ? readBinaryStl(cur, scale) : readAsciiStl(cur, scale);
}

async function readBinaryStl(cur: ByteCursor, scale: number): Promise<PointCloud> {
  if (!(await cur.fill(STL_HEADER_BYTES))) {
    throw new GeometryInputError("truncated", `STL: ${cur.available} bytes is shorter than the 84-byte binary header`);
  }
  const triangles = new DataView(cur.buf.buffer, cur.buf.byteOffset + cur.pos + 80, 4).getUint32(0, true);
  cur.pos += STL_HEADER_BYTES;
  // A corrupt count would make us allocate gigabytes before noticing: cap by a sane maximum.
  if (triangles > 50_000_000) throw new GeometryInputError("bad-header", `STL: implausible triangle count ${triangles}`);
  const positions = new Float32Array(triangles * 9);
  let done = 0;
  let w = 0;
  while (done < triangles) {
    if (!(await cur.fill(STL_RECORD_BYTES))) {
      throw new GeometryInputError("truncated", `STL: the file ends after ${done} of ${triangles} triangles`);
    }
    const n = Math.min(triangles - done, Math.floor(cur.available / STL_RECORD_BYTES));
    const dv = new DataView(cur.buf.buffer, cur.buf.byteOffset + cur.pos, n * STL_RECORD_BYTES);
    for (let k = 0, o = 12; k < n; k++, o += STL_RECORD_BYTES) {
      // Skip the stored normal (bytes 0–11): it may be zero, we never trust it.
      for (let j = 0; j < 9; j++) positions[w++] = dv.getFloat32(o + 4 * j, true) * scale;
    }
    cur.pos += n * STL_RECORD_BYTES;
    done += n;
  }
  const warnings: GeometryWarning[] = [];
  const extra = await cur.drain();
  if (extra > 0) warnings.push({ code: "trailing-data", message: `STL: ${extra} bytes after the last triangle were ignored` });
  const count = triangles * 3;
  const bad = findNonFinite(positions, count);
  if (bad >= 0) throw new GeometryInputError("bad-number", `STL triangle ${Math.floor(bad / 3)} has a coordinate that is not a finite number`);
  return { positions, count, faces: sequentialFaces(count), format: "stl-binary", warnings };
}

function sequentialFaces(count: number): Uint32Array {
  const f = new Uint32Array(count);
  for (let i = 0; i < count; i++) f[i] = i;
  return f;
}

async function readAsciiStl(cur: ByteCursor, scale: number): Promise<PointCloud> {
  const sc = new TokenScanner(cur);
  const out = new GrowableFloat32(1 << 16);
  let inSolid = false;
  let sawSolid = false;
  let cornersInFacet = 0;
  const bad = (what: string) => new GeometryInputError("bad-header", `STL line ${sc.line}: ${what}`);
  while (await sc.nextAsync()) {
    if (sc.is("solid")) {
      if (inSolid) throw bad('"solid" inside a solid');
      inSolid = true;
      sawSolid = true;
      await sc.skipLine(); // the solid's name may be any text
    } else if (sc.is("endsolid")) {
      if (!inSolid) throw bad('"endsolid" without "solid"');
      inSolid = false;
      await sc.skipLine();
    } else if (sc.is("vertex")) {
      if (!inSolid) throw bad('"vertex" outside a solid');
      out.reserve(3);
      for (let j = 0; j < 3; j++) {
        if (!(await sc.nextAsync())) throw new GeometryInputError("truncated", `STL line ${sc.line}: the file ends inside a vertex`);
        const v = sc.number();
        if (v !== v) throw new GeometryInputError("bad-number", `STL line ${sc.line}: "${sc.text()}" is not a number`);
        out.data[out.length++] = v * scale;
      }
      cornersInFacet++;
    } else if (sc.is("facet")) {
      if (!inSolid) throw bad('"facet" outside a solid');
      cornersInFacet = 0;
    } else if (sc.is("endfacet")) {
      if (cornersInFacet !== 3) throw bad(`a facet has ${cornersInFacet} vertices, not 3`);
    } else if (sc.is("normal") || sc.is("outer") || sc.is("loop") || sc.is("endloop")) {
      // structure words; the normal's three numbers follow and are skipped below
    } else {
      const v = sc.number();
      if (v !== v) throw bad(`unexpected "${sc.text().slice(0, 40)}"`);
    }
  }
  if (!sawSolid) throw new GeometryInputError("bad-header", 'STL: no "solid" line');
  if (inSolid) throw new GeometryInputError("truncated", 'STL: the file ends before "endsolid"');
  const positions = out.finish();
  const count = positions.length / 3;
  if (count % 3 !== 0) throw new GeometryInputError("truncated", "STL: the last facet is incomplete");
  return { positions, count, faces: sequentialFaces(count), format: "stl-ascii", warnings: [] };
}
