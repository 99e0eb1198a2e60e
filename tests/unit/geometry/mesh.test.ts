import { describe, expect, it } from "vitest";
import { meshReport, signedVolume, weldVertices, writeStlBinary, collectBytes, readPointCloud, tubeMesh, straightTube, circleOutline } from "@/lib/geometry/index";
import { reverseWinding, unitCube, uvSphere } from "./helpers";

describe("divergence-theorem volume (domain reference §11, Zhang & Chen 2001 [M])", () => {
  it("unit cube of 12 triangles is 1.0, also translated by (10, 20, 30)", () => {
    const c = unitCube();
    expect(signedVolume(c.positions, c.faces)).toBeCloseTo(1.0, 12); // §11: 1.0 exactly
    const t = unitCube([10, 20, 30]);
    expect(signedVolume(t.positions, t.faces)).toBeCloseTo(1.0, 9); // §11: also after translating
  });

  it("reversed winding gives −1.0 and the report says so", () => {
    const c = unitCube();
    const faces = reverseWinding(c.faces);
    expect(signedVolume(c.positions, faces)).toBeCloseTo(-1.0, 12); // §11
    const r = meshReport(c.positions, c.count, faces);
    expect(r.closed).toBe(true);
    expect(r.signedVolumeMm3).toBeCloseTo(-1.0, 12);
  });

  it("octahedron |x|+|y|+|z| ≤ 1 is 4/3", () => {
    const v = new Float32Array([1, 0, 0, -1, 0, 0, 0, 1, 0, 0, -1, 0, 0, 0, 1, 0, 0, -1]);
    // Outward triangles: for each octant (sx, sy, sz) the face through the three axis points.
    const f: number[] = [];
    for (const sx of [0, 1]) for (const sy of [2, 3]) for (const sz of [4, 5]) {
      const odd = (sx + (sy - 2) + (sz - 4)) % 2 === 1;
      f.push(...(odd ? [sx, sz, sy] : [sx, sy, sz]));
    }
    const r = meshReport(v, 6, new Uint32Array(f));
    expect(r.closed).toBe(true);
    expect(r.signedVolumeMm3).toBeCloseTo(4 / 3, 6); // §11: 4/3
  });

  // §11 table: UV sphere r = 1 at the listed resolutions.
  it.each([
    [8, 4, 3.218951],
    [16, 8, 3.926596],
    [32, 16, 4.121942],
    [64, 32, 4.171996],
    [128, 64, 4.184586],
  ])("UV sphere %i×%i has volume %f", (nlon, nlat, expected) => {
    const s = uvSphere(1, nlon, nlat);
    expect(s.faces.length / 3).toBe(2 * nlon * (nlat - 1)); // §11 triangle count
    const r = meshReport(s.positions, s.count, s.faces);
    expect(r.closed).toBe(true);
    // float32 vertices: ~1e-7 relative, so 5 decimals of the reference's 6.
    expect(r.signedVolumeMm3!).toBeCloseTo(expected, 5);
  });

  it("UV sphere r = 10 at 32×16 is 4121.9417 mm³ (§11)", () => {
    const s = uvSphere(10, 32, 16);
    expect(meshReport(s.positions, s.count, s.faces).signedVolumeMm3!).toBeCloseTo(4121.9417, 2);
  });
});

describe("closed-mesh check", () => {
  it("an open tube (a digitized port) is not closed and has no enclosed volume", () => {
    const m = tubeMesh(straightTube(20, () => circleOutline(5, 32)), 2, 32);
    const r = meshReport(m.positions, m.count, m.faces);
    expect(r.closed).toBe(false);
    expect(r.boundaryEdges).toBe(2 * 32); // the two open rims
    expect(r.signedVolumeMm3).toBeNull();
  });

  it("a cube missing one triangle has three boundary edges", () => {
    const c = unitCube();
    const r = meshReport(c.positions, c.count, c.faces.slice(3));
    expect(r.closed).toBe(false);
    expect(r.boundaryEdges).toBe(3);
  });

  it("one flipped triangle makes edges non-manifold (same direction twice)", () => {
    const c = unitCube();
    const f = c.faces.slice();
    [f[1], f[2]] = [f[2], f[1]];
    const r = meshReport(c.positions, c.count, f);
    expect(r.closed).toBe(false);
    expect(r.nonManifoldEdges).toBe(3);
  });

  it("STL corners repeated per triangle are welded back to shared vertices", async () => {
    const s = uvSphere(1, 16, 8);
    const cloud = await readPointCloud(collectBytes(writeStlBinary(s)), { format: "stl" });
    expect(cloud.count).toBe(3 * (s.faces.length / 3));
    const { unique } = weldVertices(cloud.positions, cloud.count);
    expect(unique).toBe(s.count);
    const r = meshReport(cloud.positions, cloud.count, cloud.faces!);
    expect(r.closed).toBe(true);
    expect(r.signedVolumeMm3!).toBeCloseTo(3.926596, 5); // §11 16×8
  });
});
