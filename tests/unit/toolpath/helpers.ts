import { analyzeToolpathText } from "@/lib/toolpath/analyze";
import type { AnalyzeOptions, ToolpathReport } from "@/lib/toolpath/types";
import { expect } from "vitest";

/** Analyses a program given as lines (joined with LF, final LF added). */
export function analyzeLines(lines: string[], options: AnalyzeOptions = {}): ToolpathReport {
  return analyzeToolpathText(lines.join("\n") + "\n", options).report;
}

/** Asserts |actual − expected| ≤ tolerance (the brief asks for 1e-6 on the worked examples). */
export function expectNear(actual: number, expected: number, tolerance = 1e-6): void {
  expect(Number.isFinite(actual), `expected a finite number, got ${actual}`).toBe(true);
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance);
}

export function warningCodes(report: ToolpathReport): string[] {
  return report.warnings.map((w) => w.code);
}

/** The interpreter's start state of the worked examples in the engineering notes (§10). */
export const START = "G21 G17 G90 G94";
