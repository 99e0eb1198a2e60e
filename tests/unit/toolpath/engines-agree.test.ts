/**
 * The WebAssembly engine (plain lines read, runs of plain moves measured in assembly/) and the
 * TypeScript engine give the same analysis: every report field and the preview, numbers bit
 * for bit. Generated programs (mm and inch, both ports, several tools), programs that break
 * machine and plate limits and feed limits, and random programs (fast-check) that mix plain
 * moves with everything that must stop a batch: codes, negative F, spindle off, no tool,
 * inverse time, incremental moves, unknown axes, comments, blank lines and CR/LF styles.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyzeToolpathText } from "@/lib/toolpath/analyze";
import { generatePortProgram } from "@/lib/toolpath/generate";
import type { AnalyzeOptions, MachineProfile, PlateEnvelope, ToolpathAnalysis } from "@/lib/toolpath/types";

const MACHINE: MachineProfile = {
  name: "test mill",
  axes: ["X", "Y", "Z", "A", "B"],
  travelMm: { X: { min: 0, max: 500 }, Y: { min: 0, max: 400 }, Z: { min: -400, max: 0 } },
  rotaryLimitsDeg: { A: { min: -20, max: 20 }, B: { min: -30, max: 30 } },
  rapidRate: { X: 10000, Y: 500, Z: 8000, A: 3600, B: 1800 },
  maxFeedMmPerMin: 2500,
  maxSpindleRpm: 24000,
  toolChangeTimeS: 5,
};
const PLATE: PlateEnvelope = { name: "test plate", min: { X: -20, Y: -20, Z: -40 }, max: { X: 20, Y: 20, Z: 60 }, workOffsetMm: { X: 250, Y: 200, Z: -300 } };

/** Both engines on the same text: the reports as JSON, the preview arrays as bytes. */
function bothEngines(text: string, options: AnalyzeOptions = {}) {
  const show = (a: ToolpathAnalysis) => ({
    report: JSON.parse(JSON.stringify(a.report)) as unknown,
    positions: Buffer.from(a.preview.positions.buffer, a.preview.positions.byteOffset, a.preview.positions.byteLength).toString("hex"),
    flags: Array.from(a.preview.flags),
    lines: Array.from(a.preview.lineNumbers),
    tools: a.preview.toolNumbers,
    tolerance: a.preview.toleranceMm,
  });
  return { wasm: show(analyzeToolpathText(text, { ...options, engine: "wasm" })), typescript: show(analyzeToolpathText(text, { ...options, engine: "typescript" })) };
}

function expectSame(text: string, options: AnalyzeOptions = {}) {
  const { wasm, typescript } = bothEngines(text, options);
  expect(wasm).toEqual(typescript);
  return wasm;
}

describe("the WebAssembly and TypeScript engines", () => {
  it("agree on generated 5-axis programs, mm and inch, intake and exhaust", () => {
    for (const [seed, units, port, tools] of [
      [1, "mm", "intake", 3],
      [2, "inch", "exhaust", 2],
      [3, "mm", "exhaust", 6],
    ] as const) {
      const text = [...generatePortProgram({ lines: 6000, tools, seed, units, port })].join("");
      const result = expectSame(text);
      expect((result.report as { motionBlocks: number }).motionBlocks).toBeGreaterThan(5000);
    }
  });

  it("agree when moves break machine travel, rotary limits, the plate and the feed limit", () => {
    const text = [...generatePortProgram({ lines: 3000, tools: 2, seed: 4 })].join("");
    const result = expectSame(text, { machine: MACHINE, plate: PLATE });
    expect((result.report as { violations: unknown[] }).violations.length).toBeGreaterThan(0);
  });

  it("agree on long runs of plain moves between every kind of state change", () => {
    // Runs of 40 plain lines, so each is measured as a batch, after a line that changes what a
    // batch must use: spindle speed up and down, feed on the G1 line, inch and mm, incremental,
    // rapids, rotary-only moves (F in deg/min), a second tool, spindle off, inverse time.
    const changes = ["S9000", "S20000", "S3000", "G1 F900", "G91", "G90", "G20", "G21", "G0", "G1", "T2 M6", "M5", "M3 S15000", "G93", "G94 F1200", "F-3"];
    const lines = ["G21 G90 G94 G17", "T1 M6", "S12000 M3", "G0 X0 Y0 Z10 A0 B0", "G1 X1 F1000"];
    changes.forEach((change, k) => {
      lines.push(change);
      for (let j = 0; j < 40; j++) {
        const t = k * 40 + j;
        const rotaryOnly = j % 13 === 5;
        const at = (n: number, mod: number, shift: number) => (((t * n) % mod) / 10 - shift).toFixed(1);
        lines.push(rotaryOnly ? `A${(t % 17) - 8} B${(t % 11) - 5}` : `X${at(37, 200, 10)} Y${at(53, 160, 8)} Z${at(29, 90, 0)} A${(t % 9) - 4}${j % 10 === 3 ? ` F${500 + ((t * 97) % 1500)}` : ""}`);
      }
    });
    lines.push("M30");
    for (const options of [{}, { machine: MACHINE, plate: PLATE }]) {
      const result = expectSame(lines.join("\n") + "\n", options);
      expect((result.report as { motionBlocks: number }).motionBlocks).toBeGreaterThan(600);
    }
  });

  it("agree on random programs that mix plain moves with everything that stops a batch", () => {
    const num = fc.integer({ min: -4000, max: 4000 }).map((n) => (n / 100).toString());
    const axis = fc.tuple(fc.constantFrom("X", "Y", "Z", "A", "B", "C"), num).map(([l, v]) => l + v);
    const plainMove = fc.array(axis, { minLength: 1, maxLength: 6 }).chain((words) =>
      fc.constantFrom("", " F800", " F1500", " F3000", " F-5", " F0").map((f) => words.join(" ") + f),
    );
    const other = fc.constantFrom(
      "G0", "G1", "G1 F600", "G90", "G91", "G20", "G21", "G93", "G94", "G1 X1 F2", "T1 M6", "T2 M6", "M3 S9000", "M5", "M4 S30000",
      "(a comment)", "X1 (trailing comment)", "", "   ", "G0 Z50", "G28", "G2 X1 Y1 I0.5 J0.5", "N5 X2 Y2", "%",
    );
    const line = fc.oneof({ arbitrary: plainMove, weight: 12 }, { arbitrary: other, weight: 1 });
    const program = fc.tuple(fc.array(line, { minLength: 1, maxLength: 120 }), fc.constantFrom("\n", "\r\n"), fc.boolean());
    fc.assert(
      fc.property(program, ([lines, eol, limits]) => {
        const text = ["G21 G90 G94 G17", "T1 M6", "S12000 M3", "G0 X0 Y0 Z10 A0 B0 C0", ...lines, "M30"].join(eol) + eol;
        expectSame(text, limits ? { machine: MACHINE, plate: PLATE } : {});
      }),
      { numRuns: 300 },
    );
  }, 60_000);
});
