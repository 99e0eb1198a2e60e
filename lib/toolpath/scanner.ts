/**
 * Bytes → blocks. Reads G-code text chunk by chunk without making a string per line: each line
 * is tokenised straight from the bytes into a reused BlockWords and handed to the interpreter.
 *
 * Lexical rules (RS274/NGC v3, NISTIR 6556 §3.3, and the edge cases in the engineering notes):
 * letters in either case; spaces and tabs ignored anywhere outside comments (`G0X +0. 12 34Y 7`
 * is G0 X0.1234 Y7); signs and bare decimal points; no exponents; `(…)` comments closed on the
 * same line and `;` to end of line; `/` first on a line is block delete; `%` lines delimit the
 * program (§3.1); `N` line numbers; `O` program numbers tolerated, O-word subroutines refused;
 * `*nn` printer-host checksums verified and stripped; CR, LF and CRLF line ends.
 */
import { AXIS_WORDS, BlockWords, L_G, L_M, MAX_G_PER_BLOCK, MAX_M_PER_BLOCK } from "./block";
import {
  BATCH_ENDED_ON_CR,
  BATCH_LINE,
  BATCH_MOVES,
  BATCH_NON_BLANK,
  COUNT_G,
  COUNT_M,
  COUNT_PRESENT,
  FAST_HAS_CODES,
  FAST_HAS_WORDS,
  fastPath,
  type FastPath,
  type PlainBatchMemory,
} from "./fast-path";
import type { WarningLog } from "./warnings";

export interface BlockSink {
  executeBlock(words: BlockWords, line: number): void;
  readonly programEnded: boolean;
  /** Optional: runs stretches of plain motion lines in WebAssembly (see Interpreter). */
  beginPlainBatch?(memory: PlainBatchMemory, line: number): boolean;
  endPlainBatch?(memory: PlainBatchMemory): void;
}

/** A line longer than this is refused outright (it cannot be G-code a controller would take). */
export const MAX_LINE_BYTES = 64 * 1024;
/** RS274/NGC v3 limit on a line's length (edge case 14); longer lines are read but flagged. */
const STANDARD_LINE_LIMIT = 256;
/**
 * A batch of plain lines that ran fewer lines than this was not worth its set-up (copying the
 * interpreter's state in and out), so as many lines are read one at a time before the next try.
 * (Whether the interpreter's state allows a batch at all is a few cheap checks, made every line.)
 */
const BATCH_WORTHWHILE_LINES = 8;
/** Chunks are scanned at most this many bytes at a time (what the fast path's memory takes). */
const SLICE_BYTES = 1 << 20;
/** Look at (at least) this many non-blank lines before deciding whether the input is G-code at all. */
const EARLY_VERDICT_LINES = 1000;

const POW10: number[] = Array.from({ length: 23 }, (_, k) => 10 ** k);

// Letters the interpreter understands; others are flagged and ignored.
const KNOWN_LETTERS = (() => {
  let mask = 0;
  for (const ch of "ABCDFGHIJKLMNPQRSTXYZ") mask |= 1 << (ch.charCodeAt(0) - 65);
  return mask;
})();
const L_N = 13;
const L_O = 14;
/** Known letters that are plain values (not G, M, N or O). */
const PLAIN_LETTERS = KNOWN_LETTERS & ~((1 << L_G) | (1 << L_M) | (1 << L_N) | (1 << L_O));

export type ScanStats = {
  lines: number;
  nonBlankLines: number;
  /** Lines whose words reached the interpreter. */
  blocks: number;
  /** Lines that were not G-code at all (bad characters, letters without numbers…). */
  badLines: number;
  blockDeleteLines: number;
  /** True if any line carried a G or M code or an axis word the interpreter accepted. */
  sawCode: boolean;
};

export class NotGcodeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "NotGcodeError";
  }
}

const enum Tape {
  /** No non-blank line yet. */
  Unknown,
  /** The first non-blank line was `%`: the program ends at the next `%` line. */
  Open,
  /** No leading `%`. */
  Absent,
  /** The closing `%` has been read; the rest of the file is not part of the program. */
  Closed,
}

