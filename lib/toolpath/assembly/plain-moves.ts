/**
 * AssemblyScript: runs a stretch of plain motion lines (`X… Y… Z… A… B… C… F…` in G0 or G1) in
 * one call, from the scanner's text, so the bulk of a program never goes through JavaScript.
 *
 * The interpreter (interpreter.ts, beginPlainBatch / endPlainBatch) copies its state in before
 * and out after. Each line is first checked against everything that would make the TypeScript
 * interpreter do more than measure it — an axis not yet known or used, a negative F, a cut with
 * no tool, spindle or feed, inverse time, a feed over the machine's limit, a position outside
 * the alarm range, G or M codes, a long line — and the batch stops before any such line,
 * leaving it untouched for TypeScript. The arithmetic is the interpreter's own
 * (Interpreter.plainStraight and cut), in the same order, so the sums come out bit for bit the
 * same; a test compares whole analyses both ways.
 */
import { readLine, PRESENT, VALUES } from "./fast-line";
import { QUEUE_AT, QUEUE_POINTS, STATE_AT } from "./layout";

// State, in f64 slots from STATE_AT…
export const POS: usize = STATE_AT; // 6: X Y Z (mm) A B C (deg)
export const SUMS: usize = POS + 48; // 8: feed mm, rapid mm, feed min, rapid min, dwell s, rotary A B C
export const MIN: usize = SUMS + 64; // 6
export const MAX: usize = MIN + 48; // 6
export const TOOL_STATS: usize = MAX + 48; // 6: feed low, high, rpm low, high, feed mm, feed min
export const RAPID_RATE: usize = TOOL_STATS + 48; // 6
export const ALARM_LO: usize = RAPID_RATE + 48; // 6
export const ALARM_HI: usize = ALARM_LO + 48; // 6
export const MODE_F: usize = ALARM_HI + 48; // 4: feed, scale (1 or 25.4), max feed (+∞ unchecked), spindle rpm
// …then i32 slots
export const MIN_LINE: usize = MODE_F + 32; // 6
export const MAX_LINE: usize = MIN_LINE + 24; // 6
export const MODE_I: usize = MAX_LINE + 24; // 8: see M_* below
export const BATCH: usize = MODE_I + 32; // 8: see B_* below

const F_FEED: usize = 0;
const F_SCALE: usize = 8;
const F_MAX_FEED: usize = 16;
const F_RPM: usize = 24;
const M_RAPID: usize = 0; // 1 in G0, 0 in G1
const M_INCREMENTAL: usize = 4;
const M_AXES_OK: usize = 8; // axes known and used before (bit per axis index)
const M_XYZ_KNOWN: usize = 12;
const M_PREVIEW_FLAGS: usize = 16; // tool bits of the preview
const M_INCH: usize = 20;
const M_CUT_OK: usize = 24; // a tool in, the spindle on, G94
const M_SPINDLE_ON: usize = 28;
const B_LINE: usize = 0; // in: lines read so far; out: after the batch
const B_NON_BLANK: usize = 4; // out
const B_MOVES: usize = 8; // out: motion lines run
const B_LAST_MOVE_LINE: usize = 12; // out: for the tool's line range
const B_QUEUED: usize = 16; // out: preview points queued
const B_ENDED_ON_CR: usize = 20; // out: the text ended on a CR (its LF may start the next chunk)

const S_FEED_MM = 0;
const S_RAPID_MM = 1;
const S_FEED_MIN = 2;
const S_RAPID_MIN = 3;
const S_ROTARY_A = 5;
const T_FEED_LOW = 0;
const T_FEED_HIGH = 1;
const T_RPM_LOW = 2;
const T_RPM_HIGH = 3;
const T_FEED_MM = 4;
const T_FEED_MIN = 5;

const MM_PER_INCH: f64 = 25.4;
const STANDARD_LINE_LIMIT: usize = 256;
const PREVIEW_RAPID: i32 = 1;
// letters
const L_A = 0;
const L_B = 1;
const L_C = 2;
const L_F = 5;
const L_X = 23;
const L_Y = 24;
const L_Z = 25;
const AXIS_WORDS: i32 = (1 << L_X) | (1 << L_Y) | (1 << L_Z) | (1 << L_A) | (1 << L_B) | (1 << L_C);
const PLAIN_MOTION_WORDS: i32 = AXIS_WORDS | (1 << L_F);

@inline function f64At(base: usize, k: i32): f64 {
  return load<f64>(base + (<usize>k << 3));
}
@inline function setF64(base: usize, k: i32, v: f64): void {
  store<f64>(base + (<usize>k << 3), v);
}
@inline function word(letter: i32): f64 {
  return load<f64>(VALUES + (<usize>letter << 3));
}

