/** Which tool was in the spindle when, and what it did: feeds, speeds, length, time. */
import type { LineRange, ToolUsage } from "./types";

const MAX_RANGES_PER_TOOL = 1000;
/** Distinct tools listed one by one; any further ones share one record numbered −1. */
export const MAX_LISTED_TOOLS = 1000;
export const OTHER_TOOLS = -1;

/** Slots of ToolRecord.stats (a typed array, so updates in the hot loop never box doubles). */
export const TOOL_FEED_LOW = 0;
export const TOOL_FEED_HIGH = 1;
export const TOOL_RPM_LOW = 2;
export const TOOL_RPM_HIGH = 3;
export const TOOL_FEED_MM = 4;
export const TOOL_FEED_MIN = 5;

export class ToolRecord {
  readonly ranges: LineRange[] = [];
  firstLine = 0;
  lastLine = 0;
  readonly stats = Float64Array.of(Infinity, -Infinity, Infinity, -Infinity, 0, 0);
  readonly lengthOffsets: number[] = [];
  /** The open span, updated while the tool is in the spindle. */
  current: LineRange | null = null;

  constructor(readonly number: number) {}

  toUsage(): ToolUsage {
    const s = this.stats;
    return {
      number: this.number,
      ranges: this.ranges.map((r) => ({ ...r })),
      firstLine: this.firstLine,
      lastLine: this.lastLine,
      feedMmPerMin: s[TOOL_FEED_HIGH] >= s[TOOL_FEED_LOW] ? { min: s[TOOL_FEED_LOW], max: s[TOOL_FEED_HIGH] } : null,
      spindleRpm: s[TOOL_RPM_HIGH] >= s[TOOL_RPM_LOW] ? { min: s[TOOL_RPM_LOW], max: s[TOOL_RPM_HIGH] } : null,
      feedLengthMm: s[TOOL_FEED_MM],
      feedTimeS: s[TOOL_FEED_MIN] * 60,
      lengthOffsets: [...this.lengthOffsets],
    };
  }
}

export class ToolLog {
  private readonly byNumber = new Map<number, ToolRecord>();
  /** Tools in order of first use. */
  readonly order: ToolRecord[] = [];
  active: ToolRecord | null = null;

  /** The tool `number` enters the spindle at `line` (M6, or the first cut with the unknown tool 0). */
  mount(number: number, line: number): ToolRecord {
    if (this.active?.current) this.active.current = null;
    let record = this.byNumber.get(number);
    if (!record && this.order.length >= MAX_LISTED_TOOLS) {
      number = OTHER_TOOLS;
      record = this.byNumber.get(number);
    }
    if (!record) {
      record = new ToolRecord(number);
      record.firstLine = line;
      this.byNumber.set(number, record);
      this.order.push(record);
    }
    const span = { from: line, to: line };
    if (record.ranges.length < MAX_RANGES_PER_TOOL) record.ranges.push(span);
    record.current = span;
    record.lastLine = line;
    this.active = record;
    return record;
  }

  /** Marks the active tool as used up to `line`. */
  touch(line: number): void {
    const a = this.active;
    if (!a) return;
    a.lastLine = line;
    if (a.current) a.current.to = line;
  }

  usages(): ToolUsage[] {
    return this.order.map((t) => t.toUsage());
  }

  numbers(): number[] {
    return this.order.map((t) => t.number);
  }

  /** Index in order of first use (for preview flags). */
  indexOf(record: ToolRecord): number {
    return this.order.indexOf(record);
  }
}