export class BlockScanner {
  readonly stats: ScanStats = { lines: 0, nonBlankLines: 0, blocks: 0, badLines: 0, blockDeleteLines: 0, sawCode: false };
  private readonly words: BlockWords;
  /** The WebAssembly fast path for plain lines, or null: every line is then read in scanLine. */
  private readonly fast: FastPath | null;
  private readonly carry = new Uint8Array(MAX_LINE_BYTES + 1);
  private carryLen = 0;
  /** The current line outgrew the carry buffer: skip to its end. */
  private overflowing = false;
  /** The previous region ended in CR: an LF at the start of the next one belongs to it. */
  private skipLeadingLF = false;
  private tape = Tape.Unknown;
  private tapeOpenLine = 0;
  private reportedAfterEnd = false;
  private earlyVerdictDone = false;
  private batchBackoff = 0;

  /** `useFastPath: false` reads every line in TypeScript (the tests compare both ways). */
  constructor(
    private readonly sink: BlockSink,
    private readonly log: WarningLog,
    private readonly blockDelete: boolean,
    useFastPath = true,
  ) {
    this.fast = useFastPath ? fastPath() : null;
    this.words = new BlockWords(this.fast ?? undefined);
  }

  /** Feeds the next chunk of bytes. */
  push(chunk: Uint8Array): void {
    for (let at = 0; at < chunk.length; at += SLICE_BYTES) {
      this.pushSlice(at === 0 && chunk.length <= SLICE_BYTES ? chunk : chunk.subarray(at, at + SLICE_BYTES));
    }
  }

  private pushSlice(chunk: Uint8Array): void {
    let start = 0;
    const n = chunk.length;
    if (this.carryLen > 0 || this.overflowing) {
      let k = 0;
      while (k < n && chunk[k] !== 10 && chunk[k] !== 13) k++;
      if (k === n) {
        this.appendCarry(chunk, 0, n);
        return;
      }
      if (this.overflowing) {
        this.refuseLongLine();
      } else {
        this.appendCarry(chunk, 0, k + 1);
        if (this.overflowing) this.refuseLongLine();
        else this.scanRegion(this.carry, 0, this.carryLen);
      }
      this.carryLen = 0;
      start = k + 1;
      if (chunk[k] === 13 && start < n && chunk[start] === 10) start++;
      else if (chunk[k] === 13 && start === n) this.skipLeadingLF = true;
      else this.skipLeadingLF = false;
    }
    let last = n - 1;
    while (last >= start && chunk[last] !== 10 && chunk[last] !== 13) last--;
    if (last >= start) this.scanRegion(chunk, start, last + 1);
    if (last + 1 < n) {
      if (last >= start) this.skipLeadingLF = false;
      this.appendCarry(chunk, Math.max(last + 1, start), n);
    }
    // Checked here, once per chunk, not in scanLine: a branch first taken deep inside a big
    // file throws scanLine's optimised code away (measured: ~20 ms on the 1M-line file).
    if (!this.earlyVerdictDone && this.stats.nonBlankLines >= EARLY_VERDICT_LINES) {
      this.earlyVerdictDone = true;
      this.checkVerdict(false);
    }
  }

  /** Ends the input: reads a last line that had no line end and reports what was left open. */
  finish(): void {
    if (this.overflowing) {
      this.refuseLongLine();
    } else if (this.carryLen > 0) {
      let blank = true;
      for (let i = 0; i < this.carryLen; i++) {
        const c = this.carry[i];
        if (c !== 32 && c !== 9) {
          blank = false;
          break;
        }
      }
      this.carry[this.carryLen] = 10;
      const line = this.stats.lines + 1;
      this.scanRegion(this.carry, 0, this.carryLen + 1);
      // A missing final line end matters only if the program has not ended properly by then.
      if (!blank && !this.sink.programEnded && this.tape !== Tape.Closed) {
        this.log.add("no-final-line-end", line, "the last line has no line end: the file may have been cut short");
      }
    }
    this.carryLen = 0;
    if (this.tape === Tape.Open) {
      this.log.add("unclosed-percent", this.tapeOpenLine, "the program opens with % but no closing % line follows (RS274/NGC §3.1)");
    }
    this.checkVerdict(true);
  }

  /** True when the program was delimited by a leading and a closing `%` line. */
  get tapeClosed(): boolean {
    return this.tape === Tape.Closed;
  }

  private appendCarry(src: Uint8Array, from: number, to: number): void {
    if (this.overflowing) return;
    const len = to - from;
    if (this.carryLen + len > MAX_LINE_BYTES) {
      this.overflowing = true;
      this.carryLen = 0;
      return;
    }
    this.carry.set(src.subarray(from, to), this.carryLen);
    this.carryLen += len;
  }