/** Runs the plain motion lines from `at` (before `to`); returns where TypeScript takes over. */
export function runPlain(at: i32, to: i32): i32 {
  let i = <usize>at;
  const end = <usize>to;
  let line = load<i32>(BATCH + B_LINE);
  let nonBlank: i32 = 0;
  let moves: i32 = 0;
  let lastMoveLine: i32 = 0;
  let queued: i32 = 0;
  let endedOnCr: i32 = 0;
  while (i < end && queued < QUEUE_POINTS) {
    const read = readLine(i);
    if (read < 0) break;
    const lineEnd = <usize>(read >> 2);
    if (lineEnd - i > STANDARD_LINE_LIMIT) break;
    if ((read & 1) != 0) {
      if ((read & 2) != 0) break; // G or M codes
      const present = load<i32>(PRESENT);
      if ((present & ~PLAIN_MOTION_WORDS) != 0 || (present & AXIS_WORDS) == 0) break;
      const queuedNow = plainMove(present, line + 1, queued);
      if (queuedNow < 0) break;
      queued = queuedNow;
      nonBlank++;
      moves++;
      lastMoveLine = line + 1;
    }
    line++;
    let next = lineEnd + 1;
    if (load<u8>(lineEnd) == 13) {
      if (next == end) endedOnCr = 1;
      else if (load<u8>(next) == 10) next++;
    }
    i = next;
  }
  store<i32>(BATCH + B_LINE, line);
  store<i32>(BATCH + B_NON_BLANK, nonBlank);
  store<i32>(BATCH + B_MOVES, moves);
  store<i32>(BATCH + B_LAST_MOVE_LINE, lastMoveLine);
  store<i32>(BATCH + B_QUEUED, queued);
  store<i32>(BATCH + B_ENDED_ON_CR, endedOnCr);
  return <i32>i;
}

/**
 * One plain move: the checks first (−1 leaves everything untouched), then the measurement.
 * Returns the count of queued preview points after it.
 */
