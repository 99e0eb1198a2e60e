import { describe, expect, it } from "vitest";
import { decodeCloudPreview, decodeToolpathPreview, magicOf } from "@/components/viewer/preview-blobs";
import { cloudPreview } from "@/lib/analysis/engines";
import { buildPreviewCloud, encodePreviewCloud } from "@/lib/geometry/preview";
import { encodePreview } from "@/lib/toolpath/preview";

const positions = Float32Array.from([1.5, -2, 3, 4, 5.25, -6, 7, 8, 9, 10, 11, 12.5]);
const station = Uint16Array.from([0, 3, 3, 7]);

describe("preview blobs as the browser reads them", () => {
  it("reads the runner's PTPC cloud (written by lib/analysis/engines.ts)", () => {
    const blob = cloudPreview(positions, 4, station);
    expect(magicOf(blob)).toBe("PTPC");
    // As fetch() hands it over: a plain ArrayBuffer.
    const p = decodeCloudPreview(blob.slice().buffer as ArrayBuffer);
    expect(p.count).toBe(4);
    expect([...p.positions]).toEqual([...positions]);
    expect([...p.stations!]).toEqual([...station]);
  });

  it("reads the geometry engine's PPV1 cloud too", () => {
    const blob = encodePreviewCloud(buildPreviewCloud({ positions, count: 4 }, station));
    const p = decodeCloudPreview(blob);
    expect([...p.positions]).toEqual([...positions]);
    expect([...p.stations!]).toEqual([...station]);
  });

  it("refuses a toolpath blob as a cloud, and a truncated cloud", () => {
    const path = encodePreview({ positions: Float32Array.from([0, 0, 0, 1, 1, 1]), flags: Uint8Array.from([0, 0]), lineNumbers: Uint32Array.from([1, 2]), toolNumbers: [4], toleranceMm: 0.01 });
    expect(() => decodeCloudPreview(path)).toThrow(/not a point-cloud/);
    const blob = cloudPreview(positions, 4, station);
    expect(() => decodeCloudPreview(blob.subarray(0, blob.length - 2))).toThrow(/shorter/);
  });

  it("reads a toolpath preview and refuses a cloud as one", () => {
    const preview = { positions: Float32Array.from([0, 0, 0, 1, 2, 3]), flags: Uint8Array.from([2, 1]), lineNumbers: Uint32Array.from([10, 12]), toolNumbers: [3], toleranceMm: 0.005 };
    const back = decodeToolpathPreview(encodePreview(preview));
    expect([...back.positions]).toEqual([...preview.positions]);
    expect([...back.lineNumbers]).toEqual([10, 12]);
    expect(back.toolNumbers).toEqual([3]);
    expect(() => decodeToolpathPreview(cloudPreview(positions, 4, station))).toThrow(/not a toolpath/);
  });
});