  private refuseLongLine(): void {
    const line = ++this.stats.lines;
    this.stats.nonBlankLines++;
    this.stats.badLines++;
    this.overflowing = false;
    this.log.add("line-too-long", line, `line is longer than ${MAX_LINE_BYTES} bytes; it was skipped`);
  }

  /** Reads the complete lines in buf[from, to); `to` is just past a line end. */
  private scanRegion(buf: Uint8Array, from: number, to: number): void {
    const fast = this.fast;
    if (fast) {
      // into the fast path's memory (about 0.1 ms a MiB), where both readers see it
      fast.bytes.set(buf.subarray(from, to), fast.input);
      this.scanFast(fast, fast.input, fast.input + to - from);
      return;
    }
    let i = this.regionStart(buf, from, to);
    while (i < to) {
      const end = this.scanLine(buf, i);
      i = this.lineAfter(buf, end, to);
    }
  }

  /**
   * scanRegion over the fast path's memory: plain lines are read by the WebAssembly fast path,
   * every other line (and every line while the tape is undecided or the program has ended,
   * where scanLine keeps the books) by scanLine.
   */
  private scanFast(fast: FastPath, from: number, to: number): void {
    const bytes = fast.bytes;
    const counts = fast.counts;
    const fastLine = fast.fastLine;
    const stats = this.stats;
    const w = this.words;
    const sink = this.sink;
    const batching = sink.beginPlainBatch !== undefined && sink.endPlainBatch !== undefined;
    const plain = fast.plain;
    let i = this.regionStart(bytes, from, to);
    while (i < to) {
      if (this.batchBackoff > 0) {
        this.batchBackoff--;
      } else if (batching && (this.tape === Tape.Absent || this.tape === Tape.Open) && !sink.programEnded) {
        if (sink.beginPlainBatch!(plain, stats.lines)) {
          const stop = fast.runPlain(i, to);
          const b = plain.batch;
          const lines = b[BATCH_LINE] - stats.lines;
          if (lines > 0) {
            stats.lines = b[BATCH_LINE];
            stats.nonBlankLines += b[BATCH_NON_BLANK];
            stats.blocks += b[BATCH_MOVES];
            if (b[BATCH_MOVES] > 0) stats.sawCode = true;
            sink.endPlainBatch!(plain);
            if (b[BATCH_ENDED_ON_CR] !== 0) this.skipLeadingLF = true;
          }
          if (lines < BATCH_WORTHWHILE_LINES) this.batchBackoff = BATCH_WORTHWHILE_LINES;
          i = stop;
          if (i >= to) break;
        }
      }
      let read = -1;
      if ((this.tape === Tape.Absent || this.tape === Tape.Open) && !this.sink.programEnded) read = fastLine(i);
      let end = read >> 2;
      if (read >= 0 && end - i <= STANDARD_LINE_LIMIT) {
        const line = ++stats.lines;
        if ((read & FAST_HAS_WORDS) !== 0) {
          stats.nonBlankLines++;
          const present = counts[COUNT_PRESENT];
          w.present = present;
          if ((read & FAST_HAS_CODES) !== 0) {
            w.gCount = counts[COUNT_G];
            w.mCount = counts[COUNT_M];
          } else {
            w.gCount = 0;
            w.mCount = 0;
          }
          stats.blocks++;
          if (!stats.sawCode && ((present & AXIS_WORDS) !== 0 || w.gCount > 0 || w.mCount > 0)) stats.sawCode = true;
          this.sink.executeBlock(w, line);
        }
      } else {
        end = this.scanLine(bytes, i);
      }
      i = this.lineAfter(bytes, end, to);
    }
  }

  /** Where a region's first line starts: past the LF of a CRLF split from its CR by a chunk end. */
  private regionStart(buf: Uint8Array, from: number, to: number): number {
    if (!this.skipLeadingLF) return from;
    this.skipLeadingLF = false;
    return from < to && buf[from] === 10 ? from + 1 : from;
  }

  /** The start of the line after the one whose line end (CR, LF or CRLF) is at `end`. */
  private lineAfter(buf: Uint8Array, end: number, to: number): number {
    const next = end + 1;
    if (buf[end] !== 13) return next;
    if (next === to) {
      this.skipLeadingLF = true; // the LF, if any, starts the next region
      return next;
    }
    return buf[next] === 10 ? next + 1 : next;
  }

