import { describe, expect, it } from "vitest";
import { analyzePort, buildPreviewCloud, decodePreviewCloud, encodePreviewCloud, PREVIEW_HEADER_BYTES, intakePortShape, sampleTubeCloud } from "@/lib/geometry/index";

const cloud = sampleTubeCloud(intakePortShape({ fin: true }), { points: 60_000, seed: 4 });
const analysis = analyzePort(cloud);
const report = analysis.report;
const pointStation = analysis.pointStation!;

describe("preview cloud", () => {
  it("decimates to the budget with real probe points and their stations", () => {
    const p = buildPreviewCloud(cloud, pointStation, { maxPoints: 10_000 });
    expect(p.count).toBeLessThanOrEqual(10_000);
    expect(p.count).toBeGreaterThan(5_000); // the voxel grows by 1.25×: at worst ~1/1.25² of the budget
    expect(p.voxelMm).toBeGreaterThan(0);
    const key = (x: number, y: number, z: number) => `${x},${y},${z}`;
    const index = new Map<string, number>();
    for (let i = 0; i < cloud.count; i++) index.set(key(cloud.positions[3 * i], cloud.positions[3 * i + 1], cloud.positions[3 * i + 2]), i);
    for (let k = 0; k < p.count; k += 37) {
      const i = index.get(key(p.positions[3 * k], p.positions[3 * k + 1], p.positions[3 * k + 2]));
      expect(i).toBeDefined();
      expect(p.stations![k]).toBe(pointStation[i!]);
    }
    expect(p.stationCount).toBeLessThanOrEqual(report.sections.length + 2);
  });

  it("keeps everything when under budget", () => {
    const p = buildPreviewCloud(cloud, null, { maxPoints: 500_000 });
    expect(p.count).toBe(cloud.count);
    expect(p.voxelMm).toBe(0);
    expect(p.stations).toBeNull();
  });

  it("round-trips through the documented blob layout", () => {
    const p = buildPreviewCloud(cloud, pointStation, { maxPoints: 2_000 });
    const blob = encodePreviewCloud(p);
    expect(String.fromCharCode(...blob.subarray(0, 4))).toBe("PPV1");
    const dv = new DataView(blob.buffer);
    expect(dv.getUint16(4, true)).toBe(1);
    expect(dv.getUint32(8, true)).toBe(p.count);
    expect(blob.length).toBe(Math.ceil((PREVIEW_HEADER_BYTES + 14 * p.count) / 4) * 4);
    expect(dv.getFloat32(PREVIEW_HEADER_BYTES, true)).toBe(p.positions[0]);
    // Decoding from a plain ArrayBuffer (as a browser fetch gives it).
    const d = decodePreviewCloud(blob.buffer.slice(0) as ArrayBuffer);
    expect(d.count).toBe(p.count);
    expect(Array.from(d.positions)).toEqual(Array.from(p.positions));
    expect(Array.from(d.stations!)).toEqual(Array.from(p.stations!));
    expect(d.bounds.min[0]).toBeCloseTo(p.bounds.min[0], 4);
    expect(d.sourceCount).toBe(cloud.count);
  });

  it("refuses a blob that is not one, or is cut short", () => {
    const blob = encodePreviewCloud(buildPreviewCloud(cloud, pointStation, { maxPoints: 500 }));
    const bad = blob.slice();
    bad[0] = 0x58;
    expect(() => decodePreviewCloud(bad)).toThrow(/magic/);
    expect(() => decodePreviewCloud(blob.subarray(0, blob.length - 40))).toThrow(/truncated/);
    expect(() => decodePreviewCloud(blob.subarray(0, 10))).toThrow(/header/);
  });
});
