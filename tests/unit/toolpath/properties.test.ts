/**
 * Property tests (fast-check). Coordinates are drawn in whole thousandths so every printed
 * number is an exact decimal and the properties hold up to floating-point rounding only.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyzeToolpathText } from "@/lib/toolpath/analyze";
import type { ToolpathReport } from "@/lib/toolpath/types";
import { expectNear } from "./helpers";

const HEAD = ["G21 G17 G90 G94", "T1 M6", "S12000 M3"];
const num = (thousandths: number) => (thousandths / 1000).toFixed(3);
const analyze = (lines: string[]): ToolpathReport => analyzeToolpathText([...lines, "M30"].join("\n") + "\n").report;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(b));

const point = fc.tuple(
  fc.integer({ min: -100_000, max: 100_000 }),
  fc.integer({ min: -100_000, max: 100_000 }),
  fc.integer({ min: -50_000, max: 50_000 }),
);

describe("splitting a straight move into n pieces", () => {
  it("keeps the length and the time (G94, with a rotary axis riding along)", () => {
    fc.assert(
      fc.property(
        point,
        fc.tuple(fc.integer({ min: -2000, max: 2000 }), fc.integer({ min: -2000, max: 2000 }), fc.integer({ min: -2000, max: 2000 })),
        fc.integer({ min: -500, max: 500 }),
        fc.integer({ min: 1, max: 40 }),
        fc.integer({ min: 1, max: 100 }).map((k) => k * 50),
        (start, step, stepA, n, feed) => {
          fc.pre(step.some((s) => s !== 0));
          const at = (k: number) => `X${num(start[0] + k * step[0])} Y${num(start[1] + k * step[1])} Z${num(start[2] + k * step[2])} A${num(k * stepA)}`;
          const begin = [...HEAD, `G0 ${at(0)}`];
          const whole = analyze([...begin, `G1 ${at(n)} F${feed}`]);
          const pieces = analyze([...begin, `G1 ${at(1)} F${feed}`, ...Array.from({ length: n - 1 }, (_, k) => at(k + 2))]);
          expect(rel(pieces.feedLengthMm, whole.feedLengthMm)).toBeLessThan(1e-9);
          expect(rel(pieces.feedTimeS, whole.feedTimeS)).toBeLessThan(1e-9);
          for (const axis of ["X", "Y", "Z", "A"] as const) {
            expect(pieces.bounds[axis]!.min).toBe(whole.bounds[axis]!.min);
            expect(pieces.bounds[axis]!.max).toBe(whole.bounds[axis]!.max);
          }
          expect(pieces.motionBlocks).toBe(whole.motionBlocks + n - 1);
        },
      ),
      { numRuns: 60 },
    );
  });

  it("keeps the time in inverse-time mode when each piece gets its share of the time (F × n)", () => {
    fc.assert(
      fc.property(point, point, fc.integer({ min: 1, max: 20 }), fc.integer({ min: 1, max: 60 }), (start, step, n, f) => {
        fc.pre(step.some((s) => s !== 0));
        const at = (k: number) => `X${num(start[0] + k * step[0])} Y${num(start[1] + k * step[1])} Z${num(start[2] + k * step[2])}`;
        const begin = [...HEAD, `G0 ${at(0)}`, "G93"];
        const whole = analyze([...begin, `G1 ${at(n)} F${f}`]);
        const pieces = analyze([...begin, ...Array.from({ length: n }, (_, k) => `G1 ${at(k + 1)} F${f * n}`)]);
        expectNear(whole.feedTimeS, 60 / f, 1e-9); // §3.5.19: the move lasts 1/F minutes
        expect(rel(pieces.feedTimeS, whole.feedTimeS)).toBeLessThan(1e-9);
        expect(rel(pieces.feedLengthMm, whole.feedLengthMm)).toBeLessThan(1e-9);
      }),
      { numRuns: 40 },
    );
  });
});

type Move =
  | { kind: "line"; rapid: boolean; to: [number, number, number, number] }
  | { kind: "quarter"; ccw: boolean; r: number; z: number };

const move: fc.Arbitrary<Move> = fc.oneof(
  fc.record({
    kind: fc.constant("line" as const),
    rapid: fc.boolean(),
    to: fc.tuple(fc.integer({ min: -80_000, max: 80_000 }), fc.integer({ min: -80_000, max: 80_000 }), fc.integer({ min: -40_000, max: 40_000 }), fc.integer({ min: -90_000, max: 90_000 })),
  }),
  fc.record({
    kind: fc.constant("quarter" as const),
    ccw: fc.boolean(),
    r: fc.integer({ min: 100, max: 20_000 }),
    z: fc.integer({ min: -3000, max: 3000 }),
  }),
);

describe("G91 incremental program ≡ its G90 absolute twin", () => {
  it("gives the same lengths, times, arcs and extent", () => {
    fc.assert(
      fc.property(fc.array(move, { minLength: 1, maxLength: 40 }), fc.integer({ min: 1, max: 50 }).map((k) => k * 100), (moves, feed) => {
        const absolute: string[] = [...HEAD, "G90 G0 X0 Y0 Z0 A0", `F${feed}`];
        const incremental: string[] = [...HEAD, "G90 G0 X0 Y0 Z0 A0", `F${feed}`, "G91"];
        let [x, y, z, a] = [0, 0, 0, 0];
        for (const m of moves) {
          if (m.kind === "line") {
            const [nx, ny, nz, na] = m.to;
            const code = m.rapid ? "G0" : "G1";
            absolute.push(`${code} X${num(nx)} Y${num(ny)} Z${num(nz)} A${num(na)}`);
            incremental.push(`${code} X${num(nx - x)} Y${num(ny - y)} Z${num(nz - z)} A${num(na - a)}`);
            [x, y, z, a] = [nx, ny, nz, na];
          } else {
            // quarter turn about a centre r to the left (−X): I/J are incremental in both modes
            const code = m.ccw ? "G3" : "G2";
            const ex = x - m.r;
            const ey = m.ccw ? y + m.r : y - m.r;
            absolute.push(`${code} X${num(ex)} Y${num(ey)} Z${num(z + m.z)} I${num(-m.r)} J0`);
            incremental.push(`${code} X${num(ex - x)} Y${num(ey - y)} Z${num(m.z)} I${num(-m.r)} J0`);
            [x, y, z] = [ex, ey, z + m.z];
          }
        }
        const abs = analyze(absolute);
        const inc = analyze(incremental);
        expect(rel(inc.feedLengthMm, abs.feedLengthMm)).toBeLessThan(1e-9);
        expect(rel(inc.rapidLengthMm, abs.rapidLengthMm)).toBeLessThan(1e-9);
        expect(rel(inc.feedTimeS, abs.feedTimeS)).toBeLessThan(1e-9);
        expect(rel(inc.rapidTimeS, abs.rapidTimeS)).toBeLessThan(1e-9);
        expect(inc.arcs).toBe(abs.arcs);
        expect(inc.warnings).toEqual(abs.warnings);
        for (const axis of ["X", "Y", "Z", "A"] as const) {
          expectNear(inc.bounds[axis]!.min, abs.bounds[axis]!.min, 1e-9);
          expectNear(inc.bounds[axis]!.max, abs.bounds[axis]!.max, 1e-9);
        }
      }),
      { numRuns: 60 },
    );
  });
});
