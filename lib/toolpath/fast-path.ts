/**
 * The scanner's WebAssembly fast path (source: assembly/fast-line.ts), instantiated once per
 * process. Its words land at fixed addresses in the module's memory; BlockWords views them.
 * Measured on the 1M-line file, scanner alone: about a quarter less time than the TypeScript
 * tokeniser on the same lines, and no JIT warm-up to wait for (the module is compiled at once).
 */
import { FAST_LINE_MEMORY_BYTES, FAST_LINE_WASM_BASE64 } from "./fast-line-wasm";

/** Addresses of the output block (see assembly/fast-line.ts). */
const VALUES = 0;
const PRESENT = 208;
const G_COUNT = 212;
const M_COUNT = 216;
const G_CODES = 256;
const M_CODES = 320;

export type FastPath = {
  /**
   * Reads the line at `at` (an index into `bytes`): −1 to read it in TypeScript, else its line
   * end's index × 4 + FAST_HAS_WORDS + FAST_HAS_CODES as they apply.
   */
  fastLine: (at: number) => number;
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
};

let instance: FastPath | null | undefined;

/** The fast path, or null where WebAssembly cannot run (the scanner then reads every line itself). */
export function fastPath(): FastPath | null {
  if (instance !== undefined) return instance;
  try {
    const compiled = new WebAssembly.Module(decodeBase64(FAST_LINE_WASM_BASE64));
    const exports = new WebAssembly.Instance(compiled, { env: { abort: abortFromWasm } }).exports as {
      memory: WebAssembly.Memory;
      init: () => void;
      fastLine: (at: number) => number;
      INPUT: WebAssembly.Global;
    };
    exports.init();
    const buffer = exports.memory.buffer;
    if (buffer.byteLength !== FAST_LINE_MEMORY_BYTES) throw new Error("unexpected WebAssembly memory size");
    const input = Number(exports.INPUT.value);
    instance = {
      fastLine: exports.fastLine,
      bytes: new Uint8Array(buffer),
      input,
      capacity: buffer.byteLength - input,
      values: new Float64Array(buffer, VALUES, 26),
      gCodes: new Int32Array(buffer, G_CODES, (M_CODES - G_CODES) / 4),
      mCodes: new Int32Array(buffer, M_CODES, 8),
      counts: new Int32Array(buffer, PRESENT, 3),
    };
  } catch {
    instance = null;
  }
  return instance;
}

export const FAST_HAS_WORDS = 1;
export const FAST_HAS_CODES = 2;
export const COUNT_PRESENT = 0;
export const COUNT_G = (G_COUNT - PRESENT) / 4;
export const COUNT_M = (M_COUNT - PRESENT) / 4;

function abortFromWasm(): never {
  throw new Error("the scanner's WebAssembly fast path aborted");
}

function decodeBase64(text: string): Uint8Array<ArrayBuffer> {
  const binary = atob(text);
  const out = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) out[i] = binary.charCodeAt(i);
  return out;
}
