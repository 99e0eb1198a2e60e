import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { run } from "@/lib/cli/flow";

const fixture = (name: string) => path.resolve(__dirname, "../../fixtures/flow", name);

async function cli(...args: string[]) {
  const out: string[] = [];
  const err: string[] = [];
  const code = await run(args, { out: (t) => out.push(t), err: (t) => err.push(t) });
  return { code, out: out.join("\n"), err: err.join("\n") };
}

const tmp = mkdtempSync(path.join(tmpdir(), "portolan-flow-cli-"));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe("flow compute", () => {
  it("prints only JSON with the documented fields", async () => {
    const r = await cli("compute", fixture("intake-inch-cfm.csv"), "--valve-mm", "45.72", "--depression-inh2o", "28", "--standard", "fan075", "--json");
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out);
    expect(json.ok).toBe(true);
    expect(json.points).toHaveLength(6);
    const top = json.points.find((p: { liftMm: number }) => Math.abs(p.liftMm - 11.43) < 1e-9);
    expect(Object.keys(top)).toEqual(expect.arrayContaining(["liftMm", "flowCfm", "flowCfmAt28", "ld", "cdCurtain", "cdValve"]));
    expect(top.cdValve).toBeCloseTo(0.58693, 5); // domain.md §5 (1.80 in = 45.72 mm, 220 cfm at 28 inH2O, 0.075 lb/ft³)
    expect(json.densityKgM3).toBeCloseTo(1.201385, 6); // domain.md §3
    expect(json.columns).toEqual({ lift: "lift_in", flow: "flow_cfm" });
    expect(r.err).toBe("");
  });
  it("uses ambient readings", async () => {
    const r = await cli(
      "compute", fixture("per-point-depression.csv"), "--valve-mm", "45.72", "--depression-inh2o", "28",
      "--temp-c", "20", "--baro-kpa", "101.325", "--rh", "50", "--json",
    );
    const json = JSON.parse(r.out);
    expect(json.densityKgM3).toBeCloseTo(1.19931, 5); // domain.md §4, CIPM-2007
    expect(json.densitySource).toBe("ambient");
  });
  it("maps columns from flags", async () => {
    const r = await cli(
      "compute", fixture("unknown-headers.csv"), "--valve-in", "1.8", "--depression-inh2o", "28",
      "--lift-column", "L", "--lift-unit", "in", "--flow-column", "1", "--flow-unit", "cfm", "--json",
    );
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).points.map((p: { flowCfm: number }) => p.flowCfm)).toEqual([68, 128.5]);
  });
  it("prints a readable table with the caution without --json", async () => {
    const r = await cli("compute", fixture("exhaust-metric-ls.csv"), "--valve-mm", "40", "--depression-inh2o", "25");
    expect(r.code).toBe(0);
    expect(r.out).toContain("cfm@28");
    expect(r.out).toContain("estimates");
  });
  it("refuses a malformed CSV with exit 1 and JSON errors", async () => {
    const r = await cli("compute", fixture("malformed.csv"), "--valve-mm", "45.72", "--depression-inh2o", "28", "--json");
    expect(r.code).toBe(1);
    const json = JSON.parse(r.out);
    expect(json.ok).toBe(false);
    expect(json.errors.map((e: { row: number }) => e.row)).toEqual([3, 4, 5, 6]);
    expect(r.err).toContain("line 3");
  });
  it("refuses values the schema rejects (lift beyond the valve) with exit 1", async () => {
    const r = await cli("compute", fixture("intake-inch-cfm.csv"), "--valve-mm", "10", "--depression-inh2o", "28", "--json");
    expect(r.code).toBe(1);
    expect(JSON.parse(r.out).errors[0].path).toMatch(/^points\.\d+\.lift$/);
  });
  it("refuses a missing or oversized file with exit 1", async () => {
    expect((await cli("compute", path.join(tmp, "none.csv"), "--valve-mm", "45", "--depression-inh2o", "28")).code).toBe(1);
    const big = path.join(tmp, "big.csv");
    writeFileSync(big, "lift_mm,flow_cfm\n" + "1,2\n".repeat(300_000));
    const r = await cli("compute", big, "--valve-mm", "45", "--depression-inh2o", "28");
    expect(r.code).toBe(1);
    expect(r.err).toContain("far smaller");
  });
  it.each([
    [["compute", "x.csv", "--valve-mm", "45"]],
    [["compute", "x.csv", "--depression-inh2o", "28"]],
    [["compute", "x.csv", "--valve-mm", "abc", "--depression-inh2o", "28"]],
    [["compute", "x.csv", "--valve-mm", "45", "--valve-in", "1.8", "--depression-inh2o", "28"]],
    [["compute", "x.csv", "--valve-mm", "45", "--depression-inh2o", "28", "--temp-c", "20"]],
    [["compute", "x.csv", "--valve-mm", "45", "--depression-inh2o", "28", "--unknown"]],
    [["compute", "--valve-mm", "45", "--depression-inh2o", "28"]],
    [["frobnicate"]],
    [[]],
  ])("usage errors exit 2: %j", async (args) => {
    expect((await cli(...args)).code).toBe(2);
  });
});

