/**
 * Toolpath benchmark (`npm run bench` or `npm run bench toolpath`). Not a test: it prints figures.
 *
 * Generates 1M- and 5M-line 5-axis programs under data/bench/ (git-ignored) and measures, each
 * in a fresh child process so peak memory is honest: a plain streaming read, SHA-256 of the
 * file, gcode-parser's streaming parse, and the full analysis (fresh, and once more in the same
 * process as a long-lived worker would run it). Reported: analysis throughput,
 * peak RSS of the analysing process, and its time as a ratio to the three references.
 * Targets: ≥ 10× faster than gcode-parser's stream, ≤ 5× the SHA-256 time, peak RSS < 150 MB
 * at 5M lines.
 */
import { spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { createReadStream, existsSync, mkdirSync, renameSync, statSync } from "node:fs";
import { open } from "node:fs/promises";
import { createRequire } from "node:module";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

/** "analyze-warm": the same analysis run a second time in its process, as in a long-lived worker. */
const KINDS = ["read", "sha256", "gcode-parser", "analyze", "analyze-warm"] as const;
type Kind = (typeof KINDS)[number];
type Measure = { kind: Kind; ms: number; cpuMs: number; peakRssMb: number; check: string };

const CHILD_ENV = "PORTOLAN_TOOLPATH_BENCH_CHILD";
const SIZES = [1_000_000, 5_000_000];
const RUNS = 3;
/** gcode-parser is slow enough that one run per size keeps the benchmark short. */
const REFERENCE_PARSER_RUNS = 1;
const BUFFER_BYTES = 1 << 20;

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, "..", "..");
const benchDir = path.join(root, "data", "bench");

export async function run(): Promise<void> {
  mkdirSync(benchDir, { recursive: true });
  console.log(`toolpath benchmark — Node ${process.version}, ${os.cpus().length} cores, ${os.cpus()[0]?.model ?? "cpu"}`);
  console.log(`each figure: median of ${RUNS} fresh child processes (gcode-parser: ${REFERENCE_PARSER_RUNS}); load average ${os.loadavg().map((l) => l.toFixed(1)).join(" ")}`);
  for (const lines of SIZES) {
    const file = await ensureProgram(lines);
    const mb = statSync(file).size / 1e6;
    const results: Partial<Record<Kind, Measure>> = {};
    for (const kind of KINDS) {
      const runs: Measure[] = [];
      for (let i = 0; i < (kind === "gcode-parser" ? REFERENCE_PARSER_RUNS : RUNS); i++) runs.push(await measureInChild(kind, file));
      runs.sort((a, b) => a.ms - b.ms);
      results[kind] = runs[Math.floor(runs.length / 2)];
    }
    report(lines, mb, results as Record<Kind, Measure>);
  }
}

function report(lines: number, mb: number, r: Record<Kind, Measure>): void {
  const a = r.analyze;
  const fmt = (m: Measure) => `${m.ms.toFixed(0).padStart(6)} ms (cpu ${m.cpuMs.toFixed(0)} ms, peak ${m.peakRssMb.toFixed(0)} MB)`;
  console.log(`\n${(lines / 1e6).toFixed(0)}M lines, ${mb.toFixed(1)} MB`);
  for (const kind of KINDS) console.log(`  ${kind.padEnd(13)} ${fmt(r[kind])}`);
  const vsParser = r["gcode-parser"].ms / a.ms;
  const vsSha = a.ms / r.sha256.ms;
  const vsRead = a.ms / r.read.ms;
  const warm = r["analyze-warm"];
  console.log(`  analysis: ${(mb / (a.ms / 1000)).toFixed(0)} MB/s, ${(lines / (a.ms / 1000) / 1e6).toFixed(2)} M lines/s, peak RSS ${a.peakRssMb.toFixed(0)} MB` +
    ` (second run in the same process: ${(mb / (warm.ms / 1000)).toFixed(0)} MB/s, ${(warm.ms / r.sha256.ms).toFixed(2)}× SHA-256)`);
  console.log(`  ratios: ${vsRead.toFixed(2)}× the plain read, ${vsSha.toFixed(2)}× SHA-256, gcode-parser takes ${vsParser.toFixed(1)}× as long`);
  // CPU time is steadier than wall time when other work shares the cores
  const cpuVsParser = r["gcode-parser"].cpuMs / a.cpuMs;
  const cpuVsSha = a.cpuMs / r.sha256.cpuMs;
  console.log(`  by CPU time: ${cpuVsSha.toFixed(2)}× SHA-256, gcode-parser ${cpuVsParser.toFixed(1)}× as long`);
  const mark = (ok: boolean) => (ok ? "met" : "NOT met");
  console.log(`  targets (wall / CPU): ≥10× faster than gcode-parser ${mark(vsParser >= 10)} / ${mark(cpuVsParser >= 10)};` +
    ` ≤5× SHA-256 ${mark(vsSha <= 5)} / ${mark(cpuVsSha <= 5)}` +
    (lines >= 5_000_000 ? `; peak RSS < 150 MB ${mark(a.peakRssMb < 150)}` : ""));
  if (r.analyze.check !== r.sha256.check.split(" ")[0]) console.log(`  WARNING: analysis digest ${a.check} differs from sha256 ${r.sha256.check}`);
}