  /**
   * Tokenises one line starting at `start` and returns the index of its line end.
   * The caller guarantees a CR or LF before the end of `buf`.
   */
  private scanLine(buf: Uint8Array, start: number): number {
    const stats = this.stats;
    const line = ++stats.lines;
    const w = this.words;
    const values = w.values;
    w.reset();
    let present = 0;
    let i = start;
    let c = buf[i];
    while (c === 32 || c === 9) c = buf[++i];
    if (c === 10 || c === 13) return i; // blank line
    stats.nonBlankLines++;

    if (c === 37) return this.percentLine(buf, i, line); // %
    if (this.tape === Tape.Unknown) this.tape = Tape.Absent;
    if (c === 47) {
      // `/` block delete (edge case 5)
      stats.blockDeleteLines++;
      if (this.blockDelete) return skipToEnd(buf, i);
      c = buf[++i];
    }

    // Measured (1M-line file; scanner alone, 12 in-memory passes a process, and full analyses in
    // fresh processes, A/B alternated): none of these restructurings of the loop below beat this
    // compare chain — a 256-entry byte-class table for the token dispatch and blank skips; problem
    // exits through a helper so `problem`, `problemAt` and `hasWords` stop living across the loop;
    // a branch-free sign; the line loop fused into this function (1-2 ms off later passes, lost
    // again on the first, which waits for on-stack replacement). Scanner alone 67-72 ms either
    // way. Digits and the point in one loop, with the branch-free sign, was ~8 ms slower.
    let problem = 0; // 0 none, else a Problem code
    let problemAt = 0;
    let hasWords = false;
    for (;;) {
      if (c === 32 || c === 9) {
        c = buf[++i];
        continue;
      }
      if (c === 10 || c === 13) break;
      const letter = (c | 32) - 97;
      if (letter >= 0 && letter < 26) {
        // ---- a word: letter, then a number with optional blanks inside ----
        c = buf[++i];
        while (c === 32 || c === 9) c = buf[++i];
        let negative = false;
        if (c === 45 || c === 43) {
          negative = c === 45;
          c = buf[++i];
          while (c === 32 || c === 9) c = buf[++i];
        }
        // Fast path: digits, an optional point, digits — the way CAM writes numbers.
        // (A single unsigned compare per digit, `(c - 48) >>> 0 < 10`, measured no faster.)
        let small = 0;
        const intStart = i;
        while (c >= 48 && c <= 57) {
          small = (small * 10 + (c - 48)) | 0;
          c = buf[++i];
        }
        let digits = i - intStart;
        let decimals = 0;
        let point = false;
        if (c === 46) {
          point = true;
          c = buf[++i];
          const fracStart = i;
          while (c >= 48 && c <= 57) {
            small = (small * 10 + (c - 48)) | 0;
            c = buf[++i];
          }
          decimals = i - fracStart;
          digits += decimals;
        }
        let mantissa = digits <= 9 ? small : slowMantissa(buf, intStart, i);
        if (c === 32 || c === 9) {
          // Blanks may sit inside a number (§3.3: `X +0. 12 34` is X0.1234); usually they just end it.
          let j = i;
          let d = c;
          while (d === 32 || d === 9) d = buf[++j];
          if ((d >= 48 && d <= 57) || (d === 46 && !point)) {
            for (;;) {
              if (d >= 48 && d <= 57) {
                mantissa = mantissa * 10 + (d - 48);
                digits++;
                if (point) decimals++;
              } else if (d === 46 && !point) {
                point = true;
              } else if (d !== 32 && d !== 9) {
                break;
              }
              d = buf[++j];
            }
          }
          i = j;
          c = d;
        }
        if (digits === 0) {
          if (c === 35 || c === 91) problem = Problem.Parameters; // # or [
          else if (letter === L_O && c === 60) problem = Problem.Subroutine; // O<name>
          else problem = Problem.NoNumber;
          problemAt = letter;
          break;
        }
        if (c === 46) {
          problem = Problem.SecondPoint; // X1.2.3
          problemAt = letter;
          break;
        }
        // Measured (1M-line bench file, in-memory scan, A/B runs): neither a multiply by 10^-k in
        // place of this division, nor a branch-free finiteness test, nor reading four decimals at
        // once as a 32-bit word changed the scan time; profilers pin samples on the divide, but it
        // is not the bottleneck. The division by an exact power of ten keeps values correctly rounded.
        let value = decimals < POW10.length ? mantissa / POW10[decimals] : mantissa / 10 ** decimals;
        if (negative) value = -value;
        if (value - value !== 0) {
          // not finite (thousands of digits)
          problem = Problem.NoNumber;
          problemAt = letter;
          break;
        }
        const b = 1 << letter;
        if ((PLAIN_LETTERS & b) !== 0 && (present & b) === 0) {
          // the common case: an axis or parameter word, first of its letter on the line
          hasWords = true;
          present |= b;
          values[letter] = value;
          continue;
        }
        hasWords = true;
        // G, M, N, O, repeated and unknown letters: rare enough to live outside this loop, which
        // keeps it small for the optimising compiler (it is compiled sooner and faster).
        const outcome = this.otherWord(letter, value, present, buf, i, line);
        if (outcome < 0) {
          problem = -outcome;
          problemAt = letter;
          break;
        }
        present = outcome;
        continue;
      }
      if (c === 40) {
        // ( comment ): closed on the same line, not nested (edge case 6)
        c = buf[++i];
        while (c !== 41 && c !== 10 && c !== 13) c = buf[++i];
        if (c === 41) {
          c = buf[++i];
        } else {
          this.log.add("unclosed-comment", line, "a comment opened with ( is not closed on its line");
        }
        continue;
      }
      if (c === 59) {
        // ; comment to the end of the line (controller extension, not v3)
        while (c !== 10 && c !== 13) c = buf[++i];
        break;
      }
      if (c === 42) {
        // *nn printer-host checksum: XOR of the bytes before the * (edge case 8)
        const verdict = this.checkChecksum(buf, start, i);
        if (verdict < 0) {
          problem = Problem.Checksum;
          break;
        }
        i = verdict;
        c = buf[i];
        continue;
      }
      if (c === 35 || c === 91) problem = Problem.Parameters;
      else problem = Problem.BadCharacter;
      problemAt = c;
      break;
    }
    const end = problem === 0 ? i : skipToEnd(buf, i);
    const length = end - start;
    if (length > MAX_LINE_BYTES) {
      stats.badLines++;
      this.log.add("line-too-long", line, `line is longer than ${MAX_LINE_BYTES} bytes; it was skipped`);
      return end;
    }
    if (length > STANDARD_LINE_LIMIT) {
      this.log.add("line-over-256", line, `line has ${length} characters; RS274/NGC allows 256`);
    }
    if (problem !== 0) {
      this.reportProblem(problem, problemAt, line);
      return end;
    }
    if (!hasWords) return end; // comment-only line
    w.present = present;
    if (this.tape === Tape.Closed || this.sink.programEnded) {
      if (!this.reportedAfterEnd) {
        this.reportedAfterEnd = true;
        this.log.add("text-after-end", line, "code after the end of the program (M2/M30 or closing %) is not run");
      }
      return end;
    }
    stats.blocks++;
    if (!stats.sawCode && ((present & AXIS_WORDS) !== 0 || w.gCount > 0 || w.mCount > 0)) stats.sawCode = true;
    this.sink.executeBlock(w, line);
    return end;
  }