describe("flow compare and ratio", () => {
  it("compares two files at matched lifts", async () => {
    const r = await cli("compare", fixture("per-point-depression.csv"), fixture("intake-inch-cfm.csv"), "--valve-mm", "45.72", "--depression-inh2o", "28", "--json");
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out);
    expect(json.rows.length).toBeGreaterThan(0);
    // At 2.54 mm both were measured directly at 28 inH2O: baseline 71.0, candidate 68.0 cfm.
    expect(json.rows[0].liftMm).toBeCloseTo(2.54, 6);
    expect(json.rows[0].gainPercent).toBeCloseTo(((68 - 71) / 71) * 100, 6);
  });
  it("exhaust/intake ratio", async () => {
    const r = await cli(
      "ratio", fixture("exhaust-metric-ls.csv"), fixture("intake-inch-cfm.csv"),
      "--exhaust-valve-mm", "40", "--intake-valve-in", "1.8", "--depression-inh2o", "28", "--exhaust-depression-inh2o", "25", "--json",
    );
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out);
    expect(json.rows.length).toBeGreaterThan(0);
    expect(json.guideline.low).toBe(0.7);
    for (const row of json.rows) expect(row.ratio).toBeCloseTo(row.exhaustCfmAt28 / row.intakeCfmAt28, 12);
  });
});

describe("flow engine", () => {
  it("computes the engine-level estimates", async () => {
    const r = await cli(
      "engine", "--bore-mm", String(4 * 25.4), "--stroke-mm", String(3.48 * 25.4), "--rpm", "6000",
      "--intake-valve-mm", String(2.02 * 25.4), "--mean-cd", "0.4", "--cylinders", "8", "--intake-cfm28", "250", "--json",
    );
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out);
    expect(json.meanPistonSpeedMs).toBeCloseTo(17.6784, 4); // domain.md §6
    expect(json.machIndex).toBeCloseTo(0.50491, 4); // domain.md §6 (Taylor / Heywood)
    expect(json.machIndexAboveThreshold).toBe(false);
    expect(json.powerEstimateHp).toBeCloseTo(514, 6); // domain.md §8 [CP]
    expect(json.labels.power).toContain("common practice, an estimate");
    expect(json.portMeanVelocityMs).toBeNull();
  });
  it("refuses a valve larger than the bore with exit 1", async () => {
    const r = await cli("engine", "--bore-mm", "50", "--stroke-mm", "80", "--rpm", "6000", "--intake-valve-mm", "60", "--mean-cd", "0.4", "--json");
    expect(r.code).toBe(1);
  });
  it("needs bore, stroke and rpm", async () => expect((await cli("engine", "--bore-mm", "100")).code).toBe(2));
});

describe("flow demo", () => {
  it("prints a CSV that flow compute accepts", async () => {
    const r = await cli("demo", "--valve-mm", "51.3", "--kind", "ported", "--seed", "1");
    expect(r.code).toBe(0);
    const file = path.join(tmp, "demo.csv");
    writeFileSync(file, r.out);
    const computed = await cli("compute", file, "--valve-mm", "51.3", "--depression-inh2o", "28", "--json");
    expect(computed.code).toBe(0);
    expect(JSON.parse(computed.out).points.length).toBe(r.out.trim().split("\n").length - 2);
  });
});
