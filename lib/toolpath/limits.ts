/**
 * Checks against the machine profile and the fixture plate's envelope, aggregated per rule:
 * one violation per axis and side (or per feed/spindle limit) with its first line, its worst
 * excursion and how many moves broke it, so a bad program yields a short list.
 *
 * Positions are work coordinates. Machine travel is given in machine coordinates, so it can be
 * checked point by point only when the plate tells us where work zero sits on the machine;
 * otherwise only the program's extent is compared with the travel span.
 */
import {
  AXIS_NAMES,
  type AxisBounds,
  type AxisName,
  type ChecksRun,
  type MachineProfile,
  type PlateEnvelope,
  type ToolpathViolation,
  type ViolationKind,
} from "./types";

type Rule = { kind: ViolationKind; lo: number; hi: number; offset: number };

const AXIS_INDEX: Record<AxisName, number> = { X: 0, Y: 1, Z: 2, A: 3, B: 4, C: 5 };

export class LimitChecker {
  /** Tightest bounds of all point rules per axis: values inside need no closer look. */
  readonly alarmLo = new Float64Array(6).fill(-Infinity);
  readonly alarmHi = new Float64Array(6).fill(Infinity);
  readonly checks: ChecksRun;
  private readonly rules: Rule[][] = [[], [], [], [], [], []];
  private readonly found = new Map<string, ToolpathViolation>();
  private readonly maxFeed: number;
  private readonly maxSpindle: number;

  constructor(
    private readonly machine: MachineProfile | undefined,
    private readonly plate: PlateEnvelope | undefined,
  ) {
    const offset = plate?.workOffsetMm;
    let travel: ChecksRun["travel"] = "not-checked";
    for (const axis of ["X", "Y", "Z"] as const) {
      const t = machine?.travelMm?.[axis];
      if (!t) continue;
      if (offset) {
        travel = "absolute";
        // machine = work + offset, so the work-coordinate limits are travel − offset
        this.addRule(axis, { kind: "travel", lo: t.min - offset[axis], hi: t.max - offset[axis], offset: offset[axis] });
      } else {
        travel = "span-only";
      }
    }
    let rotary = false;
    for (const axis of ["A", "B", "C"] as const) {
      const r = machine?.rotaryLimitsDeg?.[axis];
      if (!r) continue;
      rotary = true;
      this.addRule(axis, { kind: "rotary-limit", lo: r.min, hi: r.max, offset: 0 });
    }
    if (plate) {
      for (const axis of ["X", "Y", "Z"] as const) {
        this.addRule(axis, { kind: "plate-envelope", lo: plate.min[axis], hi: plate.max[axis], offset: 0 });
      }
    }
    this.maxFeed = machine?.maxFeedMmPerMin ?? Infinity;
    this.maxSpindle = machine?.maxSpindleRpm ?? Infinity;
    this.checks = {
      travel,
      rotaryLimits: rotary,
      plateEnvelope: plate !== undefined,
      maxFeed: Number.isFinite(this.maxFeed),
      maxSpindle: Number.isFinite(this.maxSpindle),
    };
  }

  private addRule(axis: AxisName, rule: Rule): void {
    const k = AXIS_INDEX[axis];
    this.rules[k].push(rule);
    if (rule.lo > this.alarmLo[k]) this.alarmLo[k] = rule.lo;
    if (rule.hi < this.alarmHi[k]) this.alarmHi[k] = rule.hi;
  }

  /**
   * A position of axis `k` reached at `line`. Call only when it is outside the alarm range.
   * Machine-referenced moves (G53, G28) are held to the travel only, not to the plate box.
   */
  checkAxis(k: number, value: number, line: number, machineReferenced: boolean): void {
    for (const rule of this.rules[k]) {
      if (machineReferenced && rule.kind === "plate-envelope") continue;
      if (value < rule.lo) this.record(rule.kind, AXIS_NAMES[k], "min", rule.lo, value, line, rule.offset);
      else if (value > rule.hi) this.record(rule.kind, AXIS_NAMES[k], "max", rule.hi, value, line, rule.offset);
    }
  }

