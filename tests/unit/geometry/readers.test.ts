import { describe, expect, it } from "vitest";
import { readPointCloud, collectBytes, writePly, writeStlBinary, writeStlAscii, writeXyz, GeometryInputError } from "@/lib/geometry/index";
import { plyHeader } from "@/lib/geometry/writers";
import { binaryStlSize } from "@/lib/geometry/readers/stl";
import { concat, readChunked, text } from "./helpers";

const tri = { positions: new Float32Array([0, 0, 0, 1, 0, 0, 0, 1, 0]), count: 3, faces: new Uint32Array([0, 1, 2]) };

async function rejects(p: Promise<unknown>, code: string, pattern: RegExp) {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(GeometryInputError);
  expect((err as GeometryInputError).code).toBe(code);
  expect((err as Error).message).toMatch(pattern);
  expect((err as Error).message).not.toContain("\n");
}

describe("PLY layout facts (domain reference §11, Turk [M])", () => {
  it("3 vertices + 1 face: header 169 bytes with LF, LE body 49 bytes, total 218; 1.0f is 00 00 80 3f", () => {
    // The reference header carries no comment line.
    const header = "ply\nformat binary_little_endian 1.0\nelement vertex 3\nproperty float x\nproperty float y\nproperty float z\nelement face 1\nproperty list uchar int vertex_indices\nend_header\n";
    expect(text(header).length).toBe(169);
    const bytes = collectBytes(writePly(tri, "binary_little_endian"));
    const ours = plyHeader("binary_little_endian", 3, 1);
    expect(bytes.length - text(ours).length).toBe(49);
    expect(text(header).length + 49).toBe(218);
    // Second vertex x = 1.0f, right after the first vertex's 12 bytes.
    const o = text(ours).length + 12;
    expect(Array.from(bytes.subarray(o, o + 4))).toEqual([0x00, 0x00, 0x80, 0x3f]);
  });

  it("reads the reference 218-byte file", async () => {
    const header = text("ply\nformat binary_little_endian 1.0\nelement vertex 3\nproperty float x\nproperty float y\nproperty float z\nelement face 1\nproperty list uchar int vertex_indices\nend_header\n");
    const body = new Uint8Array(49);
    const dv = new DataView(body.buffer);
    [0, 0, 0, 1, 0, 0, 0, 1, 0].forEach((v, i) => dv.setFloat32(4 * i, v, true));
    dv.setUint8(36, 3);
    [0, 1, 2].forEach((v, i) => dv.setInt32(37 + 4 * i, v, true));
    const file = concat(header, body);
    expect(file.length).toBe(218);
    const c = await readPointCloud(file);
    expect(c.format).toBe("ply-binary-le");
    expect(Array.from(c.positions)).toEqual([0, 0, 0, 1, 0, 0, 0, 1, 0]);
    expect(Array.from(c.faces!)).toEqual([0, 1, 2]);
  });

  it("ascii, little- and big-endian files of the same cloud read the same, in 7-byte chunks too", async () => {
    const cloud = { positions: new Float32Array(Array.from({ length: 300 }, (_, i) => Math.sin(i) * 37.25)), count: 100 };
    for (const layout of ["ascii", "binary_little_endian", "binary_big_endian"] as const) {
      const bytes = collectBytes(writePly(cloud, layout));
      const whole = await readPointCloud(bytes);
      const pieces = await readChunked(bytes, 7);
      expect(Array.from(whole.positions)).toEqual(Array.from(cloud.positions));
      expect(Array.from(pieces.positions)).toEqual(Array.from(cloud.positions));
    }
  });

  it("any scalar types, extra vertex properties skipped, polygon faces fan-split", async () => {
    const header = text(
      "ply\nformat binary_big_endian 1.0\ncomment mixed types\nobj_info test\nelement vertex 4\nproperty uchar intensity\nproperty double x\nproperty short y\nproperty float nx\nproperty int z\nproperty list uchar ushort extra\nelement face 1\nproperty list uchar uint vertex_indices\nproperty float quality\nelement edge 1\nproperty int vertex1\nproperty int vertex2\nend_header\n",
    );
    const parts: number[] = [];
    const dv = new DataView(new ArrayBuffer(1024));
    let o = 0;
    const verts = [
      [10, 5, 7],
      [-2.5, -3, 8],
      [0.125, 0, -9],
      [1e3, 300, 0],
    ];
    for (const [x, y, z] of verts) {
      dv.setUint8(o, 200); o += 1;
      dv.setFloat64(o, x); o += 8;
      dv.setInt16(o, y); o += 2;
      dv.setFloat32(o, 0.5); o += 4;
      dv.setInt32(o, z); o += 4;
      dv.setUint8(o, 2); o += 1;
      dv.setUint16(o, 1); o += 2;
      dv.setUint16(o, 2); o += 2;
    }
    dv.setUint8(o, 4); o += 1;
    for (const i of [0, 1, 2, 3]) { dv.setUint32(o, i); o += 4; }
    dv.setFloat32(o, 1); o += 4;
    dv.setInt32(o, 0); o += 4;
    dv.setInt32(o, 1); o += 4;
    parts.push(...new Uint8Array(dv.buffer, 0, o));
    const c = await readChunked(concat(header, new Uint8Array(parts)), 5);
    expect(Array.from(c.positions)).toEqual(verts.flat());
    expect(Array.from(c.faces!)).toEqual([0, 1, 2, 0, 2, 3]);
    expect(c.warnings).toEqual([]);
  });

  it("ascii faces with lists spread over lines", async () => {
    const file = text("ply\nformat ascii 1.0\nelement vertex 4\nproperty float x\nproperty float y\nproperty float z\nproperty float confidence\nelement face 2\nproperty list uchar int vertex_indices\nend_header\n0 0 0 1\n1 0 0 1\n1 1 0 1\n0 1 0 1\n3 0 1 2\n3 0\n2 3\n");
    const c = await readChunked(file, 3);
    expect(c.count).toBe(4);
    expect(Array.from(c.faces!)).toEqual([0, 1, 2, 0, 2, 3]);
  });

  it("inches become millimetres", async () => {
    const c = await readPointCloud(collectBytes(writePly(tri, "ascii")), { units: "in" });
    expect(c.positions[3]).toBeCloseTo(25.4, 5);
  });

  it("reports progress as bytes arrive", async () => {
    const bytes = collectBytes(writePly({ positions: new Float32Array(3000), count: 1000 }));
    const seen: number[] = [];
    await readChunked(bytes, 1000, { onProgress: (n) => seen.push(n) });
    expect(seen.length).toBeGreaterThan(5);
    expect(seen[seen.length - 1]).toBe(bytes.length);
    expect(seen.every((v, i) => i === 0 || v > seen[i - 1])).toBe(true);
  });
});

