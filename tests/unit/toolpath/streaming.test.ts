/**
 * The analysis does not depend on how the bytes arrive: any split into chunks (mid-word,
 * mid-number, between CR and LF) gives the same report; progress is reported as bytes arrive.
 */
import { createHash } from "node:crypto";
import { Readable } from "node:stream";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyzeToolpath, analyzeToolpathText, ToolpathAnalyzer } from "@/lib/toolpath/analyze";
import { generatePortProgram } from "@/lib/toolpath/generate";

const SAMPLE = [
  "%",
  "O0007 (CHUNKS)",
  "G21 G17 G90 G94",
  "T2 M6",
  "S15000 M3",
  "G0 X0 Y0 Z5",
  "G1 Z-1 F300 ; plunge",
  "G2 X10 Y0 I5 J0 F900",
  "G1 X1 2.5 Y -3 A15.25 B-7.5",
  "G3 X0 Y0 R-8",
  "/G0 Z50",
  "G93 G1 X3 Y3 F12",
  "G94 G4 P0.5",
  "M30",
  "%",
].join("\r\n") + "\r\n";

function split(bytes: Uint8Array, cuts: number[]): Uint8Array[] {
  const points = [...new Set(cuts.map((c) => c % (bytes.length + 1)))].sort((a, b) => a - b);
  const parts: Uint8Array[] = [];
  let start = 0;
  for (const p of points) {
    parts.push(bytes.subarray(start, p));
    start = p;
  }
  parts.push(bytes.subarray(start));
  return parts;
}

describe("chunk boundaries", () => {
  const bytes = new TextEncoder().encode(SAMPLE);
  const whole = analyzeToolpathText(SAMPLE);

  it("any split gives the same report and preview", async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.nat({ max: 10_000 }), { maxLength: 40 }), async (cuts) => {
        const parts = split(bytes, cuts);
        const chunked = await analyzeToolpath(parts);
        expect(chunked.report).toEqual(whole.report);
        expect(chunked.preview).toEqual(whole.preview);
      }),
      { numRuns: 150 },
    );
  });

  it("one byte at a time gives the same report", async () => {
    const parts = Array.from(bytes, (b) => Uint8Array.of(b));
    expect((await analyzeToolpath(parts)).report).toEqual(whole.report);
  });

  it("the SHA-256 is that of the bytes, computed in the same pass", () => {
    expect(whole.report.sha256).toBe(createHash("sha256").update(bytes).digest("hex"));
    expect(whole.report.bytes).toBe(bytes.length);
  });
});

describe("sources and progress", () => {
  it("reads a Node Readable and reports progress up to the byte count", async () => {
    const text = [...generatePortProgram({ lines: 3000, tools: 2, seed: 4 })].join("");
    const seen: number[] = [];
    const stream = Readable.from([text.slice(0, 20000), text.slice(20000, 50000), text.slice(50000)]);
    const { report } = await analyzeToolpath(stream, { onProgress: (n) => seen.push(n) });
    const total = new TextEncoder().encode(text).length;
    expect(report.bytes).toBe(total);
    expect(seen.length).toBe(3);
    expect(seen[seen.length - 1]).toBe(total);
    expect([...seen].sort((a, b) => a - b)).toEqual(seen);
  });

  it("stops when aborted", async () => {
    const controller = new AbortController();
    async function* slow() {
      yield "G21 G90\nG0 X1\n";
      controller.abort();
      yield "G0 X2\n";
    }
    await expect(analyzeToolpath(slow(), { signal: controller.signal })).rejects.toMatchObject({ name: "AbortError" });
  });

  it("the push analyser refuses use after finish", () => {
    const a = new ToolpathAnalyzer();
    a.push(new TextEncoder().encode("G21 G0 X1\nM2\n"));
    a.finish();
    expect(() => a.push(new Uint8Array([71]))).toThrow();
  });
});
