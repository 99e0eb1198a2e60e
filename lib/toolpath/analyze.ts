/**
 * Entry points of the toolpath analysis: one streaming pass over the bytes that tokenises,
 * interprets, checks, decimates the preview and computes the SHA-256, holding only a reused
 * read buffer, one partial line and fixed-size state — never the file or one object per line.
 */
import { createHash, type Hash } from "node:crypto";
import { open, type FileHandle } from "node:fs/promises";
import { PreviewDecimator } from "./decimate";
import { generatePortProgram } from "./generate";
import { ParallelHasher } from "./hash-worker";
import { Interpreter, SUM_DWELL_S, SUM_FEED_MIN, SUM_FEED_MM, SUM_RAPID_MIN, SUM_RAPID_MM, SUM_ROTARY_A } from "./interpreter";
import { LimitChecker } from "./limits";
import { ASSUMED_MACHINE } from "./profile";
import { BlockScanner, NotGcodeError } from "./scanner";
import type { AnalyzeOptions, RotaryAxis, ToolpathAnalysis, ToolpathReport } from "./types";
import { WarningLog } from "./warnings";

export const DEFAULT_PREVIEW_MAX_VERTICES = 200_000;
/**
 * Measured on the 1M-line file (8 alternating A/B fresh processes): 256 KiB reads were no faster
 * and 4 MiB reads (a quarter of the hash updates) about 12 ms slower in wall time.
 */
const READ_BUFFER_BYTES = 1 << 20;
/**
 * Files at least this big are hashed on a second thread. Starting the thread costs 20-30 ms of
 * the other core, more than hashing a small file inline (SHA-256 runs at about 1.3 GB/s here).
 */
const PARALLEL_HASH_MIN_BYTES = 16 << 20;
/**
 * Buffers shared between the reader and the hash thread: enough to read on while the thread
 * starts, which it does only after the first chunks, once the JIT has compiled the hot code
 * (thread start-up and compilation compete for the second core). 1M-line file, 12 alternating
 * fresh processes: wall median 191 ms inline, 178-185 ms with the thread from the start,
 * 172-179 ms with it started after 4 chunks.
 */
const HASH_POOL_BUFFERS = 16;
/*
 * Also tried, measured and not kept: decimating the preview on the hash thread, the points
 * handed over through a shared-memory ring. The interpreter's optimised code was thrown away when
 * the ring's hand-over first ran, and the thread paid its own JIT warm-up: 1M-line file, 15
 * alternating fresh processes, wall median 212 -> 278 ms.
 */
const HASH_THREAD_AFTER_CHUNKS = 4;
/** The first bytes are sniffed for binary content before anything else is trusted. */
const SNIFF_BYTES = 4096;

export type InputProblem = "empty" | "binary" | "not-gcode" | "read-failed";

/** The input cannot be analysed at all (as opposed to a program with warnings). */
export class ToolpathInputError extends Error {
  constructor(
    readonly problem: InputProblem,
    message: string,
  ) {
    super(message);
    this.name = "ToolpathInputError";
  }
}

/** Push-style analyser for callers that already have chunks (workers, upload pipelines). */
export class ToolpathAnalyzer {
  private readonly hash: Hash | null;
  private readonly log = new WarningLog();
  private readonly limits: LimitChecker;
  private readonly decimator: PreviewDecimator;
  private readonly interpreter: Interpreter;
  private readonly scanner: BlockScanner;
  private bytes = 0;
  private sniffed = 0;
  private controlBytes = 0;
  private highBytes = 0;
  private finished = false;

  /**
   * `hashElsewhere` is for the file reader that hashes on a second thread: the analyser then
   * skips hashing and finishWithDigest supplies the digest.
   */
  constructor(
    private readonly options: AnalyzeOptions = {},
    private readonly hashElsewhere = false,
  ) {
    warmUpOnce();
    this.hash = hashElsewhere ? null : createHash("sha256");
    this.limits = new LimitChecker(options.machine, options.plate);
    this.decimator = new PreviewDecimator(options.previewMaxVertices ?? DEFAULT_PREVIEW_MAX_VERTICES);
    this.interpreter = new Interpreter({
      machine: options.machine,
      plate: options.plate,
      limits: this.limits,
      preview: this.decimator,
      log: this.log,
    });
    this.scanner = new BlockScanner(this.interpreter, this.log, options.blockDelete ?? false, options.engine !== "typescript");
  }

  get bytesRead(): number {
    return this.bytes;
  }

  push(chunk: Uint8Array): void {
    if (this.finished) throw new Error("ToolpathAnalyzer: push after finish");
    if (chunk.length === 0) return;
    this.hash?.update(chunk);
    this.bytes += chunk.length;
    if (this.sniffed < SNIFF_BYTES) this.sniff(chunk);
    try {
      this.scanner.push(chunk);
    } catch (err) {
      throw translate(err);
    }
  }

  finish(): ToolpathAnalysis {
    if (this.hashElsewhere) throw new Error("ToolpathAnalyzer: use finishWithDigest");
    return this.complete(this.hash!.digest("hex"));
  }