  /** Reads a word other than a first plain value; returns the new `present`, or −Problem. */
  private otherWord(letter: number, value: number, present: number, buf: Uint8Array, i: number, line: number): number {
    const w = this.words;
    if (letter === L_G) {
      const code = Math.round(value * 10);
      if (Math.abs(value * 10 - code) > 0.001 || w.gCount === MAX_G_PER_BLOCK) return -Problem.BadCode;
      w.gCodes[w.gCount++] = code;
    } else if (letter === L_M) {
      const code = Math.round(value);
      if (Math.abs(value - code) > 0.0001 || w.mCount === MAX_M_PER_BLOCK) return -Problem.BadCode;
      w.mCodes[w.mCount++] = code;
    } else if (letter === L_N) {
      // line number: no meaning for the analysis (edge case 4)
    } else if (letter === L_O) {
      // program number (tolerated) unless more code follows: then it is O-word flow control
      let c = buf[i];
      while (c === 32 || c === 9) c = buf[++i];
      if (c !== 10 && c !== 13 && c !== 40 && c !== 59) return -Problem.Subroutine;
    } else {
      const b = 1 << letter;
      if ((KNOWN_LETTERS & b) === 0) {
        this.log.add("unsupported-word", line, () => `${String.fromCharCode(65 + letter)} words are not RS274/NGC axes or parameters; ignored`);
      } else if ((present & b) !== 0) {
        return -Problem.Repeated;
      } else {
        w.values[letter] = value;
        return present | b;
      }
    }
    return present;
  }

