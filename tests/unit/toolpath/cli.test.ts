/** The `portolan toolpath` CLI contract: JSON fields, exit codes, one-line reasons. */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { run } from "@/lib/cli/toolpath";
import { decodePreview } from "@/lib/toolpath/preview";

const dir = mkdtempSync(join(tmpdir(), "portolan-toolpath-cli-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function cli(...args: string[]) {
  const out: string[] = [];
  const err: string[] = [];
  const code = await run(args, { out: (t) => out.push(t), err: (t) => err.push(t) });
  return { code, out: out.join("\n"), err: err.join("\n") };
}

function file(name: string, content: string | Uint8Array): string {
  const path = join(dir, name);
  writeFileSync(path, content);
  return path;
}

const PROGRAM = ["%", "G21 G17 G90 G94", "T4 M6", "S15000 M3", "G0 X0 Y0 Z10", "G1 Z-2 F400", "G2 X20 Y0 I10 J0 F900", "G0 Z10", "M30", "%"].join("\n") + "\n";

describe("toolpath analyze", () => {
  it("--json prints only JSON with the documented fields", async () => {
    const { code, out } = await cli("analyze", file("ok.nc", PROGRAM), "--json");
    expect(code).toBe(0);
    const report = JSON.parse(out);
    for (const key of ["lines", "blocks", "motionBlocks", "units", "bounds", "tools", "feedLengthMm", "rapidLengthMm", "arcs", "feedTimeS", "cycleTimeS", "sha256", "warnings", "violations"]) {
      expect(report, key).toHaveProperty(key);
    }
    expect(report.lines).toBe(10);
    expect(report.units).toBe("mm");
    expect(report.tools.map((t: { number: number }) => t.number)).toEqual([4]);
    expect(report.bounds.X).toMatchObject({ min: 0, max: 20 });
    expect(report.arcs).toBe(1);
    expect(report.sha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it("without --json prints a readable summary", async () => {
    const { code, out } = await cli("analyze", file("ok2.nc", PROGRAM));
    expect(code).toBe(0);
    expect(out).toMatch(/cycle time/);
    expect(out).toMatch(/T4/);
  });

  it("refuses binary, empty, missing and non-G-code input with exit 1 and a one-line reason", async () => {
    const cases = [
      file("junk.bin", Uint8Array.from({ length: 2000 }, (_, i) => (i * 7919) % 256)),
      file("empty.nc", ""),
      join(dir, "nope.nc"),
      file("letter.txt", "Dear porter,\nthe heads are ready.\n"),
    ];
    for (const path of cases) {
      const { code, out, err } = await cli("analyze", path, "--json");
      expect(code, path).toBe(1);
      expect(err.trim().split("\n"), path).toHaveLength(1);
      expect(JSON.parse(out).error.problem).toMatch(/binary|empty|read-failed|not-gcode/);
    }
  });

  it("exit 1 when the program breaks a check, with the violations in the JSON", async () => {
    const machine = file("m.json", JSON.stringify({ name: "small mill", axes: ["X", "Y", "Z"], rapidRate: { X: 10000, Y: 10000, Z: 5000 }, toolChangeTimeS: 4, maxSpindleRpm: 12000 }));
    const plate = file("p.json", JSON.stringify({ min: { X: -5, Y: -15, Z: -5 }, max: { X: 15, Y: 15, Z: 20 } }));
    const { code, out, err } = await cli("analyze", file("v.nc", PROGRAM), "--machine", machine, "--plate", plate, "--json");
    expect(code).toBe(1);
    const report = JSON.parse(out);
    expect(report.violations.map((v: { kind: string }) => v.kind).sort()).toEqual(["max-spindle", "plate-envelope"]);
    expect(report.machineProfile).toBe("small mill");
    expect(err).toMatch(/2 violation/);
  });

  it("a bad profile file is refused", async () => {
    const { code, err } = await cli("analyze", file("ok3.nc", PROGRAM), "--machine", file("bad.json", "{ nope"));
    expect(code).toBe(1);
    expect(err).toMatch(/not valid JSON/);
  });

  it("writes the encoded preview when asked", async () => {
    const out = join(dir, "preview.bin");
    const { code } = await cli("analyze", file("ok4.nc", PROGRAM), "--preview-out", out, "--json");
    expect(code).toBe(0);
    const preview = decodePreview(new Uint8Array(readFileSync(out)));
    expect(preview.toolNumbers).toEqual([4]);
    expect(preview.flags.length).toBeGreaterThan(3);
  });

  it("usage errors exit 2", async () => {
    expect((await cli()).code).toBe(2);
    expect((await cli("analyze")).code).toBe(2);
    expect((await cli("analyze", "a.nc", "--bogus")).code).toBe(2);
    expect((await cli("frobnicate")).code).toBe(2);
  });
});

describe("toolpath generate", () => {
  it("writes exactly the requested number of lines, which then analyse cleanly", async () => {
    const out = join(dir, "gen.nc");
    const { code } = await cli("generate", "--lines", "1500", "--tools", "2", "--seed", "3", "--out", out);
    expect(code).toBe(0);
    const text = readFileSync(out, "utf8");
    expect(text.split("\n").length - 1).toBe(1500);
    const analysed = await cli("analyze", out, "--json");
    expect(analysed.code).toBe(0);
    const report = JSON.parse(analysed.out);
    expect(report.lines).toBe(1500);
    expect(report.tools.map((t: { number: number }) => t.number)).toEqual([1, 2]);
    expect(report.warnings).toEqual([]);
  });

  it("refuses nonsense options", async () => {
    expect((await cli("generate", "--lines", "ten")).code).toBe(2);
    expect((await cli("generate", "--lines", "100", "--units", "cubits")).code).toBe(2);
  });
});
