/**
 * Bad input: a clear error or warning, never a crash, a hang or unbounded memory.
 */
import { createHash } from "node:crypto";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { analyzeToolpath, analyzeToolpathFile, analyzeToolpathText, ToolpathInputError } from "@/lib/toolpath/analyze";
import { generatePortProgram, mulberry32 } from "@/lib/toolpath/generate";
import { MAX_LINE_BYTES } from "@/lib/toolpath/scanner";
import { START, analyzeLines, warningCodes } from "./helpers";

const dir = mkdtempSync(join(tmpdir(), "portolan-toolpath-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const GOOD = [START, "T1 M6", "S10000 M3", "G0 X0 Y0 Z0", "G1 X10 F600"];

function expectRefused(fn: () => unknown, problem: string): void {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(ToolpathInputError);
    expect((err as ToolpathInputError).problem).toBe(problem);
    return;
  }
  throw new Error(`expected the input to be refused as ${problem}`);
}

describe("input that is not G-code is refused", () => {
  it("binary junk with NUL bytes", async () => {
    const random = mulberry32(5);
    const bytes = Uint8Array.from({ length: 4000 }, () => Math.floor(random() * 256));
    bytes[100] = 0;
    await expect(analyzeToolpath([bytes])).rejects.toMatchObject({ problem: "binary" });
  });

  it("binary junk without NUL bytes (control and high bytes)", async () => {
    const random = mulberry32(9);
    const bytes = Uint8Array.from({ length: 8000 }, () => 1 + Math.floor(random() * 255));
    await expect(analyzeToolpath([bytes])).rejects.toMatchObject({ problem: "binary" });
  });

  it("an empty file and a file of blank lines", async () => {
    await expect(analyzeToolpath([])).rejects.toMatchObject({ problem: "empty" });
    expectRefused(() => analyzeToolpathText("\n  \r\n\t\n"), "empty");
  });

  it("prose and CSV are not G-code", () => {
    expectRefused(() => analyzeToolpathText("Dear porter,\nthe heads are ready.\nRegards\n"), "not-gcode");
    expectRefused(() => analyzeToolpathText("x,y,z\n1.0,2.0,3.0\n4.0,5.0,6.0\n"), "not-gcode");
  });

  it("a big non-G-code file is refused after its first lines, not read to the end", async () => {
    let served = 0;
    async function* prose() {
      for (let i = 0; i < 100_000; i++) {
        served++;
        yield "The quick brown fox jumps over the lazy dog.\n".repeat(100);
      }
    }
    await expect(analyzeToolpath(prose())).rejects.toMatchObject({ problem: "not-gcode" });
    expect(served).toBeLessThan(100);
  });

  it("an unreadable path or a directory is a read failure", async () => {
    await expect(analyzeToolpathFile(join(dir, "missing.nc"))).rejects.toMatchObject({ problem: "read-failed" });
    await expect(analyzeToolpathFile(dir)).rejects.toMatchObject({ problem: "read-failed" });
  });

  it("a stream that fails mid-way is a read failure", async () => {
    async function* failing() {
      yield "G21 G90\nG0 X1\n";
      throw new Error("connection reset");
    }
    await expect(analyzeToolpath(failing())).rejects.toMatchObject({ problem: "read-failed" });
  });
});

describe("damaged G-code gives warnings with line numbers", () => {
  it("a 10 MB line is skipped with a warning and the lines after it still count", async () => {
    const chunk = "X1".repeat(1 << 19); // 1 MiB of one endless line
    async function* source() {
      yield GOOD.join("\n") + "\n";
      for (let i = 0; i < 10; i++) yield chunk;
      yield "\nG1 X20\nM2\n";
    }
    const { report } = await analyzeToolpath(source());
    const long = report.warnings.find((w) => w.code === "line-too-long");
    expect(long?.line).toBe(GOOD.length + 1);
    expect(report.bounds.X!.max).toBe(20);
    expect(report.lines).toBe(GOOD.length + 3);
  });

  it("a long line inside one big chunk is refused the same way", () => {
    const r = analyzeToolpathText([...GOOD, `G1 X5 (${"c".repeat(MAX_LINE_BYTES + 10)})`, "M2"].join("\n") + "\n").report;
    expect(warningCodes(r)).toContain("line-too-long");
  });

  it("truncation mid-line: the cut line is reported and its half word is not guessed", () => {
    const r = analyzeToolpathText(GOOD.join("\n") + "\nG1 X30 Y").report;
    expect(warningCodes(r)).toEqual(expect.arrayContaining(["malformed-number", "no-final-line-end", "no-program-end"]));
    expect(r.bounds.X!.max).toBe(10);
  });

  it("truncation between words keeps the complete words and says the file may be cut short", () => {
    const r = analyzeToolpathText(GOOD.join("\n") + "\nG1 X30").report;
    expect(warningCodes(r)).toContain("no-final-line-end");
    expect(r.bounds.X!.max).toBe(30);
  });

  it("`X1.2.3` voids its line", () => {
    const r = analyzeLines([...GOOD, "G1 X1.2.3 Y5", "M2"]);
    expect(r.warnings.find((w) => w.code === "malformed-number")?.line).toBe(GOOD.length + 1);
    expect(r.bounds.Y!.max).toBe(0);
  });

  it("NaN, a lone sign and a lone point are not numbers", () => {
    const r = analyzeLines([...GOOD, "G1 XNaN", "G1 Y-", "G1 Z.", "M2"]);
    expect(r.warningCounts["malformed-number"]).toBe(3);
    expect(JSON.stringify(r)).not.toMatch(/NaN|Infinity|null,"max"/);
    expect(Number.isFinite(r.feedLengthMm) && Number.isFinite(r.cycleTimeS)).toBe(true);
  });

  it("an unclosed % is reported", () => {
    const r = analyzeLines(["%", ...GOOD]);
    expect(warningCodes(r)).toContain("unclosed-percent");
  });

  it("stray binary bytes later in a G-code file void only their lines", () => {
    const text = [...GOOD, "G1 X2\u0001\u0002", ...Array.from({ length: 50 }, (_, i) => `G1 X${i}`), "M2"].join("\n") + "\n";
    const bytes = new TextEncoder().encode(text);
    const r = analyzeToolpathText(new TextDecoder().decode(bytes)).report;
    expect(r.warnings.find((w) => w.code === "bad-character")?.line).toBe(GOOD.length + 1);
    expect(r.bounds.X!.max).toBe(49);
  });

  it("the same fault on every line is counted, but only a few are kept", () => {
    const lines = [START, "G0 X0 Y0 Z0", "T1 M6", "M3", ...Array.from({ length: 5000 }, (_, i) => `G1 X${i % 50}`), "M2"];
    const r = analyzeLines(lines); // no F anywhere
    expect(r.warningCounts["feed-rate-missing"]).toBe(5000);
    expect(r.warnings.filter((w) => w.code === "feed-rate-missing").length).toBeLessThanOrEqual(25);
    expect(r.warningsTruncated).toBe(true);
  });
});

describe("files on disk", () => {
  it("a file and the same text in memory give the same report", async () => {
    const text = [...GOOD, "G2 X20 Y0 I5 J0", "M2"].join("\r\n") + "\r\n";
    const path = join(dir, "small.nc");
    writeFileSync(path, text);
    const fromFile = await analyzeToolpathFile(path);
    expect(fromFile.report).toEqual(analyzeToolpathText(text).report);
  });

  it("a file big enough to be hashed on a second thread gives the same report as in memory", async () => {
    // about 20 MB: over the 16 MiB from which the file reader hashes on another thread
    const text = [...generatePortProgram({ lines: 480_000, tools: 3, seed: 7 })].join("");
    expect(text.length).toBeGreaterThan(16 * 1024 * 1024);
    const path = join(dir, "big.nc");
    writeFileSync(path, text);
    const fromFile = await analyzeToolpathFile(path);
    expect(fromFile.report.sha256).toBe(createHash("sha256").update(text).digest("hex"));
    expect(fromFile.report).toEqual(analyzeToolpathText(text).report);
  }, 30_000);
});

describe("a complete program without a final line end", () => {
  it("is not reported as cut short when it ends with M30 or a closing %", () => {
    expect(warningCodes(analyzeToolpathText([...GOOD, "M30"].join("\n")).report)).not.toContain("no-final-line-end");
    expect(warningCodes(analyzeToolpathText(["%", ...GOOD, "M30", "%"].join("\n")).report)).toEqual([]);
  });
});