  finishWithDigest(sha256: string): ToolpathAnalysis {
    if (!this.hashElsewhere) throw new Error("ToolpathAnalyzer: this analyser computes its own digest");
    return this.complete(sha256);
  }

  private complete(sha256: string): ToolpathAnalysis {
    if (this.finished) throw new Error("ToolpathAnalyzer: finish called twice");
    this.finished = true;
    if (this.bytes === 0) throw new ToolpathInputError("empty", "the file is empty");
    try {
      this.scanner.finish();
    } catch (err) {
      throw translate(err);
    }
    const stats = this.scanner.stats;
    if (stats.nonBlankLines === 0) throw new ToolpathInputError("empty", "the file holds only blank lines");
    const it = this.interpreter;
    if (!it.programEnded && !this.scanner.tapeClosed) {
      this.log.add("no-program-end", stats.lines, "the program has no M2/M30 and is not closed by %: it may be incomplete (RS274/NGC §3.1)");
    }
    const machine = this.options.machine ?? ASSUMED_MACHINE;
    const bounds = it.bounds();
    const violations = this.limits.finish(bounds, it.firstUseByAxis());
    const rotaryTravelDeg: Partial<Record<RotaryAxis, number>> = {};
    (["A", "B", "C"] as const).forEach((axis, k) => {
      const travel = it.sums[SUM_ROTARY_A + k];
      if (bounds[axis] || travel > 0) rotaryTravelDeg[axis] = travel;
    });
    const feedTimeS = it.sums[SUM_FEED_MIN] * 60;
    const rapidTimeS = it.sums[SUM_RAPID_MIN] * 60;
    const dwellTimeS = it.sums[SUM_DWELL_S];
    const toolChangeTimeS = it.toolChanges * machine.toolChangeTimeS;
    const preview = this.decimator.finish(it.tools.numbers());
    const report: ToolpathReport = {
      sha256,
      bytes: this.bytes,
      lines: stats.lines,
      blocks: stats.blocks,
      motionBlocks: it.motionBlocks,
      units: it.units,
      bounds,
      tools: it.tools.usages(),
      toolChanges: it.toolChanges,
      feedLengthMm: it.sums[SUM_FEED_MM],
      rapidLengthMm: it.sums[SUM_RAPID_MM],
      arcs: it.arcs,
      rotaryTravelDeg,
      feedTimeS,
      rapidTimeS,
      dwellTimeS,
      toolChangeTimeS,
      cycleTimeS: feedTimeS + rapidTimeS + dwellTimeS + toolChangeTimeS,
      unmeasuredMoves: it.unmeasuredMoves,
      homeReturns: it.homeReturns,
      machineCoordinateMoves: it.machineCoordinateMoves,
      inverseTimeBlocks: it.inverseTimeBlocks,
      programStops: it.programStops,
      workOffsets: [...it.workOffsets],
      blockDeleteLines: stats.blockDeleteLines,
      machineProfile: machine.name,
      checks: this.limits.checks,
      warnings: this.log.sorted(),
      warningCounts: { ...this.log.counts },
      warningsTruncated: this.log.truncated,
      violations,
      previewVertices: preview.flags.length,
      previewToleranceMm: preview.toleranceMm,
    };
    return { report, preview };
  }

  /** Refuses binary input early: NUL bytes, many control bytes or mostly non-ASCII in the first 4 KiB. */
  private sniff(chunk: Uint8Array): void {
    const n = Math.min(chunk.length, SNIFF_BYTES - this.sniffed);
    for (let i = 0; i < n; i++) {
      const c = chunk[i];
      if (c === 0) throw new ToolpathInputError("binary", "the file is binary (it contains NUL bytes), not G-code text");
      if ((c < 32 && c !== 9 && c !== 10 && c !== 13 && c !== 12) || c === 127) this.controlBytes++;
      else if (c >= 128) this.highBytes++;
    }
    this.sniffed += n;
    const seen = this.sniffed;
    if (this.controlBytes > 8 && this.controlBytes * 50 > seen) {
      throw new ToolpathInputError("binary", "the file is binary (control bytes), not G-code text");
    }
    if (seen >= 256 && this.highBytes * 10 > seen * 3) {
      throw new ToolpathInputError("binary", "the file is binary (mostly non-ASCII bytes), not G-code text");
    }
  }
}

/**
 * The first analyser in a process first reads a small generated sample (8-11 ms, most of it
 * the first run of every function), so the JIT has seen the common paths (rapids and cuts from
 * known positions, tool changes, comments) before it optimises the hot loop. Without it, the
 * first tool change deep inside a big file throws the optimised code away and costs more than
 * the sample does (1M-line file: 217 against 196 ms). 200 lines cover the same paths as the
 * 600 used before (no deoptimisation in the main run either way) and cost less.
 */
