/**
 * Cross-check of the tokeniser against a general-purpose G-code library from npm
 * (`gcode-parser`): on a mixed sample both must find the same words on every line.
 * The sample keeps to what both read the same way (no `/`, `%`, parameters or O words,
 * which that library does not interpret).
 */
import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import { BlockWords, gName } from "@/lib/toolpath/block";
import { BlockScanner, type BlockSink } from "@/lib/toolpath/scanner";
import { WarningLog } from "@/lib/toolpath/warnings";

type ParsedLine = { words: [string, number | string][] };
const gcodeParser = createRequire(import.meta.url)("gcode-parser") as { parseLine(line: string): ParsedLine };

const SAMPLE = [
  "N10 G21 G90 G17 (SETUP)",
  "n20 g0 x10.5 y-3 z+2.0 a.5 b-.25",
  "G1X1Y2Z3F600",
  "G1 X 1.5 Y -2 ; trailing comment",
  "(comment only)",
  "",
  "T2 M6",
  "S12000 M3 M8",
  "G2 X5 Y5 I2.5 J0 F300",
  "G93 G1 X1 A30 F2",
  "G43 H2 Z50.",
  "G4 P1.5",
  "G54 G0 C-45.",
  "G17G3X0Y0R5",
  "G18 G2 X3 Z-4 I1.5 K-2 (xz arc) F250",
  "G59.3 G0 X-0.0001 Y.0001",
  "G1 X12.3456 Y-7.8901 Z-0.5 A-12.345 B67.89",
  "M5 M9",
  "M30",
];

/** Words per line as the engine's scanner sees them: [letter, value] sorted. */
function engineWords(lines: string[]): Map<number, [string, number][]> {
  const seen = new Map<number, [string, number][]>();
  const sink: BlockSink = {
    programEnded: false,
    executeBlock(w: BlockWords, line: number) {
      const words: [string, number][] = [];
      for (let i = 0; i < w.gCount; i++) words.push(["G", Number(gName(w.gCodes[i]).slice(1))]);
      for (let i = 0; i < w.mCount; i++) words.push(["M", w.mCodes[i]]);
      for (let letter = 0; letter < 26; letter++) {
        if (w.has(letter)) words.push([String.fromCharCode(65 + letter), w.values[letter]]);
      }
      seen.set(line, sortWords(words));
    },
  };
  const scanner = new BlockScanner(sink, new WarningLog(), false);
  scanner.push(new TextEncoder().encode(lines.join("\n") + "\n"));
  scanner.finish();
  return seen;
}

function sortWords(words: [string, number][]): [string, number][] {
  return [...words].sort((a, b) => (a[0] === b[0] ? a[1] - b[1] : a[0] < b[0] ? -1 : 1));
}

describe("tokeniser vs gcode-parser (npm) on a mixed sample", () => {
  it("finds the same words on every line", () => {
    const ours = engineWords(SAMPLE);
    let compared = 0;
    SAMPLE.forEach((text, index) => {
      const theirs = gcodeParser.parseLine(text).words.map(([l, v]) => [l, Number(v)] as [string, number]);
      const mine = ours.get(index + 1) ?? [];
      expect(mine, `line ${index + 1}: ${text}`).toEqual(sortWords(theirs));
      if (theirs.length > 0) compared++;
    });
    expect(compared).toBe(SAMPLE.length - 2); // all but the comment-only and the blank line
  });
});