@inline function plainMove(present: i32, line: i32, queued: i32): i32 {
  const scale = load<f64>(MODE_F + F_SCALE);
  const inc = load<i32>(MODE_I + M_INCREMENTAL) != 0;
  const p0 = f64At(POS, 0);
  const p1 = f64At(POS, 1);
  const p2 = f64At(POS, 2);
  const p3 = f64At(POS, 3);
  const p4 = f64At(POS, 4);
  const p5 = f64At(POS, 5);
  let x = p0;
  let y = p1;
  let z = p2;
  let a = p3;
  let b = p4;
  let c = p5;
  let named: i32 = 0;
  if ((present & (1 << L_X)) != 0) {
    named |= 1;
    x = inc ? p0 + word(L_X) * scale : word(L_X) * scale;
  }
  if ((present & (1 << L_Y)) != 0) {
    named |= 2;
    y = inc ? p1 + word(L_Y) * scale : word(L_Y) * scale;
  }
  if ((present & (1 << L_Z)) != 0) {
    named |= 4;
    z = inc ? p2 + word(L_Z) * scale : word(L_Z) * scale;
  }
  if ((present & (1 << L_A)) != 0) {
    named |= 8;
    a = inc ? p3 + word(L_A) : word(L_A);
  }
  if ((present & (1 << L_B)) != 0) {
    named |= 16;
    b = inc ? p4 + word(L_B) : word(L_B);
  }
  if ((present & (1 << L_C)) != 0) {
    named |= 32;
    c = inc ? p5 + word(L_C) : word(L_C);
  }
  if ((named & ~load<i32>(MODE_I + M_AXES_OK)) != 0) return -1;
  let feed = load<f64>(MODE_F + F_FEED);
  if ((present & (1 << L_F)) != 0) {
    const f = word(L_F);
    if (f < 0) return -1; // TypeScript warns
    feed = f;
  }
  // positions outside the alarm range are left to TypeScript, which records the violation
  if ((named & 1) != 0 && (x < f64At(ALARM_LO, 0) || x > f64At(ALARM_HI, 0))) return -1;
  if ((named & 2) != 0 && (y < f64At(ALARM_LO, 1) || y > f64At(ALARM_HI, 1))) return -1;
  if ((named & 4) != 0 && (z < f64At(ALARM_LO, 2) || z > f64At(ALARM_HI, 2))) return -1;
  if ((named & 8) != 0 && (a < f64At(ALARM_LO, 3) || a > f64At(ALARM_HI, 3))) return -1;
  if ((named & 16) != 0 && (b < f64At(ALARM_LO, 4) || b > f64At(ALARM_HI, 4))) return -1;
  if ((named & 32) != 0 && (c < f64At(ALARM_LO, 5) || c > f64At(ALARM_HI, 5))) return -1;
  const rapid = load<i32>(MODE_I + M_RAPID) != 0;
  const dx = x - p0;
  const dy = y - p1;
  const dz = z - p2;
  const xyz = Math.sqrt(dx * dx + dy * dy + dz * dz);
  let rate: f64 = 0;
  if (!rapid) {
    if (load<i32>(MODE_I + M_CUT_OK) == 0 || !(feed > 0)) return -1;
    if (xyz > 0) {
      rate = load<i32>(MODE_I + M_INCH) != 0 ? feed * MM_PER_INCH : feed;
      if (rate > load<f64>(MODE_F + F_MAX_FEED)) return -1;
    }
  }

  // ---- the move: Interpreter.plainStraight, then cut ----
  setF64(MODE_F, 0, feed);
  let rot: f64 = 0;
  if ((named & 56) != 0) {
    const da = a - p3;
    const db = b - p4;
    const dc = c - p5;
    setF64(SUMS, S_ROTARY_A, f64At(SUMS, S_ROTARY_A) + Math.abs(da));
    setF64(SUMS, S_ROTARY_A + 1, f64At(SUMS, S_ROTARY_A + 1) + Math.abs(db));
    setF64(SUMS, S_ROTARY_A + 2, f64At(SUMS, S_ROTARY_A + 2) + Math.abs(dc));
    rot = Math.sqrt(da * da + db * db + dc * dc);
  }
  if (rapid) {
    setF64(SUMS, S_RAPID_MM, f64At(SUMS, S_RAPID_MM) + xyz);
    let t = Math.abs(dx) / f64At(RAPID_RATE, 0);
    let u = Math.abs(dy) / f64At(RAPID_RATE, 1);
    if (u > t) t = u;
    u = Math.abs(dz) / f64At(RAPID_RATE, 2);
    if (u > t) t = u;
    u = Math.abs(a - p3) / f64At(RAPID_RATE, 3);
    if (u > t) t = u;
    u = Math.abs(b - p4) / f64At(RAPID_RATE, 4);
    if (u > t) t = u;
    u = Math.abs(c - p5) / f64At(RAPID_RATE, 5);
    if (u > t) t = u;
    setF64(SUMS, S_RAPID_MIN, f64At(SUMS, S_RAPID_MIN) + t);
  } else {
    const minutes = xyz > 0 ? xyz / rate : rot / feed;
    setF64(SUMS, S_FEED_MM, f64At(SUMS, S_FEED_MM) + xyz);
    setF64(SUMS, S_FEED_MIN, f64At(SUMS, S_FEED_MIN) + minutes);
    setF64(TOOL_STATS, T_FEED_MM, f64At(TOOL_STATS, T_FEED_MM) + xyz);
    setF64(TOOL_STATS, T_FEED_MIN, f64At(TOOL_STATS, T_FEED_MIN) + minutes);
    if (rate > 0) {
      if (rate < f64At(TOOL_STATS, T_FEED_LOW)) setF64(TOOL_STATS, T_FEED_LOW, rate);
      if (rate > f64At(TOOL_STATS, T_FEED_HIGH)) setF64(TOOL_STATS, T_FEED_HIGH, rate);
    }
    if (load<i32>(MODE_I + M_SPINDLE_ON) != 0) {
      const rpm = load<f64>(MODE_F + F_RPM);
      if (rpm < f64At(TOOL_STATS, T_RPM_LOW)) setF64(TOOL_STATS, T_RPM_LOW, rpm);
      if (rpm > f64At(TOOL_STATS, T_RPM_HIGH)) setF64(TOOL_STATS, T_RPM_HIGH, rpm);
    }
  }
  if ((named & 1) != 0) extend(0, x, line);
  if ((named & 2) != 0) extend(1, y, line);
  if ((named & 4) != 0) extend(2, z, line);
  if ((named & 8) != 0) extend(3, a, line);
  if ((named & 16) != 0) extend(4, b, line);
  if ((named & 32) != 0) extend(5, c, line);
  setF64(POS, 0, x);
  setF64(POS, 1, y);
  setF64(POS, 2, z);
  setF64(POS, 3, a);
  setF64(POS, 4, b);
  setF64(POS, 5, c);
  if (load<i32>(MODE_I + M_XYZ_KNOWN) != 0 && (dx != 0 || dy != 0 || dz != 0)) {
    const q = QUEUE_AT + (<usize>queued << 5);
    store<f64>(q, x);
    store<f64>(q + 8, y);
    store<f64>(q + 16, z);
    store<i32>(q + 24, load<i32>(MODE_I + M_PREVIEW_FLAGS) | (rapid ? PREVIEW_RAPID : 0));
    store<i32>(q + 28, line);
    return queued + 1;
  }
  return queued;
}

@inline function extend(k: i32, v: f64, line: i32): void {
  if (v < f64At(MIN, k)) {
    setF64(MIN, k, v);
    store<i32>(MIN_LINE + (<usize>k << 2), line);
  }
  if (v > f64At(MAX, k)) {
    setF64(MAX, k, v);
    store<i32>(MAX_LINE + (<usize>k << 2), line);
  }
}
