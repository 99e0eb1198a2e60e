/**
 * The decimated preview: bounded size, a stated and honoured deviation, kinds of segment kept
 * apart, and a binary form that round-trips without Node-only APIs.
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyzeToolpathText } from "@/lib/toolpath/analyze";
import { PreviewDecimator, distanceToSegment } from "@/lib/toolpath/decimate";
import { generatePortProgram } from "@/lib/toolpath/generate";
import {
  PREVIEW_BREAK,
  PREVIEW_RAPID,
  decodePreview,
  encodePreview,
  previewToolIndex,
  type ToolpathPreview,
} from "@/lib/toolpath/preview";

/** Largest distance from any of `points` to the polyline of `preview` (brute force). */
function worstDeviation(points: number[][], preview: ToolpathPreview): number {
  const p = preview.positions;
  const n = preview.flags.length;
  let worst = 0;
  for (const [x, y, z] of points) {
    let best = Infinity;
    for (let i = 0; i < n; i++) {
      const a = i === 0 ? i : i - 1;
      const d = distanceToSegment(x, y, z, p[3 * a], p[3 * a + 1], p[3 * a + 2], p[3 * i], p[3 * i + 1], p[3 * i + 2]);
      if (d < best) best = d;
    }
    worst = Math.max(worst, best);
  }
  return worst;
}

describe("PreviewDecimator", () => {
  it("keeps a long wavy path under the vertex cap and within its stated tolerance", () => {
    const decimator = new PreviewDecimator(400);
    const points: number[][] = [];
    const p = new Float64Array(3);
    for (let i = 0; i < 20_000; i++) {
      const t = i / 200;
      p[0] = 30 * Math.cos(t);
      p[1] = 30 * Math.sin(t);
      p[2] = -i * 0.002 + 0.5 * Math.sin(7 * t);
      points.push([p[0], p[1], p[2]]);
      decimator.add(p, 0, i + 1);
    }
    const preview = decimator.finish([1]);
    expect(preview.flags.length).toBeLessThanOrEqual(400);
    expect(preview.flags.length).toBeGreaterThan(50);
    // float32 storage adds at most ~4e-6 mm at these magnitudes
    expect(worstDeviation(points, preview)).toBeLessThanOrEqual(preview.toleranceMm + 1e-4);
    expect(preview.toleranceMm).toBeLessThan(2);
  });

  it("never merges a rapid into a feed: every change of kind is a kept vertex", () => {
    const decimator = new PreviewDecimator(1000);
    const p = new Float64Array(3);
    const changes: number[] = [];
    let last = -1;
    for (let i = 0; i < 3000; i++) {
      const kind = Math.floor(i / 137) % 2 === 0 ? 0 : PREVIEW_RAPID;
      p[0] = i * 0.1;
      decimator.add(p, kind, i + 1);
      if (kind !== last && i > 0) changes.push(i); // vertex i - 1 ends the previous kind
      last = kind;
    }
    const preview = decimator.finish([]);
    const kept = new Set(Array.from(preview.lineNumbers));
    for (const i of changes) expect(kept.has(i)).toBe(true);
    expect(preview.flags.length).toBeLessThan(200); // straight runs collapse
  });

  it("holds the cap even when every point changes kind", () => {
    const decimator = new PreviewDecimator(64);
    const p = new Float64Array(3);
    for (let i = 0; i < 5000; i++) {
      p[0] = i;
      p[1] = (i % 3) * 0.5;
      decimator.add(p, i % 2 === 0 ? 0 : PREVIEW_RAPID, i + 1);
    }
    const preview = decimator.finish([]);
    expect(preview.flags.length).toBeLessThanOrEqual(64);
    expect(preview.lineNumbers[0]).toBe(1);
    expect(preview.lineNumbers[preview.flags.length - 1]).toBe(5000);
  });
});