let warmedUp = false;
function warmUpOnce(): void {
  if (warmedUp) return;
  warmedUp = true;
  try {
    const sample = new TextEncoder().encode([...generatePortProgram({ lines: 200, tools: 3, seed: 1 })].join(""));
    const analyzer = new ToolpathAnalyzer({ previewMaxVertices: 64 });
    analyzer.push(sample);
    analyzer.finish();
    warmUpPreviewRefilter();
  } catch {
    // only a speed-up: an analysis never depends on it
  }
}

/**
 * The preview's refilter first runs deep inside a big file, on a full buffer of 200 000
 * vertices; unoptimised, that first pass costs several times a later one. Twenty tiny
 * decimators that each overflow a few times get it compiled up front.
 */
function warmUpPreviewRefilter(): void {
  const point = new Float64Array(3);
  for (let k = 0; k < 20; k++) {
    const decimator = new PreviewDecimator(16);
    for (let i = 0; i < 64; i++) {
      point[0] = i;
      point[1] = (i * 7) % 5;
      point[2] = i & 1;
      decimator.add(point, 0, i);
    }
    decimator.finish([]);
  }
}

function translate(err: unknown): unknown {
  if (err instanceof NotGcodeError) return new ToolpathInputError("not-gcode", `not G-code: ${err.message}`);
  return err;
}

export type ByteSource = AsyncIterable<Uint8Array | string> | Iterable<Uint8Array | string>;

/** Analyses a stream of bytes (a Node Readable, a web stream, or any async iterable of chunks). */
export async function analyzeToolpath(source: ByteSource, options: AnalyzeOptions = {}): Promise<ToolpathAnalysis> {
  const analyzer = new ToolpathAnalyzer(options);
  const encoder = new TextEncoder();
  try {
    for await (const chunk of source as AsyncIterable<Uint8Array | string>) {
      options.signal?.throwIfAborted();
      analyzer.push(typeof chunk === "string" ? encoder.encode(chunk) : chunk);
      options.onProgress?.(analyzer.bytesRead);
    }
  } catch (err) {
    if (err instanceof ToolpathInputError || isAbort(err)) throw err;
    throw new ToolpathInputError("read-failed", `could not read the input: ${err instanceof Error ? err.message : String(err)}`);
  }
  options.signal?.throwIfAborted();
  return analyzer.finish();
}

/**
 * Analyses a file. Reads go through reused 1 MiB buffers, with the next read already under way
 * while the current chunk is analysed; files from 16 MiB up are hashed on a second thread.
 */
export async function analyzeToolpathFile(path: string, options: AnalyzeOptions = {}): Promise<ToolpathAnalysis> {
  let handle: FileHandle;
  try {
    handle = await open(path, "r");
  } catch (err) {
    throw new ToolpathInputError("read-failed", `cannot open ${path}: ${(err as NodeJS.ErrnoException).code ?? String(err)}`);
  }
  const readInto = (buffer: Uint8Array) =>
    handle.read(buffer, 0, buffer.length, null).then(
      (r) => r.bytesRead,
      (err: NodeJS.ErrnoException) => {
        throw new ToolpathInputError("read-failed", `cannot read ${path}: ${err.code ?? String(err)}`);
      },
    );
  let pending: Promise<number> | null = null;
  let hasher: ParallelHasher | null = null;
  try {
    const size = (await handle.stat()).size;
    hasher = size >= PARALLEL_HASH_MIN_BYTES ? new ParallelHasher(READ_BUFFER_BYTES, HASH_POOL_BUFFERS) : null;
    let chunks = 0;
    const analyzer = new ToolpathAnalyzer(options, hasher !== null);
    const spare = hasher ? null : [new Uint8Array(READ_BUFFER_BYTES), new Uint8Array(READ_BUFFER_BYTES)];
    let flip = 0;
    const nextBuffer = async () => (hasher ? hasher.acquire() : spare![(flip ^= 1)]);
    let buffer = await nextBuffer();
    pending = readInto(buffer);
    for (;;) {
      const read = await pending;
      pending = null;
      if (read === 0) break;
      options.signal?.throwIfAborted();
      const current = buffer;
      buffer = await nextBuffer();
      pending = readInto(buffer);
      analyzer.push(current.subarray(0, read));
      hasher?.submit(current, read);
      if (++chunks === HASH_THREAD_AFTER_CHUNKS) hasher?.start();
      options.onProgress?.(analyzer.bytesRead);
    }
    return hasher ? analyzer.finishWithDigest(await hasher.digest()) : analyzer.finish();
  } finally {
    // never close the handle under a read still in flight
    if (pending) await pending.catch(() => 0);
    await hasher?.close();
    await handle.close();
  }
}


/** Analyses G-code already in memory (small programs, tests, the demo seed). */
export function analyzeToolpathText(text: string, options: AnalyzeOptions = {}): ToolpathAnalysis {
  const analyzer = new ToolpathAnalyzer(options);
  analyzer.push(new TextEncoder().encode(text));
  return analyzer.finish();
}

function isAbort(err: unknown): boolean {
  return err instanceof Error && err.name === "AbortError";
}
