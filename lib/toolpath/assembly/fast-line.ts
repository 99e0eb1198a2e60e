/**
 * AssemblyScript (compiled to WebAssembly by `npm run build:wasm`, with plain-moves.ts): the
 * scanner's fast path for the plain lines that make up nearly all of a program,
 * `G1 X… Y… Z… A… B… F…`.
 *
 * It reads one line from linear memory and writes its words to fixed addresses that the
 * scanner's BlockWords views directly, so nothing is copied back. Anything it does not handle
 * itself — comments, checksums, blanks inside a number, numbers of ten or more digits,
 * parameters, O words, unknown or repeated letters, bad codes, any other character — makes it
 * return −1, and the TypeScript scanner reads that line instead, with its warnings. The rules it
 * does apply are the scanner's (scanner.ts), and a test checks both agree on every line kind.
 */

import { INPUT_AT } from "./layout";

// Output block: the words of the last line read (fast-path.ts views them).
export const VALUES: usize = 0; // 26 f64, one per letter
export const PRESENT: usize = 208; // i32: bit per letter
export const G_COUNT: usize = 212;
export const M_COUNT: usize = 216;
export const G_CODES: usize = 256; // 16 i32 (G code × 10)
export const M_CODES: usize = 320; // 8 i32
const POW10: usize = 384; // 10 f64: 10^0 … 10^9
/** The text to scan is copied here. */
export const INPUT: usize = INPUT_AT;

const L_G: i32 = 6;
const L_M: i32 = 12;
const L_N: i32 = 13;
const MAX_G: i32 = 16;
const MAX_M: i32 = 8;
/** A B C D F H I J K L P Q R S T X Y Z: the letters read as plain values. */
const PLAIN: i32 = 0b11100011111000111110101111;

export function init(): void {
  let p: f64 = 1;
  for (let k = 0; k < 10; k++) {
    store<f64>(POW10 + (<usize>k << 3), p);
    p *= 10;
  }
}

@inline function isBlank(c: i32): bool {
  return c == 32 || c == 9;
}

@inline function isDigit(c: i32): bool {
  return <u32>(c - 48) < 10;
}

/**
 * Reads the line starting at `at`. Returns −1, or the index of its line end (CR or LF) times 4
 * plus 1 if the line has words and 2 if it has G or M codes (so a plain line needs no more reads).
 */
export function fastLine(at: i32): i32 {
  return readLine(<usize>at);
}

@inline export function readLine(at: usize): i32 {
  let i = at;
  let present: i32 = 0;
  let gCount: i32 = 0;
  let mCount: i32 = 0;
  let hasWords: i32 = 0;
  let c = <i32>load<u8>(i);
  while (true) {
    if (isBlank(c)) {
      c = <i32>load<u8>(++i);
      continue;
    }
    if (c == 10 || c == 13) break;
    const letter = (c | 32) - 97;
    if (<u32>letter >= 26) return -1;
    c = <i32>load<u8>(++i);
    while (isBlank(c)) c = <i32>load<u8>(++i);
    let negative = false;
    if (c == 45 || c == 43) {
      negative = c == 45;
      c = <i32>load<u8>(++i);
      while (isBlank(c)) c = <i32>load<u8>(++i);
    }
    let mantissa: i32 = 0;
    let digits: i32 = 0;
    while (isDigit(c)) {
      mantissa = mantissa * 10 + (c - 48);
      digits++;
      c = <i32>load<u8>(++i);
    }
    let decimals: i32 = 0;
    let point = false;
    if (c == 46) {
      point = true;
      c = <i32>load<u8>(++i);
      while (isDigit(c)) {
        mantissa = mantissa * 10 + (c - 48);
        decimals++;
        c = <i32>load<u8>(++i);
      }
      digits += decimals;
    }
    if (isBlank(c)) {
      let j = i;
      let d = c;
      while (isBlank(d)) d = <i32>load<u8>(++j);
      if (isDigit(d) || (d == 46 && !point)) return -1; // a blank inside the number
      i = j;
      c = d;
    }
    // no digits, more than fit an i32 exactly, or a second point
    if (digits == 0 || digits > 9 || c == 46) return -1;
    // exact: an integer below 2^31 divided by an exact power of ten, correctly rounded
    let value = <f64>mantissa / load<f64>(POW10 + (<usize>decimals << 3));
    if (negative) value = -value;
    hasWords = 1;
    const bit = 1 << letter;
    if ((PLAIN & bit) != 0 && (present & bit) == 0) {
      present |= bit;
      store<f64>(VALUES + (<usize>letter << 3), value);
      continue;
    }
    if ((letter == L_G || letter == L_M) && Math.abs(value) >= 1e8) return -1; // no such code
    if (letter == L_G) {
      const code = Math.round(value * 10);
      if (Math.abs(value * 10 - code) > 0.001 || gCount == MAX_G) return -1;
      store<i32>(G_CODES + (<usize>gCount << 2), <i32>code);
      gCount++;
      continue;
    }
    if (letter == L_M) {
      const code = Math.round(value);
      if (Math.abs(value - code) > 0.0001 || mCount == MAX_M) return -1;
      store<i32>(M_CODES + (<usize>mCount << 2), <i32>code);
      mCount++;
      continue;
    }
    if (letter == L_N) continue; // line number: no meaning for the analysis
    return -1; // O, unknown or repeated letters
  }
  store<i32>(PRESENT, present);
  store<i32>(G_COUNT, gCount);
  store<i32>(M_COUNT, mCount);
  return (<i32>i << 2) | (gCount + mCount > 0 ? 2 : 0) | hasWords;
}