  private percentLine(buf: Uint8Array, i: number, line: number): number {
    // Any text after % on the line (a tape name) is ignored.
    const end = skipToEnd(buf, i);
    if (this.tape === Tape.Unknown) {
      this.tape = Tape.Open;
      this.tapeOpenLine = line;
    } else if (this.tape === Tape.Open) {
      this.tape = Tape.Closed;
    } else if (this.tape === Tape.Absent && !this.sink.programEnded) {
      this.log.add("stray-percent", line, "a % line that is not the first line of the program is ignored (RS274/NGC §3.1)");
    }
    return end;
  }

  /** Returns the index after the checksum digits if it matches, else -1. */
  private checkChecksum(buf: Uint8Array, lineStart: number, star: number): number {
    let sum = 0;
    for (let k = lineStart; k < star; k++) sum ^= buf[k];
    let i = star + 1;
    let c = buf[i];
    let value = 0;
    let digits = 0;
    while (c >= 48 && c <= 57) {
      value = value * 10 + (c - 48);
      digits++;
      c = buf[++i];
    }
    const line = this.stats.lines;
    if (digits === 0 || value !== sum) {
      this.log.add("checksum-mismatch", line, `checksum *${digits ? value : ""} does not match the line (expected *${sum}); line skipped`);
      return -1;
    }
    this.log.once("checksum-stripped", line, "*nn checksums are a 3D-printer host convention, not RS274/NGC; verified and stripped");
    return i;
  }

  private reportProblem(problem: Problem, at: number, line: number): void {
    this.stats.badLines++;
    const letter = String.fromCharCode(65 + at);
    switch (problem) {
      case Problem.NoNumber:
        this.log.add("malformed-number", line, () => `${letter} is not followed by a number; line skipped`);
        break;
      case Problem.SecondPoint:
        this.log.add("malformed-number", line, () => `${letter} has a number with two decimal points; line skipped`);
        break;
      case Problem.BadCode:
        this.log.add("malformed-block", line, () => `${letter} code is not a valid code number (or too many on one line); line skipped`);
        break;
      case Problem.Repeated:
        this.stats.badLines--; // still G-code, just invalid
        this.log.add("repeated-word", line, () => `${letter} appears twice on the line (RS274/NGC allows it once); line skipped`);
        break;
      case Problem.Parameters:
        this.stats.badLines--;
        this.log.add("parameters-not-supported", line, "parameters (#) and expressions ([ ]) are not evaluated; line skipped, later positions may be wrong");
        break;
      case Problem.Subroutine:
        this.stats.badLines--;
        this.log.add("subroutine-not-supported", line, "O-word subroutines and flow control are not run; line skipped, later positions may be wrong");
        break;
      case Problem.Checksum:
        break;
      case Problem.BadCharacter: {
        const shown = at >= 33 && at < 127 ? `"${String.fromCharCode(at)}"` : `byte 0x${at.toString(16).padStart(2, "0")}`;
        this.log.add("bad-character", line, () => `${shown} cannot appear in G-code outside a comment; line skipped`);
        break;
      }
    }
  }

  /** Refuses input that is mostly not G-code: early on big files, at the end on small ones. */
  private checkVerdict(final: boolean): void {
    const { nonBlankLines, badLines, sawCode } = this.stats;
    if (nonBlankLines === 0) return;
    if (badLines * 2 > nonBlankLines) {
      throw new NotGcodeError(`${badLines} of the first ${nonBlankLines} non-blank lines are not G-code`);
    }
    if (final && !sawCode) throw new NotGcodeError("no G or M codes and no axis words found");
  }
}

const enum Problem {
  None = 0,
  NoNumber,
  SecondPoint,
  BadCode,
  Repeated,
  Parameters,
  Subroutine,
  Checksum,
  BadCharacter,
}

/** Digits of buf[from, to) (a point may sit among them) as one float, for numbers of 10 or more digits. */
function slowMantissa(buf: Uint8Array, from: number, to: number): number {
  let m = 0;
  for (let k = from; k < to; k++) {
    const d = buf[k];
    if (d >= 48 && d <= 57) m = m * 10 + (d - 48);
  }
  return m;
}

function skipToEnd(buf: Uint8Array, i: number): number {
  let c = buf[i];
  while (c !== 10 && c !== 13) c = buf[++i];
  return i;
}
