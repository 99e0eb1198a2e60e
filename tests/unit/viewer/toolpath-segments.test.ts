import { describe, expect, it } from "vitest";
import { clampVertex, coarseSegments, dashedSegments, groupSegments, playStep, scrubFraction, segmentIndex, segmentsUpTo, vertexAtLine } from "@/components/viewer/toolpath-segments";
import { analyzeToolpathText, generatePortProgram, PREVIEW_BREAK, PREVIEW_RAPID, PREVIEW_TOOL_SHIFT } from "@/lib/toolpath";

const R = PREVIEW_RAPID;
const B = PREVIEW_BREAK;
const T = (i: number) => i << PREVIEW_TOOL_SHIFT;

describe("toolpath preview cut into groups per tool and kind", () => {
  // Vertex 0 starts the path; vertex 3 is a break (no segment 2→3); tool 1 takes over at vertex 5.
  const flags = Uint8Array.from([0, R | T(0), T(0), B | T(0), T(0), R | T(1), T(1), T(1), R | T(1)]);

  it("puts every segment in exactly one group, in program order, and skips breaks", () => {
    const groups = groupSegments(flags);
    expect(groups.map((g) => [g.toolIndex, g.rapid, [...g.ends]])).toEqual([
      [0, false, [2, 4]],
      [0, true, [1]],
      [1, false, [6, 7]],
      [1, true, [5, 8]],
    ]);
  });

  it("agrees with a plain count on a real preview of a generated 3-tool program", () => {
    const text = [...generatePortProgram({ lines: 4000, tools: 3, seed: 7 })].join("");
    const { preview } = analyzeToolpathText(text);
    const n = preview.flags.length;
    expect(n).toBeGreaterThan(100);
    const groups = groupSegments(preview.flags);
    let expected = 0;
    for (let i = 1; i < n; i++) if (!(preview.flags[i] & B)) expected++;
    expect(groups.reduce((s, g) => s + g.ends.length, 0)).toBe(expected);
    expect(new Set(groups.map((g) => g.toolIndex)).size).toBe(preview.toolNumbers.length);
    for (const g of groups) {
      for (let k = 0; k < g.ends.length; k++) {
        const f = preview.flags[g.ends[k]];
        expect(f >>> PREVIEW_TOOL_SHIFT).toBe(g.toolIndex);
        expect((f & R) !== 0).toBe(g.rapid);
        if (k > 0) expect(g.ends[k]).toBeGreaterThan(g.ends[k - 1]);
      }
    }
  });
});

describe("scrubber arithmetic", () => {
  it("counts the segments ending at or before a vertex (binary search = linear count)", () => {
    const ends = Uint32Array.from([2, 3, 7, 8, 9, 15, 40]);
    for (let upTo = -1; upTo <= 45; upTo++) {
      const linear = [...ends].filter((e) => e <= upTo).length;
      expect(segmentsUpTo(ends, upTo)).toBe(linear);
    }
    expect(segmentsUpTo(new Uint32Array(0), 10)).toBe(0);
  });

  it("builds index pairs (end − 1, end)", () => {
    expect([...segmentIndex(Uint32Array.from([1, 4, 5]))]).toEqual([0, 1, 3, 4, 4, 5]);
  });

  it("copies segments for dashing with their lengths (3-4-5 triangle)", () => {
    const positions = Float32Array.from([0, 0, 0, 3, 4, 0, 3, 4, 12]);
    const d = dashedSegments(positions, Uint32Array.from([1, 2]));
    expect([...d.positions]).toEqual([0, 0, 0, 3, 4, 0, 3, 4, 0, 3, 4, 12]);
    expect([...d.lineDistances]).toEqual([0, 5, 0, 12]);
  });

  it("clamps and rounds slider values to a vertex", () => {
    expect(clampVertex(-3, 10)).toBe(0);
    expect(clampVertex(4.6, 10)).toBe(5);
    expect(clampVertex(99, 10)).toBe(9);
    expect(clampVertex(Number.NaN, 10)).toBe(0);
    expect(clampVertex(5, 0)).toBe(0);
    expect(scrubFraction(9, 10)).toBe(1);
    expect(scrubFraction(0, 10)).toBe(0);
    expect(scrubFraction(3, 7)).toBeCloseTo(0.5, 12);
  });

  it("finds the first vertex at or after a program line", () => {
    const lines = Uint32Array.from([1, 5, 5, 9, 20, 21]);
    expect(vertexAtLine(lines, 5)).toBe(1);
    expect(vertexAtLine(lines, 6)).toBe(3);
    expect(vertexAtLine(lines, 0)).toBe(0);
    expect(vertexAtLine(lines, 500)).toBe(5);
  });

  it("plays a 200,000-vertex path through in about the asked time", () => {
    const step = playStep(200_000, 20);
    expect(step * 20 * 60).toBeGreaterThanOrEqual(200_000);
    expect((step - 1) * 20 * 60).toBeLessThan(200_000);
    expect(playStep(10)).toBe(1);
  });
});

describe("coarse stand-in while the camera moves", () => {
  it("merges runs of consecutive segments, never across a gap", () => {
    // Segments end at 1,2,3,4,5 (one run), then 8,9 (after a break or another tool's moves).
    const c = coarseSegments(Uint32Array.from([1, 2, 3, 4, 5, 8, 9]), 4);
    expect([...c.index]).toEqual([0, 4, 4, 5, 7, 9]);
    expect([...c.ends]).toEqual([4, 5, 9]);
  });

  it("covers exactly the vertices of the full group, with about 1/k of its segments", () => {
    const text = [...generatePortProgram({ lines: 3000, tools: 2, seed: 3 })].join("");
    const { preview } = analyzeToolpathText(text);
    for (const g of groupSegments(preview.flags)) {
      const c = coarseSegments(g.ends, 4);
      expect(c.ends.length).toBeGreaterThanOrEqual(Math.ceil(g.ends.length / 4));
      // Every original segment lies inside exactly one merged one: [start, end] spans tile the group.
      let covered = 0;
      for (let m = 0; m < c.ends.length; m++) covered += segmentsUpTo(g.ends, c.index[2 * m + 1]) - segmentsUpTo(g.ends, c.index[2 * m]);
      expect(covered).toBe(g.ends.length);
      expect(c.ends.at(-1)).toBe(g.ends.at(-1));
    }
  });
});
