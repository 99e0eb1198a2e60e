/**
 * The scanner's WebAssembly fast path reads plain lines; everything else falls back to the
 * TypeScript scanner. Both ways must give the same blocks, numbers (bit for bit), warnings and
 * counts, on hand-picked line kinds and on random text (fast-check). The committed module must
 * also be what its AssemblyScript source compiles to.
 */
import fc from "fast-check";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { compileFastLine, GENERATED_MODULE, generatedSource } from "@/lib/toolpath/assembly/build";
import type { BlockWords } from "@/lib/toolpath/block";
import { fastPath } from "@/lib/toolpath/fast-path";
import { BlockScanner } from "@/lib/toolpath/scanner";
import { WarningLog } from "@/lib/toolpath/warnings";

/** Every block the scanner hands on, written out exactly (values as their 64-bit patterns). */
function scan(text: string, useFastPath: boolean, chunkBytes = 1 << 20) {
  const blocks: string[] = [];
  const bits = new Float64Array(1);
  const hex = new Uint32Array(bits.buffer);
  const sink = {
    programEnded: false,
    executeBlock(w: BlockWords, line: number) {
      let out = `${line}:${w.present.toString(2)}`;
      for (let k = 0; k < 26; k++) {
        if ((w.present & (1 << k)) === 0) continue;
        bits[0] = w.values[k];
        out += ` ${String.fromCharCode(65 + k)}${hex[1].toString(16)}.${hex[0].toString(16)}`;
      }
      out += ` G${Array.from(w.gCodes.subarray(0, w.gCount)).join(",")} M${Array.from(w.mCodes.subarray(0, w.mCount)).join(",")}`;
      blocks.push(out);
      if (Array.from(w.mCodes.subarray(0, w.mCount)).some((m) => m === 2 || m === 30)) this.programEnded = true;
    },
  };
  const log = new WarningLog();
  const scanner = new BlockScanner(sink, log, false, useFastPath);
  const bytes = new TextEncoder().encode(text);
  let error = "";
  try {
    for (let at = 0; at < bytes.length; at += chunkBytes) scanner.push(bytes.subarray(at, at + chunkBytes));
    scanner.finish();
  } catch (err) {
    error = (err as Error).message;
  }
  return { blocks, warnings: log.sorted(), counts: log.counts, stats: scanner.stats, error };
}

function expectSameBothWays(text: string, chunkBytes?: number) {
  const fast = scan(text, true, chunkBytes);
  const plain = scan(text, false, chunkBytes);
  expect(fast).toEqual(plain);
  return fast;
}

describe("the WebAssembly fast path", () => {
  it("is available here (Node has WebAssembly)", () => {
    expect(fastPath()).not.toBeNull();
  });

  it("reads every kind of line exactly as the TypeScript scanner does", () => {
    const lines = [
      "%",
      "O1001 (program number)",
      "G21 G17 G90 G94 G40 G49 G80",
      "T1 M6",
      "S12000 M3 M8",
      "G0 X0 Y0 Z5.",
      "G1 X1.5 Y-2.25 Z-.5 A+3 B-0. F600.",
      "x1.25 y2 z-3 a4 b5 c6 f700",
      "X.5 Y5. Z+1 A-.25",
      "N10 G1 X1 Y2",
      "A1 N2 B3 N4 C5", // a word after another must not disturb it
      "X1 G1 Y2 M3 Z3 N5 F100",
      "N20 X 1 . 5 Y2", // blanks inside a number
      "G0X+0. 12 34Y 7",
      "\tX1\tY2\t",
      "X123456789 Y0.123456789",
      "X1234567890 Y1.0000000001", // ten digits and more
      "G1 X1 (comment) Y2",
      "X3 Y4 ; to the end of the line",
      "X5 Y6 (unclosed",
      "/X7 Y8",
      "X1.2.3",
      "X",
      "G1.5 X1",
      "G59.3",
      "M6.5",
      "G99999999",
      "X1 X2",
      "X#3",
      "#3=6",
      "Q1 E5 U7",
      "G1 X1 *12",
      "G1 X1 Y2 Z3 A4 B5 C6 F7 I8 J9 K10 R11 P12 S13 T14 H15 D16 L17",
      "G0 G1 G2 G3 G4 G17 G18 G19 G20 G21 G90 G91 G93 G94 G54 G28 G53 G43 G80 G81 G82 G83",
      "M0 M1 M2 M3 M4 M5 M6 M7 M8 M9",
      "   ",
      "",
      "X" + "9".repeat(300),
      "G1 X1 Y2 " + "Z3 ".repeat(100),
      "M30",
      "X1 after the end",
      "%",
    ];
    for (const eol of ["\n", "\r\n", "\r"]) {
      const result = expectSameBothWays(lines.join(eol) + eol);
      expect(result.blocks.length).toBeGreaterThan(15);
      expect(result.warnings.length).toBeGreaterThan(10);
    }
  });

  it("agrees on a sample program read in awkward chunk sizes, lines split across chunks", () => {
    const program = ["G21 G90 G94", "T2 M6", "S9000 M3"];
    for (let i = 0; i < 400; i++) program.push(`G1 X${(i * 0.137).toFixed(4)} Y${(-i * 0.05).toFixed(3)} Z${(i % 7) - 3}. A${i % 90} F${1000 + i}`);
    program.push("M30");
    const text = program.join("\r\n") + "\r\n";
    for (const chunk of [1, 7, 64, 4096]) expectSameBothWays(text, chunk);
  });

  it("agrees with the TypeScript scanner on random lines of words and junk (fast-check)", () => {
    const blank = fc.constantFrom("", "", "", " ", "\t", "  ");
    const digit = fc.constantFrom(..."0123456789");
    const digits = fc
      .oneof({ arbitrary: fc.array(digit, { minLength: 1, maxLength: 4 }), weight: 6 }, { arbitrary: fc.array(digit, { maxLength: 12 }), weight: 1 })
      .map((d) => d.join(""));
    const word = fc
      .tuple(fc.constantFrom(..."GXYZABCMNFOQESTIJKRPHxyzgm"), blank, fc.constantFrom("", "", "-", "+"), digits, fc.constantFrom("", ".", "."), digits, blank)
      .map((parts) => parts.join(""));
    const junk = fc.constantFrom("(", ")", "(note)", ";", "*", "*7", "#", "[", "]", "%", "/", ".", "X1.2.3", " 5");
    const line = fc.array(fc.oneof({ arbitrary: word, weight: 8 }, { arbitrary: junk, weight: 1 }), { maxLength: 9 }).map((w) => w.join(""));
    const text = fc.tuple(fc.array(line, { minLength: 1, maxLength: 12 }), fc.constantFrom("\n", "\r\n", "\r"));
    fc.assert(
      fc.property(text, fc.integer({ min: 1, max: 64 }), ([lines, eol], chunk) => {
        const input = ["G21 G90", ...lines].join(eol) + eol;
        expect(scan(input, true, chunk)).toEqual(scan(input, false, chunk));
      }),
      { numRuns: 400 },
    );
  }, 30_000);

  it("the committed module is what the AssemblyScript source compiles to", async () => {
    const binary = await compileFastLine();
    expect(readFileSync(GENERATED_MODULE, "utf8")).toBe(generatedSource(binary));
  }, 60_000);
});
