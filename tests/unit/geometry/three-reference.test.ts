import { describe, expect, it } from "vitest";
import { PLYLoader } from "three/examples/jsm/loaders/PLYLoader.js";
import { STLLoader } from "three/examples/jsm/loaders/STLLoader.js";
import type { BufferGeometry } from "three";
import { readPointCloud, collectBytes, writePly, writeStlAscii, writeStlBinary, intakePortShape, sampleTubeCloud, tubeMesh, cloudStats } from "@/lib/geometry/index";

/*
 * three.js's loaders are a general-purpose reference: the same bytes must give the same point
 * count and the same bounds (to float32 precision) through both readers.
 */
const shape = intakePortShape({ fin: true });
const cloud = sampleTubeCloud(shape, { points: 20_000, seed: 11 });
const mesh = tubeMesh(shape, 2, 48);

function buffer(bytes: Uint8Array): ArrayBuffer {
  return bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
}

function referenceBounds(g: BufferGeometry) {
  g.computeBoundingBox();
  const b = g.boundingBox!;
  return { count: g.getAttribute("position").count, min: [b.min.x, b.min.y, b.min.z], max: [b.max.x, b.max.y, b.max.z] };
}

async function ours(bytes: Uint8Array, format: "ply" | "stl") {
  const c = await readPointCloud(bytes, { format, sizeBytes: bytes.length });
  const s = cloudStats(c.positions, c.count);
  return { count: c.count, min: s.bounds.min, max: s.bounds.max, faces: c.faces?.length ?? 0 };
}

function same(a: { count: number; min: number[]; max: number[] }, b: { count: number; min: number[]; max: number[] }) {
  expect(a.count).toBe(b.count);
  for (let k = 0; k < 3; k++) {
    expect(a.min[k]).toBeCloseTo(b.min[k], 4);
    expect(a.max[k]).toBeCloseTo(b.max[k], 4);
  }
}

describe("same files through three.js PLYLoader / STLLoader", () => {
  it.each(["ascii", "binary_little_endian", "binary_big_endian"] as const)("PLY point cloud, %s", async (layout) => {
    const bytes = collectBytes(writePly(cloud, layout));
    same(await ours(bytes, "ply"), referenceBounds(new PLYLoader().parse(buffer(bytes))));
  });

  it("PLY mesh with faces: same vertices and triangle count", async () => {
    const bytes = collectBytes(writePly(mesh, "binary_little_endian"));
    const g = new PLYLoader().parse(buffer(bytes));
    const o = await ours(bytes, "ply");
    same(o, referenceBounds(g));
    expect(o.faces).toBe(g.getIndex()!.count);
  });

  it.each([
    ["binary", (m: typeof mesh) => writeStlBinary(m)],
    ["ascii", (m: typeof mesh) => writeStlAscii(m)],
  ] as const)("STL %s", async (_name, write) => {
    const bytes = collectBytes(write(mesh));
    same(await ours(bytes, "stl"), referenceBounds(new STLLoader().parse(buffer(bytes))));
  });
});