describe("STL layout facts (domain reference §11, 3D Systems [M])", () => {
  it("binary size is 84 + 50·N: 1 triangle 134 bytes, 12 triangles 684", () => {
    expect(binaryStlSize(1)).toBe(134);
    expect(binaryStlSize(12)).toBe(684);
    expect(collectBytes(writeStlBinary(tri)).length).toBe(134);
  });

  it("a binary STL whose header starts with 'solid' is read as binary (by size)", async () => {
    const bytes = collectBytes(writeStlBinary(tri, "solid pretending to be text"));
    expect(new TextDecoder().decode(bytes.subarray(0, 5))).toBe("solid");
    const c = await readChunked(bytes, 16, { filename: "part.stl" });
    expect(c.format).toBe("stl-binary");
    expect(Array.from(c.positions)).toEqual([0, 0, 0, 1, 0, 0, 0, 1, 0]);
  });

  it("ascii STL with a named solid, zero normals and odd spacing", async () => {
    const file = text("solid  my part 7\n  facet normal 0 0 0\n    outer loop\n      vertex 0 0 0\n      vertex 1e1 0 0\n vertex 0 -2.5E+0 0\n    endloop\n  endfacet\nendsolid my part 7\n");
    const c = await readChunked(file, 4, { filename: "x.stl" });
    expect(c.format).toBe("stl-ascii");
    expect(Array.from(c.positions)).toEqual([0, 0, 0, 10, 0, 0, 0, -2.5, 0]);
  });

  it("ascii and binary writers round-trip", async () => {
    for (const bytes of [collectBytes(writeStlAscii(tri)), collectBytes(writeStlBinary(tri))]) {
      const c = await readPointCloud(bytes, { format: "stl", sizeBytes: bytes.length });
      expect(Array.from(c.positions)).toEqual(Array.from(tri.positions));
    }
  });
});

