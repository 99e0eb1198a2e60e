import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtemp, rm, writeFile, readFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { run } from "@/lib/cli/cloud";
import { decodePreviewCloud } from "@/lib/geometry/index";

let dir = "";
function capture() {
  const out: string[] = [];
  const err: string[] = [];
  return { io: { out: (t: string) => out.push(t), err: (t: string) => err.push(t) }, out, err };
}

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "portolan-cloud-"));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe("portolan cloud", () => {
  it("generate, then analyze --json prints only JSON with the contract's fields", async () => {
    const g = capture();
    expect(await run(["generate", join(dir, "a.ply"), "--points", "60000", "--json"], g.io)).toBe(0);
    const gen = JSON.parse(g.out.join(""));
    const c = capture();
    expect(await run(["analyze", join(dir, "a.ply"), "--valve-mm", "46", "--step-mm", "2", "--units", "mm", "--json"], c.io)).toBe(0);
    expect(c.out.length).toBe(1);
    const r = JSON.parse(c.out[0]);
    expect(r.points).toBe(60000);
    expect(r.bounds.min).toHaveLength(3);
    expect(r.sections[0]).toMatchObject({ stationMm: 0 });
    for (const k of ["areaMm2", "perimeterMm", "equivalentDiameterMm"]) expect(typeof r.sections[0][k]).toBe("number");
    expect(r.sections[0].outline).toBeUndefined();
    expect(Object.keys(r.minSection)).toEqual(expect.arrayContaining(["stationMm", "areaMm2", "equivalentDiameterMm", "percentOfValve"]));
    expect(r.minSection.percentOfValve).toBeGreaterThan(80);
    expect(r.volumeCc).toBeGreaterThan(50);
    expect(Array.isArray(r.warnings)).toBe(true);
    expect(r.centerline.lengthMm).toBeCloseTo(gen.lengthMm, 0);
  });

  it("compare --json and preview", async () => {
    const g = capture();
    await run(["generate", join(dir, "b.xyz"), "--points", "60000", "--seed", "2", "--as", "xyz", "--fin"], g.io);
    await run(["generate", join(dir, "a2.ply"), "--points", "60000"], g.io);
    const c = capture();
    expect(await run(["compare", join(dir, "a2.ply"), join(dir, "b.xyz"), "--json"], c.io)).toBe(0);
    const cmp = JSON.parse(c.out[0]);
    expect(cmp.stations.length).toBeGreaterThan(20);
    expect(cmp.deviation).toMatchObject({ direction: "b-to-a" });
    expect(cmp.deviation.maxMm).toBeGreaterThan(cmp.deviation.meanMm);
    const p = capture();
    expect(await run(["preview", join(dir, "a2.ply"), join(dir, "a2.pv"), "--max-points", "5000", "--json"], p.io)).toBe(0);
    const blob = decodePreviewCloud(new Uint8Array(await readFile(join(dir, "a2.pv"))));
    expect(blob.count).toBe(JSON.parse(p.out[0]).points);
    expect(blob.count).toBeLessThanOrEqual(5000);
  });

  it("bad input: exit 1 and a one-line reason", async () => {
    await writeFile(join(dir, "bad.ply"), "ply\nformat ascii 1.0\nelement vertex 2\nproperty float x\nend_header\n1\n2\n");
    await writeFile(join(dir, "few.xyz"), "1 2 3\n4 5 6\n");
    for (const file of ["bad.ply", "few.xyz", "missing.stl"]) {
      const c = capture();
      expect(await run(["analyze", join(dir, file), "--json"], c.io)).toBe(1);
      expect(c.out).toEqual([]);
      expect(c.err.length).toBe(1);
      expect(c.err[0]).not.toContain("\n");
    }
  });

  it("usage errors: exit 2", async () => {
    for (const args of [[], ["analyze"], ["analyze", "x.ply", "--units", "ft"], ["analyze", "x.ply", "--valve-mm", "big"], ["frobnicate"], ["analyze", "x.ply", "--nope"]]) {
      expect(await run(args, capture().io)).toBe(2);
    }
  });
});
