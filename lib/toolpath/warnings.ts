/**
 * Warnings with line numbers, bounded: a 10-million-line program with the same fault on every
 * line must not turn into 10 million objects. Every occurrence is counted; only the first few
 * of each kind are kept with their text.
 */
import type { ToolpathWarning, WarningCode } from "./types";

const KEEP_PER_CODE = 25;
const KEEP_TOTAL = 500;

export class WarningLog {
  readonly list: ToolpathWarning[] = [];
  readonly counts: Partial<Record<WarningCode, number>> = {};
  truncated = false;

  /** `message` may be a function so hot paths do not build text that will be thrown away. */
  add(code: WarningCode, line: number, message: string | (() => string)): void {
    const seen = (this.counts[code] ?? 0) + 1;
    this.counts[code] = seen;
    if (seen > KEEP_PER_CODE || this.list.length >= KEEP_TOTAL) {
      this.truncated = true;
      return;
    }
    this.list.push({ line, code, message: typeof message === "function" ? message() : message });
  }

  /** Records a kind of warning only the first time it happens. */
  once(code: WarningCode, line: number, message: string | (() => string)): void {
    if (this.counts[code] === undefined) this.add(code, line, message);
  }

  count(code: WarningCode): number {
    return this.counts[code] ?? 0;
  }

  /** Kept warnings in line order (stable for equal lines). */
  sorted(): ToolpathWarning[] {
    return [...this.list].sort((a, b) => a.line - b.line);
  }
}