describe("XYZ / CSV", () => {
  it("comma, space and tab separated, header naming columns in another order, comments", async () => {
    const file = text("# probe export\nZ,Y,X,intensity\n3,2,1,0.5\r\n6, 5, 4, 0.5\n\n9\t8\t7\t1\n");
    const c = await readChunked(file, 5, { format: "csv" });
    expect(Array.from(c.positions)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
  });
  it("no header, extra columns ignored, last line without newline, inches", async () => {
    const c = await readChunked(text("1 2 3 0 0 1\n4 5 6 0 0 1"), 4, { format: "xyz", units: "in" });
    expect(Array.from(c.positions).map((v) => Math.round(v * 1000) / 1000)).toEqual([25.4, 50.8, 76.2, 101.6, 127, 152.4]);
  });
  it("writer round-trip with header", async () => {
    const cloud = { positions: new Float32Array([1.5, -2.25, 3.125, 100, 200, 300]), count: 2 };
    const c = await readPointCloud(collectBytes(writeXyz(cloud, { separator: ",", header: true })), { filename: "a.csv" });
    expect(Array.from(c.positions)).toEqual(Array.from(cloud.positions));
  });
});

describe("bad input: a clear one-line error, no crash", () => {
  it("wrong PLY header", async () => {
    await rejects(readPointCloud(text("plx\nformat ascii 1.0\nend_header\n"), { format: "ply" }), "bad-header", /first line/);
    await rejects(readPointCloud(text("ply\nformat binary_middle_endian 1.0\nend_header\n")), "bad-header", /format/);
    await rejects(readPointCloud(text("ply\nformat ascii 1.0\nelement vertex 1\nproperty float32x x\nend_header\n0\n")), "bad-header", /type/);
    await rejects(readPointCloud(text("ply\nformat ascii 1.0\nelement vertex 1\nproperty float a\nend_header\n0\n")), "bad-header", /x, y and z/);
    await rejects(readPointCloud(text("ply\nformat ascii 1.0\nelement vertex 1\n")), "bad-header", /end_header/);
  });
  it("truncated binary PLY and STL", async () => {
    const ply = collectBytes(writePly({ positions: new Float32Array(300), count: 100 }));
    await rejects(readChunked(ply.subarray(0, ply.length - 5), 64), "truncated", /99 of 100 vertices/);
    const stl = collectBytes(writeStlBinary({ positions: new Float32Array(18), count: 6 }, "bin"));
    await rejects(readPointCloud(stl.subarray(0, 150), { format: "stl", sizeBytes: 150 }), "truncated", /2 triangles/);
    await rejects(readPointCloud(stl.subarray(0, 150), { format: "stl" }), "truncated", /1 of 2 triangles/);
    const withFaces = collectBytes(writePly(tri));
    await rejects(readPointCloud(withFaces.subarray(0, withFaces.length - 2)), "truncated", /face/);
  });
  it("NaN in ascii PLY, XYZ and binary data", async () => {
    await rejects(readPointCloud(text("ply\nformat ascii 1.0\nelement vertex 2\nproperty float x\nproperty float y\nproperty float z\nend_header\n0 0 0\n1 nan 0\n")), "bad-number", /line 9/);
    await rejects(readPointCloud(text("1 2 3\n4 NaN 6\n"), { format: "xyz" }), "bad-number", /line 2/);
    const bin = collectBytes(writePly({ positions: new Float32Array([0, 0, 0, Number.NaN, 0, 0]), count: 2 }));
    await rejects(readPointCloud(bin), "bad-number", /vertex 1/);
    await rejects(readPointCloud(text("1 2\n"), { format: "xyz" }), "bad-number", /at least 3 fields/);
  });
  it("face index out of range", async () => {
    await rejects(readPointCloud(text("ply\nformat ascii 1.0\nelement vertex 3\nproperty float x\nproperty float y\nproperty float z\nelement face 1\nproperty list uchar int vertex_indices\nend_header\n0 0 0\n1 0 0\n0 1 0\n3 0 1 7\n")), "bad-index", /vertex 7/);
  });
  it("empty input and unknown content", async () => {
    await rejects(readPointCloud(new Uint8Array(0)), "bad-header", /empty/);
    await rejects(readPointCloud(text("\u00e9t\u00e9 %%% ~~~")), "unknown-format", /format/);
  });
});