describe("preview of an analysed program", () => {
  const text = [...generatePortProgram({ lines: 20_000, tools: 3, seed: 11 })].join("");
  const { report, preview } = analyzeToolpathText(text, { previewMaxVertices: 2000 });

  it("respects the vertex limit and names the tools its flags refer to", () => {
    expect(report.previewVertices).toBe(preview.flags.length);
    expect(preview.flags.length).toBeLessThanOrEqual(2000);
    expect(preview.toolNumbers).toEqual([1, 2, 3]);
    const indices = new Set(Array.from(preview.flags, (f) => previewToolIndex(f)));
    expect([...indices].filter((i) => i < 63).sort()).toEqual([0, 1, 2]);
  });

  it("has rapids and feeds, and starts with a break", () => {
    const flags = Array.from(preview.flags);
    expect(flags.some((f) => f & PREVIEW_RAPID)).toBe(true);
    expect(flags.some((f) => !(f & PREVIEW_RAPID))).toBe(true);
    expect(flags[0] & PREVIEW_BREAK).toBe(PREVIEW_BREAK);
  });

  it("lies inside the program's extent", () => {
    const p = preview.positions;
    for (let i = 0; i < p.length; i += 3) {
      expect(p[i]).toBeGreaterThanOrEqual(report.bounds.X!.min - 1e-3);
      expect(p[i]).toBeLessThanOrEqual(report.bounds.X!.max + 1e-3);
      expect(p[i + 2]).toBeGreaterThanOrEqual(report.bounds.Z!.min - 1e-3);
    }
  });
});

describe("binary form", () => {
  const sample: ToolpathPreview = {
    positions: Float32Array.of(1, 2, 3, -4.5, 5.25, -6, 7, 8, 9),
    flags: Uint8Array.of(PREVIEW_BREAK | PREVIEW_RAPID, 1 << 2, (2 << 2) | PREVIEW_RAPID),
    lineNumbers: Uint32Array.of(3, 10, 4_000_000_000),
    toolNumbers: [12, 5, 99],
    toleranceMm: 0.0125,
  };

  it("round-trips, with the documented size 44 + 4·T + 17·N", () => {
    const bytes = encodePreview(sample);
    expect(bytes.length).toBe(44 + 4 * 3 + 17 * 3);
    const back = decodePreview(bytes);
    expect(back.positions).toEqual(sample.positions);
    expect(back.flags).toEqual(sample.flags);
    expect(back.lineNumbers).toEqual(sample.lineNumbers);
    expect(back.toolNumbers).toEqual(sample.toolNumbers);
    expect(back.toleranceMm).toBeCloseTo(0.0125, 7);
  });

  it("decodes from an ArrayBuffer and from a view at an odd offset", () => {
    const bytes = encodePreview(sample);
    const shifted = new Uint8Array(bytes.length + 1);
    shifted.set(bytes, 1);
    expect(decodePreview(shifted.subarray(1)).lineNumbers).toEqual(sample.lineNumbers);
    expect(decodePreview(bytes.slice().buffer).positions).toEqual(sample.positions);
  });

  it("stores little-endian with the magic first", () => {
    const bytes = encodePreview(sample);
    expect(new TextDecoder().decode(bytes.subarray(0, 4))).toBe("PTVW");
    const view = new DataView(bytes.buffer, bytes.byteOffset);
    expect(view.getUint32(8, true)).toBe(3); // vertices
    expect(view.getFloat32(44 + 12, true)).toBe(1); // first x after 3 tool numbers
  });

  it("refuses damaged data", () => {
    const bytes = encodePreview(sample);
    expect(() => decodePreview(bytes.subarray(0, bytes.length - 1))).toThrow(/size/);
    const bad = bytes.slice();
    bad[0] = 0;
    expect(() => decodePreview(bad)).toThrow(/magic/);
    expect(() => decodePreview(new Uint8Array(10))).toThrow();
  });

  it("uses no Node-only API, so the browser viewer can decode it", () => {
    const source = readFileSync(new URL("../../../lib/toolpath/preview.ts", import.meta.url), "utf8")
      .replace(/\/\*[\s\S]*?\*\//g, "")
      .replace(/\/\/.*$/gm, "");
    expect(source).toMatch(/DataView/);
    expect(source).not.toMatch(/\bBuffer\b|from "node:|require\(/);
  });
});