/** Writes the program once; later runs reuse it (the name carries the parameters). */
async function ensureProgram(lines: number): Promise<string> {
  const file = path.join(benchDir, `toolpath-${lines}-t6-s1.nc`);
  if (existsSync(file) && statSync(file).size > 0) return file;
  const { generatePortProgram } = await import("../../lib/toolpath/generate");
  const started = performance.now();
  const partial = `${file}.part`;
  const handle = await open(partial, "w");
  let pending = "";
  for (const chunk of generatePortProgram({ lines, tools: 6, seed: 1, chunkChars: 1 << 20 })) {
    pending += chunk;
    if (pending.length >= 1 << 22) {
      await handle.write(pending);
      pending = "";
    }
  }
  await handle.write(pending);
  await handle.close();
  renameSync(partial, file);
  console.log(`generated ${path.relative(root, file)} in ${((performance.now() - started) / 1000).toFixed(1)} s`);
  return file;
}

function measureInChild(kind: Kind, file: string): Promise<Measure> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["--import", "tsx", fileURLToPath(import.meta.url)], {
      cwd: root,
      env: { ...process.env, [CHILD_ENV]: JSON.stringify({ kind, file }) },
      stdio: ["ignore", "pipe", "inherit"],
    });
    let out = "";
    child.stdout.on("data", (d: Buffer) => (out += d.toString()));
    child.on("error", reject);
    child.on("close", (code) => {
      if (code !== 0) return reject(new Error(`${kind} child exited with ${code}`));
      resolve(JSON.parse(out.trim().split("\n").pop()!) as Measure);
    });
  });
}

// ---------------------------------------------------------------- child side

let analyzeModule: typeof import("../../lib/toolpath/analyze") | null = null;

async function childMain(kind: Kind, file: string): Promise<void> {
  // load (and transpile) the code before the clock starts: the figure is the work, not the loader
  analyzeModule = await import("../../lib/toolpath/analyze");
  if (kind === "analyze-warm") await analyzeModule.analyzeToolpathFile(file); // untimed first run
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const check = await work(kind, file);
  const ms = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  const measure: Measure = {
    kind,
    ms,
    cpuMs: (cpu.user + cpu.system) / 1000,
    peakRssMb: (process.resourceUsage().maxRSS * 1024) / 1e6,
    check,
  };
  process.stdout.write(`${JSON.stringify(measure)}\n`);
}

async function work(kind: Kind, file: string): Promise<string> {
  switch (kind) {
    case "read":
      return String(await plainRead(file, null));
    case "sha256": {
      const hash = createHash("sha256");
      await plainRead(file, (chunk) => hash.update(chunk));
      return hash.digest("hex");
    }
    case "gcode-parser":
      return String(await referenceParse(file));
    case "analyze":
    case "analyze-warm": {
      const { report } = await analyzeModule!.analyzeToolpathFile(file);
      return report.sha256;
    }
  }
}

/** The same reading the analysis does (reused 1 MiB buffer), with nothing done to the bytes. */
async function plainRead(file: string, each: ((chunk: Uint8Array) => void) | null): Promise<number> {
  const handle = await open(file, "r");
  const buffer = new Uint8Array(BUFFER_BYTES);
  let total = 0;
  try {
    for (;;) {
      const { bytesRead } = await handle.read(buffer, 0, buffer.length, null);
      if (bytesRead === 0) break;
      total += bytesRead;
      each?.(buffer.subarray(0, bytesRead));
    }
  } finally {
    await handle.close();
  }
  return total;
}

/** gcode-parser's own streaming parser, its results consumed and dropped (never collected). */
function referenceParse(file: string): Promise<number> {
  type LineStream = NodeJS.ReadWriteStream;
  const { GCodeLineStream } = createRequire(import.meta.url)("gcode-parser") as { GCodeLineStream: new () => LineStream };
  return new Promise((resolve, reject) => {
    let words = 0;
    createReadStream(file, { highWaterMark: BUFFER_BYTES })
      .on("error", reject)
      .pipe(new GCodeLineStream())
      .on("data", (line: { words: unknown[] }) => {
        words += line.words.length;
      })
      .on("end", () => resolve(words))
      .on("error", reject);
  });
}

const childSpec = process.env[CHILD_ENV];
if (childSpec) {
  const { kind, file } = JSON.parse(childSpec) as { kind: Kind; file: string };
  childMain(kind, file).catch((err: unknown) => {
    process.stderr.write(`${err instanceof Error ? err.stack : String(err)}\n`);
    process.exitCode = 1;
  });
}
