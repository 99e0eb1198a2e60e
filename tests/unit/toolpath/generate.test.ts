/** The invented sample program: exact length, repeatable, and a clean 5-axis program. */
import { describe, expect, it } from "vitest";
import { analyzeToolpathText } from "@/lib/toolpath/analyze";
import { fixed, generatePortProgram, minimumLines } from "@/lib/toolpath/generate";

const text = (options: Parameters<typeof generatePortProgram>[0]) => [...generatePortProgram(options)].join("");

describe("generatePortProgram", () => {
  it("emits exactly the requested lines, in chunks, the same for the same seed", () => {
    const chunks = [...generatePortProgram({ lines: 12_345, tools: 4, seed: 9, chunkChars: 4096 })];
    expect(chunks.length).toBeGreaterThan(10);
    const joined = chunks.join("");
    expect(joined.split("\n").length - 1).toBe(12_345);
    expect(joined).toBe(text({ lines: 12_345, tools: 4, seed: 9 }));
    expect(joined).not.toBe(text({ lines: 12_345, tools: 4, seed: 10 }));
  });

  it("is a clean 5-axis program to the analysis: tools in order, A and B moving, no warnings", () => {
    const { report } = analyzeToolpathText(text({ lines: 5000, tools: 3, seed: 2 }));
    expect(report.lines).toBe(5000);
    expect(report.tools.map((t) => t.number)).toEqual([1, 2, 3]);
    expect(report.warnings).toEqual([]);
    expect(report.rotaryTravelDeg.A).toBeGreaterThan(0);
    expect(report.rotaryTravelDeg.B).toBeGreaterThan(0);
    expect(report.tools[0].feedMmPerMin!.max).toBe(2400);
  });

  it("inch output analyses to nearly the same millimetres", () => {
    const mm = analyzeToolpathText(text({ lines: 3000, seed: 5 })).report;
    const inch = analyzeToolpathText(text({ lines: 3000, seed: 5, units: "inch" })).report;
    expect(inch.units).toBe("inch");
    // 5 decimals of an inch is 0.000254 mm of rounding per coordinate
    expect(Math.abs(inch.bounds.X!.max - mm.bounds.X!.max)).toBeLessThan(0.001);
    expect(Math.abs(inch.feedLengthMm - mm.feedLengthMm) / mm.feedLengthMm).toBeLessThan(1e-3);
  });

  it("never asks for fewer lines than its frame needs", () => {
    expect(text({ lines: 1, tools: 2 }).split("\n").length - 1).toBe(minimumLines(2));
  });
});

describe("fixed", () => {
  it.each([
    [12.5, 4, "12.5"],
    [-0.00312, 4, "-.0031"],
    [7, 3, "7."],
    [0.00001, 4, "0."],
    [-3.99996, 4, "-4."],
  ])("fixed(%d, %d) = %s", (v, d, s) => {
    expect(fixed(v, d)).toBe(s);
  });
});