  checkFeed(mmPerMin: number, line: number): void {
    if (mmPerMin > this.maxFeed) this.record("max-feed", undefined, "max", this.maxFeed, mmPerMin, line, 0);
  }

  checkSpindle(rpm: number, line: number): void {
    if (rpm > this.maxSpindle) this.record("max-spindle", undefined, "max", this.maxSpindle, rpm, line, 0);
  }

  get maxFeedMmPerMin(): number {
    return this.maxFeed;
  }

  /** Adds the checks that need the whole program (extent against travel span, axes used). */
  finish(bounds: Partial<Record<AxisName, AxisBounds>>, firstUse: Partial<Record<AxisName, number>>): ToolpathViolation[] {
    if (this.checks.travel === "span-only") {
      for (const axis of ["X", "Y", "Z"] as const) {
        const t = this.machine?.travelMm?.[axis];
        const b = bounds[axis];
        if (!t || !b) continue;
        const span = b.max - b.min;
        if (span > t.max - t.min) {
          this.found.set(`travel-span:${axis}`, {
            kind: "travel-span",
            axis,
            limit: t.max - t.min,
            worst: span,
            worstLine: b.maxLine,
            firstLine: Math.min(b.minLine, b.maxLine),
            count: 1,
            message: `${axis} spans ${round(span)} mm, more than the machine's ${round(t.max - t.min)} mm of travel`,
          });
        }
      }
    }
    if (this.machine) {
      for (const axis of AXIS_NAMES) {
        const line = firstUse[axis];
        if (line !== undefined && !this.machine.axes.includes(axis)) {
          this.found.set(`missing-axis:${axis}`, {
            kind: "missing-axis",
            axis,
            worst: 0,
            worstLine: line,
            firstLine: line,
            count: 1,
            message: `the program moves ${axis}, which ${this.machine.name} does not have`,
          });
        }
      }
    }
    return [...this.found.values()].sort((a, b) => a.firstLine - b.firstLine);
  }

  private record(
    kind: ViolationKind, axis: AxisName | undefined, side: "min" | "max",
    limit: number, value: number, line: number, offset: number,
  ): void {
    const key = `${kind}:${axis ?? ""}:${side}`;
    const v = this.found.get(key);
    if (!v) {
      this.found.set(key, {
        kind, axis, side, limit, worst: value, worstLine: line, firstLine: line, count: 1,
        message: describe(kind, axis, side, limit, value, offset),
      });
      return;
    }
    v.count++;
    if (side === "max" ? value > v.worst : value < v.worst) {
      v.worst = value;
      v.worstLine = line;
      v.message = describe(kind, axis, side, limit, value, offset);
    }
  }
}

function describe(kind: ViolationKind, axis: AxisName | undefined, side: "min" | "max", limit: number, value: number, offset: number): string {
  const beyond = side === "min" ? "below" : "above";
  switch (kind) {
    case "travel":
      return `${axis} reaches ${round(value)} mm (machine ${round(value + offset)}), ${beyond} the travel ${side} of ${round(limit + offset)} mm`;
    case "rotary-limit":
      return `${axis} reaches ${round(value)}°, ${beyond} its limit of ${round(limit)}°`;
    case "plate-envelope":
      return `${axis} reaches ${round(value)} mm, outside the plate's safe box (${side} ${round(limit)} mm)`;
    case "max-feed":
      return `feed of ${round(value)} mm/min exceeds the machine's maximum of ${round(limit)} mm/min`;
    case "max-spindle":
      return `spindle speed ${round(value)} rpm exceeds the machine's maximum of ${round(limit)} rpm`;
    default:
      return `${kind} ${axis ?? ""} ${round(value)}`;
  }
}

function round(v: number): number {
  return Math.round(v * 1000) / 1000;
}
