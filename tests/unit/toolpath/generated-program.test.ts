/**
 * A generated 5-axis program whose totals the generator knows by construction. The generator
 * works in whole thousandths (so every coordinate it prints is an exact decimal) and adds up
 * lengths, times, extents and tools with its own arithmetic, independently of the engine.
 * Rules applied: F along the XYZ path, rotary-only moves in deg/min (RS274/NGC v3 §2.1.2.5);
 * rapid time from per-axis rates with the slowest axis governing; G4 P in seconds (§3.5.4).
 */
import { describe, expect, it } from "vitest";
import { analyzeToolpathText } from "@/lib/toolpath/analyze";
import { mulberry32 } from "@/lib/toolpath/generate";
import type { MachineProfile } from "@/lib/toolpath/types";
import { expectNear } from "./helpers";

const MACHINE: MachineProfile = {
  name: "test five-axis",
  axes: ["X", "Y", "Z", "A", "B"],
  rapidRate: { X: 20000, Y: 24000, Z: 12000, A: 3600, B: 5400 },
  toolChangeTimeS: 7.5,
};
const RATE = [20000, 24000, 12000, 3600, 5400];
const AXES = ["X", "Y", "Z", "A", "B"] as const;

type Expected = {
  feedLengthMm: number;
  rapidLengthMm: number;
  feedTimeS: number;
  rapidTimeS: number;
  dwellTimeS: number;
  arcs: number;
  toolOrder: number[];
  toolChanges: number;
  min: number[];
  max: number[];
  motionBlocks: number;
};

function buildProgram(seed: number, movesPerTool: number): { text: string; expected: Expected } {
  const random = mulberry32(seed);
  const int = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo + 1));
  const num = (thousandths: number) => (thousandths / 1000).toFixed(3);
  const lines: string[] = ["G21 G17 G90 G94", "G54"];
  const e: Expected = {
    feedLengthMm: 0, rapidLengthMm: 0, feedTimeS: 0, rapidTimeS: 0, dwellTimeS: 0, arcs: 0,
    toolOrder: [], toolChanges: 0, min: [Infinity, Infinity, Infinity, Infinity, Infinity],
    max: [-Infinity, -Infinity, -Infinity, -Infinity, -Infinity], motionBlocks: 0,
  };
  const pos = [0, 0, 0, 0, 0]; // thousandths
  let known = false;
  const visit = (p: number[]) => p.forEach((v, k) => {
    e.min[k] = Math.min(e.min[k], v / 1000);
    e.max[k] = Math.max(e.max[k], v / 1000);
  });
  const rapidTo = (p: number[]) => {
    lines.push(`G0 ${p.map((v, k) => `${AXES[k]}${num(v)}`).join(" ")}`);
    if (known) {
      const d = p.map((v, k) => (v - pos[k]) / 1000);
      e.rapidLengthMm += Math.hypot(d[0], d[1], d[2]);
      e.rapidTimeS += 60 * Math.max(...d.map((v, k) => Math.abs(v) / RATE[k]));
    }
    known = true;
    p.forEach((v, k) => (pos[k] = v));
    visit(p);
    e.motionBlocks++;
  };

  for (const tool of [3, 1, 4, 1]) {
    lines.push(`T${tool} M6`, `S${int(8, 24) * 1000} M3`);
    if (!e.toolOrder.includes(tool)) e.toolOrder.push(tool);
    e.toolChanges++;
    rapidTo([int(-50000, 50000), int(-40000, 40000), int(0, 30000), int(-30000, 30000), int(-20000, 20000)]);
    let feed = int(3, 30) * 100;
    lines.push(`F${feed}`);
    for (let m = 0; m < movesPerTool; m++) {
      const rotaryOnly = m % 7 === 3;
      const d = rotaryOnly
        ? [0, 0, 0, int(-5000, 5000), int(-5000, 5000)]
        : [int(-3000, 3000), int(-3000, 3000), int(-2000, 2000), int(-800, 800), int(-800, 800)];
      if (m % 11 === 5) feed = int(3, 30) * 100;
      const next = pos.map((v, k) => v + d[k]);
      const words = next.map((v, k) => (d[k] !== 0 || k < 3 ? `${AXES[k]}${num(v)}` : "")).filter(Boolean);
      lines.push(`G1 ${words.join(" ")}${m % 11 === 5 ? ` F${feed}` : ""}`);
      const xyz = Math.hypot(d[0], d[1], d[2]) / 1000;
      e.feedLengthMm += xyz;
      e.feedTimeS += 60 * (xyz > 0 ? xyz / feed : Math.hypot(d[3], d[4]) / 1000 / feed);
      next.forEach((v, k) => (pos[k] = v));
      visit(next);
      e.motionBlocks++;
    }
    // a helical full turn about a centre r to the left: length √((2πr)² + dz²)
    const r = int(2000, 9000);
    const dz = -int(500, 3000);
    lines.push(`G3 X${num(pos[0])} Y${num(pos[1])} Z${num(pos[2] + dz)} I${num(-r)} J0`);
    const helix = Math.hypot((2 * Math.PI * r) / 1000, dz / 1000);
    e.feedLengthMm += helix;
    e.feedTimeS += (60 * helix) / feed;
    e.arcs++;
    e.motionBlocks++;
    // the circle spans the centre ± r in X and Y
    visit([pos[0] - 2 * r, pos[1] - r, pos[2] + dz, pos[3], pos[4]]);
    visit([pos[0], pos[1] + r, pos[2], pos[3], pos[4]]);
    pos[2] += dz;
    const dwell = int(1, 40) / 10;
    lines.push(`G4 P${dwell}`);
    e.dwellTimeS += dwell;
    rapidTo([pos[0], pos[1], 50000, pos[3], pos[4]]);
    lines.push("M5");
  }
  lines.push("M30");
  return { text: lines.join("\n") + "\n", expected: e };
}

describe("generated 5-axis program with totals known by construction", () => {
  for (const seed of [1, 2, 3]) {
    it(`seed ${seed}: extent, lengths, times, tools and arcs match the generator's own sums`, () => {
      const { text, expected: e } = buildProgram(seed, 150);
      const { report: r } = analyzeToolpathText(text, { machine: MACHINE });
      expectNear(r.feedLengthMm, e.feedLengthMm, 1e-6);
      expectNear(r.rapidLengthMm, e.rapidLengthMm, 1e-6);
      expectNear(r.feedTimeS, e.feedTimeS, 1e-6);
      expectNear(r.rapidTimeS, e.rapidTimeS, 1e-6);
      expectNear(r.dwellTimeS, e.dwellTimeS, 1e-9);
      expect(r.toolChanges).toBe(e.toolChanges);
      expectNear(r.toolChangeTimeS, e.toolChanges * 7.5, 1e-9);
      expectNear(r.cycleTimeS, e.feedTimeS + e.rapidTimeS + e.dwellTimeS + e.toolChanges * 7.5, 1e-6);
      expect(r.tools.map((t) => t.number)).toEqual(e.toolOrder);
      expect(r.tools[1].ranges).toHaveLength(2); // tool 1 was mounted twice
      expect(r.arcs).toBe(e.arcs);
      expect(r.motionBlocks).toBe(e.motionBlocks);
      expect(r.unmeasuredMoves).toBe(1); // only the very first rapid, from an unknown start
      AXES.forEach((axis, k) => {
        expectNear(r.bounds[axis]!.min, e.min[k], 1e-9);
        expectNear(r.bounds[axis]!.max, e.max[k], 1e-9);
      });
      expect(r.warnings).toEqual([]);
      expect(r.violations).toEqual([]);
    });
  }
});
