import type { ByteCursor } from "./bytes";

/**
 * Number and token scanning straight from bytes: no per-line strings, no regular expressions.
 * Numbers are read as an integer mantissa and a power of ten; one correctly rounded multiply or
 * divide by an exact power (≤ 1e22) gives the double. Rare forms fall back to parseFloat.
 */
const POW10: number[] = [];
for (let k = 0; k <= 22; k++) POW10.push(Number(`1e${k}`));

const decoder = new TextDecoder();

export function bytesToText(b: Uint8Array, start: number, end: number): string {
  return decoder.decode(b.subarray(start, end));
}

/** The number in b[start..end), or NaN when that text is not a finite decimal number. */
export function parseDecimal(b: Uint8Array, start: number, end: number): number {
  let i = start;
  let neg = false;
  let c = b[i];
  if (c === 45) {
    neg = true;
    i++;
  } else if (c === 43) {
    i++;
  }
  let mant = 0;
  let sig = 0; // significant digits kept in the mantissa (≤ 15 keeps it an exact integer)
  let exp = 0;
  let sawDigit = false;
  while (i < end) {
    const d = b[i] - 48;
    if (d < 0 || d > 9) break;
    if (sig < 15) {
      mant = mant * 10 + d;
      if (mant !== 0) sig++;
    } else {
      exp++;
    }
    sawDigit = true;
    i++;
  }
  if (i < end && b[i] === 46) {
    i++;
    while (i < end) {
      const d = b[i] - 48;
      if (d < 0 || d > 9) break;
      if (sig < 15) {
        mant = mant * 10 + d;
        if (mant !== 0) sig++;
        exp--;
      }
      sawDigit = true;
      i++;
    }
  }
  if (!sawDigit) return NaN;
  if (i < end && (b[i] === 101 || b[i] === 69)) {
    i++;
    let eneg = false;
    if (b[i] === 45) {
      eneg = true;
      i++;
    } else if (b[i] === 43) {
      i++;
    }
    let e = 0;
    let eDigits = 0;
    while (i < end) {
      const d = b[i] - 48;
      if (d < 0 || d > 9) break;
      e = e * 10 + d;
      eDigits++;
      i++;
    }
    if (eDigits === 0) return NaN;
    exp += eneg ? -e : e;
  }
  if (i !== end) return NaN;
  let v: number;
  if (exp === 0) v = mant;
  else if (exp > 0 && exp <= 22) v = mant * POW10[exp];
  else if (exp < 0 && exp >= -22) v = mant / POW10[-exp];
  else v = Number.parseFloat(bytesToText(b, start, end));
  if (!Number.isFinite(v)) return NaN;
  return neg ? -v : v;
}

function isSpace(c: number): boolean {
  return c === 32 || c === 10 || c === 13 || c === 9 || c === 11 || c === 12;
}

/**
 * Whitespace-separated tokens over a ByteCursor. Tokens are only handed out up to the last
 * whitespace byte of the window, so a token is never cut by a chunk boundary.
 */
export class TokenScanner {
  line = 1;
  tokStart = 0;
  tokEnd = 0;
  /** End of the part of the window that holds only whole tokens. */
  limit = 0;

  constructor(
    readonly cur: ByteCursor,
    firstLine = 1,
  ) {
    this.line = firstLine;
    this.setLimit();
  }

  private setLimit(): void {
    const { buf, pos, end } = this.cur;
    if (this.cur.eof) {
      this.limit = end;
      return;
    }
    let i = end - 1;
    while (i >= pos && !isSpace(buf[i])) i--;
    this.limit = i + 1; // pos when the window has no whitespace at all
  }

  /** Next token inside the current window; false means "call refill()". */
  next(): boolean {
    const b = this.cur.buf;
    const lim = this.limit;
    let i = this.cur.pos;
    while (i < lim) {
      const c = b[i];
      if (c === 10) this.line++;
      else if (!isSpace(c)) break;
      i++;
    }
    if (i >= lim) {
      this.cur.pos = i;
      return false;
    }
    const start = i;
    while (i < lim && !isSpace(b[i])) i++;
    this.tokStart = start;
    this.tokEnd = i;
    this.cur.pos = i;
    return true;
  }

  /** Pulls more bytes; false when the source is exhausted (no token will follow). */
  async refill(): Promise<boolean> {
    if (this.cur.eof) return false;
    await this.cur.more();
    this.setLimit();
    return true;
  }

  async nextAsync(): Promise<boolean> {
    while (!this.next()) {
      if (!(await this.refill())) return false;
    }
    return true;
  }

  number(): number {
    return parseDecimal(this.cur.buf, this.tokStart, this.tokEnd);
  }

  text(): string {
    return bytesToText(this.cur.buf, this.tokStart, this.tokEnd);
  }

  /** True when the current token equals the ASCII word, ignoring case. */
  is(word: string): boolean {
    if (this.tokEnd - this.tokStart !== word.length) return false;
    const b = this.cur.buf;
    for (let k = 0; k < word.length; k++) {
      if ((b[this.tokStart + k] | 32) !== (word.charCodeAt(k) | 32)) return false;
    }
    return true;
  }

  /** Skips the rest of the current line (for names after `solid`, comments…). */
  async skipLine(): Promise<void> {
    for (;;) {
      const b = this.cur.buf;
      let i = this.cur.pos;
      while (i < this.cur.end && b[i] !== 10) i++;
      this.cur.pos = i;
      if (i < this.cur.end) {
        // Leave the newline for next() so the line count stays right.
        this.setLimit();
        return;
      }
      if (!(await this.refill())) return;
    }
  }
}
