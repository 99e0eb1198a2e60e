/**
 * The scanner's WebAssembly fast path (source: assembly/), instantiated once per process: a
 * line reader whose words land at fixed addresses that BlockWords views, and a batch runner for
 * stretches of plain motion lines (plain-moves.ts) that measures them with the interpreter's
 * arithmetic. Every address comes from the module's exports, so the two sides cannot drift.
 * Batches run synchronously inside one push, with the interpreter's state copied in and out,
 * so analyses sharing the instance never see each other's state.
 */
import { FAST_LINE_MEMORY_BYTES, FAST_LINE_WASM_BASE64 } from "./fast-line-wasm";

/** Views of the batch state (see assembly/plain-moves.ts for the slots). */
export type PlainBatchMemory = {
  pos: Float64Array;
  sums: Float64Array;
  min: Float64Array;
  max: Float64Array;
  toolStats: Float64Array;
  rapidRate: Float64Array;
  alarmLo: Float64Array;
  alarmHi: Float64Array;
  /** feed, scale (1 or 25.4), max feed (+∞ when unchecked), spindle rpm */
  modeF: Float64Array;
  minLine: Int32Array;
  maxLine: Int32Array;
  /** rapid, incremental, axes ok, XYZ known, preview tool bits, inch, cut ok, spindle on */
  modeI: Int32Array;
  /** line (in and out), non-blank lines, moves, last move's line, queued points, ended on CR */
  batch: Int32Array;
  /** Queued preview points: 32 bytes each, x y z as f64 then flags and line as i32. */
  queueF: Float64Array;
  queueI: Int32Array;
};

export type FastPath = {
  /**
   * Reads the line at `at` (an index into `bytes`): −1 to read it in TypeScript, else its line
   * end's index × 4 + FAST_HAS_WORDS + FAST_HAS_CODES as they apply.
   */
  fastLine: (at: number) => number;
  /** Runs plain motion lines from `at` up to `to`; returns where TypeScript takes over. */
  runPlain: (at: number, to: number) => number;
  /** The whole linear memory. */
  bytes: Uint8Array;
  /** Text to scan goes from here… */
  input: number;
  /** …up to this many bytes. */
  capacity: number;
  values: Float64Array;
  gCodes: Int32Array;
  mCodes: Int32Array;
  /** [present, gCount, mCount] of the last line read. */
  counts: Int32Array;
  plain: PlainBatchMemory;
};

export const FAST_HAS_WORDS = 1;
export const FAST_HAS_CODES = 2;
export const COUNT_PRESENT = 0;
export const COUNT_G = 1;
export const COUNT_M = 2;
export const BATCH_LINE = 0;
export const BATCH_NON_BLANK = 1;
export const BATCH_MOVES = 2;
export const BATCH_LAST_MOVE_LINE = 3;
export const BATCH_QUEUED = 4;
export const BATCH_ENDED_ON_CR = 5;

let instance: FastPath | null | undefined;

/** The fast path, or null where WebAssembly cannot run (the scanner then reads every line itself). */
export function fastPath(): FastPath | null {
  if (instance !== undefined) return instance;
  try {
    instance = instantiate();
  } catch {
    instance = null;
  }
  return instance;
}

function instantiate(): FastPath {
  const compiled = new WebAssembly.Module(decodeBase64(FAST_LINE_WASM_BASE64));
  const exports = new WebAssembly.Instance(compiled, { env: { abort: abortFromWasm } }).exports as Record<string, unknown> & {
    memory: WebAssembly.Memory;
    init: () => void;
    fastLine: (at: number) => number;
    runPlain: (at: number, to: number) => number;
  };
  exports.init();
  const buffer = exports.memory.buffer;
  if (buffer.byteLength !== FAST_LINE_MEMORY_BYTES) throw new Error("unexpected WebAssembly memory size");
  const at = (name: string) => Number((exports[name] as WebAssembly.Global).value);
  const f64 = (name: string, n: number) => new Float64Array(buffer, at(name), n);
  const i32 = (name: string, n: number) => new Int32Array(buffer, at(name), n);
  const input = at("INPUT");
  const queuePoints = at("QUEUE_POINTS");
  return {
    fastLine: exports.fastLine,
    runPlain: exports.runPlain,
    bytes: new Uint8Array(buffer),
    input,
    capacity: buffer.byteLength - input,
    values: f64("VALUES", 26),
    gCodes: i32("G_CODES", 16),
    mCodes: i32("M_CODES", 8),
    counts: new Int32Array(buffer, at("PRESENT"), 3),
    plain: {
      pos: f64("POS", 6),
      sums: f64("SUMS", 8),
      min: f64("MIN", 6),
      max: f64("MAX", 6),
      toolStats: f64("TOOL_STATS", 6),
      rapidRate: f64("RAPID_RATE", 6),
      alarmLo: f64("ALARM_LO", 6),
      alarmHi: f64("ALARM_HI", 6),
      modeF: f64("MODE_F", 4),
      minLine: i32("MIN_LINE", 6),
      maxLine: i32("MAX_LINE", 6),
      modeI: i32("MODE_I", 8),
      batch: i32("BATCH", 8),
      queueF: new Float64Array(buffer, at("QUEUE_AT"), queuePoints * 4),
      queueI: new Int32Array(buffer, at("QUEUE_AT"), queuePoints * 8),
    },
  };
}

function abortFromWasm(): never {
  throw new Error("the scanner's WebAssembly fast path aborted");
}

function decodeBase64(text: string): Uint8Array<ArrayBuffer> {
  const binary = atob(text);
  const out = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) out[i] = binary.charCodeAt(i);
  return out;
}
