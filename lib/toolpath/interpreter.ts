/**
 * The modal interpreter: executes one block at a time in RS274/NGC v3 order (NISTIR 6556
 * Table 8) and accumulates what the program does. State lives in plain fields and typed
 * arrays; a plain motion line (axis words and F only) takes a short path.
 *
 * Conventions: positions in work coordinates, X Y Z in mm (inch programs are converted as they
 * are read), A B C in degrees. A position can be unknown (before the first absolute move, after
 * G28 or G53 when the plate's work offset is not given); moves from an unknown position are
 * counted but add no length or time, and are reported.
 */
import { arcExtent, arcFromCentre, arcFromRadius, arcPointAt, arcSegments, type ArcGeometry } from "./arc";
import {
  AXIS_WORDS,
  BlockWords,
  L_A, L_B, L_C, L_F, L_H, L_I, L_J, L_K, L_P, L_R, L_S, L_T, L_X, L_Y, L_Z,
  PLAIN_MOTION_WORDS,
  bit,
  gName,
} from "./block";
import type { PreviewDecimator } from "./decimate";
import { BATCH_LAST_MOVE_LINE, BATCH_LINE, BATCH_MOVES, BATCH_QUEUED, type PlainBatchMemory } from "./fast-path";
import { BlockPlan } from "./block-plan";
import type { LimitChecker } from "./limits";
import { PREVIEW_BREAK, PREVIEW_MAX_TOOL_INDEX, PREVIEW_RAPID, PREVIEW_TOOL_SHIFT } from "./preview";
import { ASSUMED_MACHINE } from "./profile";
import type { BlockSink } from "./scanner";
import {
  MAX_LISTED_TOOLS,
  OTHER_TOOLS,
  ToolLog,
  TOOL_FEED_HIGH,
  TOOL_FEED_LOW,
  TOOL_FEED_MIN,
  TOOL_FEED_MM,
  TOOL_RPM_HIGH,
  TOOL_RPM_LOW,
  type ToolRecord,
} from "./tool-log";
import { AXIS_NAMES, type AxisBounds, type AxisName, type MachineProfile, type PlateEnvelope } from "./types";
import type { WarningLog } from "./warnings";

const MM_PER_INCH = 25.4;
/** §3.5.3.2: centre-form arcs may miss their radius by 0.002 mm (0.0002 in). */
const ARC_TOLERANCE_MM = 0.002;
const ARC_TOLERANCE_INCH = 0.0002;
/** Preview arcs are drawn within this of the true curve. */
const ARC_DRAW_TOLERANCE_MM = 0.005;
const ARC_MAX_SEGMENTS = 128;
/** Dwells longer than this are flagged: the P may have been written in milliseconds. */
const LONG_DWELL_S = 60;

const AXIS_LETTER = [L_X, L_Y, L_Z, L_A, L_B, L_C];
const XYZ_MASK = 0b000111;
const ALL_AXES = 0b111111;
/** Plane tables indexed by 0 (G17), 1 (G18), 2 (G19): the (u, v) axes, the normal axis, the centre-offset letters. */
const PLANE_U = [0, 2, 1];
const PLANE_V = [1, 0, 2];
const PLANE_N = [2, 1, 0];
const PLANE_OU = [L_I, L_K, L_J];
const PLANE_OV = [L_J, L_I, L_K];
const PLANE_NAME = ["G17", "G18", "G19"];

const MOTION_NONE = -1;
const BIT_X = bit(L_X);
const BIT_Y = bit(L_Y);
const BIT_Z = bit(L_Z);
const BIT_A = bit(L_A);
const BIT_B = bit(L_B);
const BIT_C = bit(L_C);
const BIT_F = bit(L_F);

export const SUM_FEED_MM = 0;
export const SUM_RAPID_MM = 1;
export const SUM_FEED_MIN = 2;
export const SUM_RAPID_MIN = 3;
export const SUM_DWELL_S = 4;
export const SUM_ROTARY_A = 5; // A, B, C travel in degrees at 5, 6, 7
const SUM_COUNT = 8;
/** Scratch slots handed to cut(): XYZ length (mm) and rotary length (deg) of the move. */
const MOVE_XYZ = 0;
const MOVE_ROT = 1;
const NO_TOOL_BITS = PREVIEW_MAX_TOOL_INDEX << PREVIEW_TOOL_SHIFT;

export type InterpreterSetup = {
  machine?: MachineProfile;
  plate?: PlateEnvelope;
  limits: LimitChecker;
  preview: PreviewDecimator;
  log: WarningLog;
};

export class Interpreter implements BlockSink {
  // ---- modal state ----
  /** Motion mode as G code × 10 (0, 10, 20, 30, 800, 810…890, 382), or MOTION_NONE. */
  motion = MOTION_NONE;
  /** 0 = G17, 1 = G18, 2 = G19. */
  plane = 0;
  inch = false;
  unitsSet = false;
  incremental = false;
  arcCentresAbsolute = false;
  inverseTime = false;
  /** F as written, in program units per minute (G94) or 1/min (G93); NaN until set. */
  feed = NaN;
  spindleOn = false;
  spindleRpm = 0;
  selectedTool = -1;
  programEnded = false;

  // ---- position ----
  readonly pos = new Float64Array(6);
  /** Bit k set when axis k's position is known. */
  known = 0;
  private readonly target = new Float64Array(6);

  // ---- totals ----
  /** Running sums (see SUM_*), in a typed array so hot code never boxes doubles. */
  readonly sums = new Float64Array(SUM_COUNT);
  motionBlocks = 0;
  arcs = 0;
  toolChanges = 0;
  programStops = 0;
  inverseTimeBlocks = 0;
  unmeasuredMoves = 0;
  homeReturns = 0;
  machineCoordinateMoves = 0;
  readonly workOffsets: string[] = [];
  private unitsSeen = 0; // 1 mm, 2 inch

  // ---- extent ----
  readonly min = new Float64Array(6).fill(Infinity);
  readonly max = new Float64Array(6).fill(-Infinity);
  readonly minLine = new Uint32Array(6);
  readonly maxLine = new Uint32Array(6);
  /** First line that moves each axis (0 = never). */
  readonly firstUse = new Uint32Array(6);

  readonly tools = new ToolLog();
  private readonly rapidRate = new Float64Array(6);
  private readonly workOffset: Float64Array | null;
  private readonly home = new Float64Array(3).fill(NaN);
  private readonly limits: LimitChecker;
  private readonly preview: PreviewDecimator;
  private readonly log: WarningLog;
  private readonly alarmLo: Float64Array;
  private readonly alarmHi: Float64Array;
  private toolBits = NO_TOOL_BITS;
  /** The preview's last vertex is the current position. */
  private previewAtPosition = false;
  private movedThisBlock = false;
  private usedAxes = 0;
  private readonly maxFeedCheck: boolean;
  private readonly maxFeed: number;
  private readonly move = new Float64Array(2);
  private readonly plan = new BlockPlan();
  private readonly arcPoint = new Float64Array(3);
  private readonly batchPoint = new Float64Array(3);

  constructor(setup: InterpreterSetup) {
    const machine = setup.machine ?? ASSUMED_MACHINE;
    AXIS_NAMES.forEach((axis, k) => {
      this.rapidRate[k] = machine.rapidRate[axis] ?? ASSUMED_MACHINE.rapidRate[axis] ?? 1;
    });
    const offset = setup.plate?.workOffsetMm;
    this.workOffset = offset ? Float64Array.of(offset.X, offset.Y, offset.Z) : null;
    if (setup.machine?.homeMm) {
      (["X", "Y", "Z"] as const).forEach((axis, k) => {
        const h = setup.machine?.homeMm?.[axis];
        if (h !== undefined) this.home[k] = h;
      });
    }
    this.limits = setup.limits;
    this.alarmLo = setup.limits.alarmLo;
    this.alarmHi = setup.limits.alarmHi;
    this.preview = setup.preview;
    this.log = setup.log;
    this.maxFeedCheck = Number.isFinite(setup.limits.maxFeedMmPerMin);
    this.maxFeed = setup.limits.maxFeedMmPerMin;
  }

  get units(): "mm" | "inch" | "mixed" | "unset" {
    return this.unitsSeen === 3 ? "mixed" : this.unitsSeen === 2 ? "inch" : this.unitsSeen === 1 ? "mm" : "unset";
  }

  bounds(): Partial<Record<AxisName, AxisBounds>> {
    const out: Partial<Record<AxisName, AxisBounds>> = {};
    for (let k = 0; k < 6; k++) {
      if (this.min[k] <= this.max[k]) {
        out[AXIS_NAMES[k]] = { min: this.min[k], max: this.max[k], minLine: this.minLine[k], maxLine: this.maxLine[k] };
      }
    }
    return out;
  }

  firstUseByAxis(): Partial<Record<AxisName, number>> {
    const out: Partial<Record<AxisName, number>> = {};
    for (let k = 0; k < 6; k++) if (this.firstUse[k] > 0) out[AXIS_NAMES[k]] = this.firstUse[k];
    return out;
  }

  executeBlock(w: BlockWords, line: number): void {
    const present = w.present;
    if (w.gCount === 0 && w.mCount === 0 && (present & ~PLAIN_MOTION_WORDS) === 0) {
      // the plain line of a toolpath: `X… Y… Z… A… B… F…` in the current motion mode
      if ((present & bit(L_F)) !== 0) this.setFeed(w.values[L_F], line);
      if ((present & AXIS_WORDS) !== 0) {
        this.movedThisBlock = false;
        this.motionFromMode(w, line);
        if (this.movedThisBlock) this.motionBlocks++;
      }
      return;
    }
    if (w.gCount === 1 && w.mCount === 0 && (present & ~PLAIN_MOTION_WORDS) === 0) {
      // `G1 X… Y… F…`: CAM output often repeats the motion code on every line
      const g = w.gCodes[0];
      if (g === 0 || g === 10) {
        this.motion = g;
        if ((present & bit(L_F)) !== 0) this.setFeed(w.values[L_F], line);
        this.movedThisBlock = false;
        if ((present & AXIS_WORDS) !== 0) this.motionFromMode(w, line);
        if (this.movedThisBlock) this.motionBlocks++;
        return;
      }
    }
    this.fullBlock(w, line);
  }

  // ------------------------------------------------------------------ plain batches

  /**
   * Before the scanner runs a stretch of plain motion lines in WebAssembly
   * (assembly/plain-moves.ts): whether this state allows it (G0 or G1, units set, the preview at
   * the position, some axis known and used), and if so the state copied in. `line`: lines read.
   */
  beginPlainBatch(m: PlainBatchMemory, line: number): boolean {
    const motion = this.motion;
    if ((motion !== 0 && motion !== 10) || !this.unitsSet || !this.previewAtPosition) return false;
    const axesOk = this.known & this.usedAxes;
    if (axesOk === 0) return false;
    const tool = this.tools.active;
    m.pos.set(this.pos);
    m.sums.set(this.sums);
    m.min.set(this.min);
    m.max.set(this.max);
    m.minLine.set(this.minLine);
    m.maxLine.set(this.maxLine);
    if (tool) m.toolStats.set(tool.stats);
    m.rapidRate.set(this.rapidRate);
    m.alarmLo.set(this.alarmLo);
    m.alarmHi.set(this.alarmHi);
    const f = m.modeF;
    f[0] = this.feed;
    f[1] = this.inch ? MM_PER_INCH : 1;
    f[2] = this.maxFeedCheck ? this.maxFeed : Infinity;
    f[3] = this.spindleRpm;
    const i = m.modeI;
    i[0] = motion === 0 ? 1 : 0;
    i[1] = this.incremental ? 1 : 0;
    i[2] = axesOk;
    i[3] = (this.known & XYZ_MASK) === XYZ_MASK ? 1 : 0;
    i[4] = this.toolBits;
    i[5] = this.inch ? 1 : 0;
    i[6] = tool && this.spindleOn && !this.inverseTime ? 1 : 0;
    i[7] = this.spindleOn ? 1 : 0;
    m.batch[BATCH_LINE] = line;
    return true;
  }

  /** After the batch: its state copied back, its tool line range, its preview points in order. */
  endPlainBatch(m: PlainBatchMemory): void {
    const b = m.batch;
    const moves = b[BATCH_MOVES];
    if (moves === 0) return;
    this.pos.set(m.pos);
    this.sums.set(m.sums);
    this.min.set(m.min);
    this.max.set(m.max);
    this.minLine.set(m.minLine);
    this.maxLine.set(m.maxLine);
    this.feed = m.modeF[0];
    this.motionBlocks += moves;
    const tool = this.tools.active;
    if (tool) {
      tool.stats.set(m.toolStats);
      this.tools.touch(b[BATCH_LAST_MOVE_LINE]);
    }
    const queued = b[BATCH_QUEUED];
    const qf = m.queueF;
    const qi = m.queueI;
    const preview = this.preview;
    const p = this.batchPoint;
    for (let k = 0; k < queued; k++) {
      p[0] = qf[4 * k];
      p[1] = qf[4 * k + 1];
      p[2] = qf[4 * k + 2];
      preview.add(p, qi[8 * k + 6], qi[8 * k + 7]);
    }
  }

  // ------------------------------------------------------------------ full block

  private fullBlock(w: BlockWords, line: number): void {
    const plan = this.plan;
    const conflict = plan.read(w, line, this.log);
    if (conflict) {
      this.log.add("modal-conflict", line, `${conflict}; line skipped (RS274/NGC §3.4)`);
      return;
    }
    const { motion, plane, distance, arcDistance, feedMode, units, comp, lengthOffset, coord, stop, spindle } = plan;

    // ---- execute in the order of Table 8 ----
    if (feedMode >= 0) this.inverseTime = feedMode === 930;
    if (w.has(L_F)) this.setFeed(w.values[L_F], line);
    if (w.has(L_S)) this.setSpindleSpeed(w.values[L_S], line);
    if (w.has(L_T)) this.selectTool(w.values[L_T], line);
    if (plan.toolChange) this.changeTool(line);
    if (spindle >= 0) this.spindleOn = spindle !== 5;
    if (plan.dwell) this.dwell(w, line);
    if (plane >= 0) this.plane = plane;
    if (units >= 0) {
      this.inch = units === 200;
      this.unitsSet = true;
      this.unitsSeen |= this.inch ? 2 : 1;
    }
    if (comp === 410 || comp === 420) {
      this.log.add("unsupported-code", line, () => `${gName(comp)} cutter compensation is not applied; the path shown is the programmed one`);
    }
    if (lengthOffset === 430) this.lengthOffset(w, line);
    if (coord >= 0) {
      const name = gName(coord);
      if (!this.workOffsets.includes(name)) this.workOffsets.push(name);
    }
    if (distance >= 0) this.incremental = distance === 910;
    if (arcDistance >= 0) this.arcCentresAbsolute = arcDistance === 901;

    this.movedThisBlock = false;
    if (plan.home >= 0) {
      this.homeReturn(w, line, plan.home === 300);
    } else if (plan.axisUser < 0) {
      if (motion >= 0) this.motion = motion;
      if ((w.present & AXIS_WORDS) !== 0) {
        if (plan.machineCoords) this.machineMove(w, line);
        else this.motionFromMode(w, line);
      } else if (motion === 20 || motion === 30) {
        this.log.add("malformed-block", line, "an arc needs an end point; line has no axis words");
      }
    }
    if (this.movedThisBlock) this.motionBlocks++;

    if (stop >= 0) {
      if (stop === 2 || stop === 30) this.endProgram();
      else this.programStops++;
    }
  }

  // ------------------------------------------------------------------ words

  private setFeed(f: number, line: number): void {
    if (f < 0) {
      this.log.add("negative-value", line, "a negative F is not allowed; ignored");
      return;
    }
    this.feed = f;
  }

  private setSpindleSpeed(s: number, line: number): void {
    if (s < 0) {
      this.log.add("negative-value", line, "a negative S is not allowed; ignored");
      return;
    }
    this.spindleRpm = s;
    this.limits.checkSpindle(s, line);
  }

  private selectTool(t: number, line: number): void {
    if (t < 0 || Math.abs(t - Math.round(t)) > 0.0001) {
      this.log.add("negative-value", line, "T must be a whole number of zero or more; ignored");
      return;
    }
    this.selectedTool = Math.round(t);
  }

  private changeTool(line: number): void {
    if (this.selectedTool < 0) {
      this.log.add("malformed-block", line, "M6 with no tool selected by a T word; ignored");
      return;
    }
    const active = this.tools.active;
    if (active && active.number === this.selectedTool) return; // already in the spindle: no change
    this.toolChanges++;
    this.mount(this.selectedTool, line);
  }

  private mount(number: number, line: number): ToolRecord {
    const record = this.tools.mount(number, line);
    if (record.number === OTHER_TOOLS) {
      this.log.once("too-many-tools", line, `more than ${MAX_LISTED_TOOLS} different tools: the rest are reported together as tool −1`);
    }
    const index = Math.min(this.tools.indexOf(record), PREVIEW_MAX_TOOL_INDEX - 1);
    this.toolBits = index << PREVIEW_TOOL_SHIFT;
    return record;
  }

  private lengthOffset(w: BlockWords, line: number): void {
    const active = this.tools.active;
    const h = w.has(L_H) ? Math.round(w.values[L_H]) : active?.number;
    if (h === undefined) return;
    if (active && active.number > 0 && h !== active.number) {
      this.log.add("length-offset-mismatch", line, `G43 H${h} with tool T${active.number} in the spindle (H usually matches T)`);
    }
    if (active && !active.lengthOffsets.includes(h) && active.lengthOffsets.length < 16) active.lengthOffsets.push(h);
  }

  private dwell(w: BlockWords, line: number): void {
    if (!w.has(L_P)) {
      this.log.add("malformed-block", line, "G4 needs a P word (seconds)");
      return;
    }
    const p = w.values[L_P];
    if (p < 0) {
      this.log.add("negative-value", line, "a negative dwell is not allowed; ignored");
      return;
    }
    // P is seconds in RS274/NGC v3 (§3.5.4); some controllers read milliseconds instead.
    this.sums[SUM_DWELL_S] += p;
    if (p > LONG_DWELL_S) {
      this.log.add("long-dwell", line, `dwell of ${p} s counted as seconds (RS274/NGC); check the controller does not read P in milliseconds`);
    }
  }

  /** M2/M30: the program ends and the modal state resets (§3.6.1). */
  private endProgram(): void {
    this.programEnded = true;
    this.plane = 0;
    this.incremental = false;
    this.inverseTime = false;
    this.spindleOn = false;
    this.motion = 10;
  }

  // ------------------------------------------------------------------ motion

  private motionFromMode(w: BlockWords, line: number): void {
    const m = this.motion;
    if (m === 0 || m === 10) this.plainStraight(w, line, m === 0);
    else if (m === 20 || m === 30) this.arc(w, line, m === 20);
    else if (m === MOTION_NONE || m === 800) {
      this.log.add("axis-words-without-motion", line, "axis words with no motion mode in effect (G80 or none yet); line has no motion");
    } else if (m >= 810 && m <= 890) {
      this.cannedCycle(w, line);
    } else {
      this.unmodelledMove(w, line, `${gName(m)} (probing) is not simulated; positions after it are unknown`);
    }
  }

  /**
   * G0/G1 in work coordinates: the bulk of every program. The axis words are read unrolled
   * into locals; when every named axis is known before and after, the move is measured right
   * here (same rules as linearMove, which handles everything else).
   */
  private plainStraight(w: BlockWords, line: number, rapid: boolean): void {
    const values = w.values;
    const present = w.present;
    const pos = this.pos;
    const scale = this.inch ? MM_PER_INCH : 1;
    const inc = this.incremental;
    const p0 = pos[0];
    const p1 = pos[1];
    const p2 = pos[2];
    const p3 = pos[3];
    const p4 = pos[4];
    const p5 = pos[5];
    let x = p0;
    let y = p1;
    let z = p2;
    let a = p3;
    let b = p4;
    let c = p5;
    let named = 0;
    if ((present & BIT_X) !== 0) {
      named |= 1;
      x = inc ? p0 + values[L_X] * scale : values[L_X] * scale;
    }
    if ((present & BIT_Y) !== 0) {
      named |= 2;
      y = inc ? p1 + values[L_Y] * scale : values[L_Y] * scale;
    }
    if ((present & BIT_Z) !== 0) {
      named |= 4;
      z = inc ? p2 + values[L_Z] * scale : values[L_Z] * scale;
    }
    if ((present & BIT_A) !== 0) {
      named |= 8;
      a = inc ? p3 + values[L_A] : values[L_A];
    }
    if ((present & BIT_B) !== 0) {
      named |= 16;
      b = inc ? p4 + values[L_B] : values[L_B];
    }
    if ((present & BIT_C) !== 0) {
      named |= 32;
      c = inc ? p5 + values[L_C] : values[L_C];
    }
    const known = this.known;
    if ((named & ~known) !== 0 || (named & ~this.usedAxes) !== 0 || !this.unitsSet || !this.previewAtPosition) {
      // the general path: unknown positions, first use of an axis, units or preview to settle
      const tgt = this.target;
      tgt[0] = x;
      tgt[1] = y;
      tgt[2] = z;
      tgt[3] = a;
      tgt[4] = b;
      tgt[5] = c;
      this.linearMove(named, inc ? known : known | named, line, rapid, false, (present & BIT_F) !== 0);
      return;
    }
    this.movedThisBlock = true;
    const dx = x - p0;
    const dy = y - p1;
    const dz = z - p2;
    const xyz = Math.sqrt(dx * dx + dy * dy + dz * dz);
    const sums = this.sums;
    let rot = 0;
    if ((named & 56) !== 0) {
      const da = a - p3;
      const db = b - p4;
      const dc = c - p5;
      sums[SUM_ROTARY_A] += Math.abs(da);
      sums[SUM_ROTARY_A + 1] += Math.abs(db);
      sums[SUM_ROTARY_A + 2] += Math.abs(dc);
      rot = Math.sqrt(da * da + db * db + dc * dc);
    }
    if (rapid) {
      sums[SUM_RAPID_MM] += xyz;
      const r = this.rapidRate;
      let t = Math.abs(dx) / r[0];
      let u = Math.abs(dy) / r[1];
      if (u > t) t = u;
      u = Math.abs(dz) / r[2];
      if (u > t) t = u;
      u = Math.abs(a - p3) / r[3];
      if (u > t) t = u;
      u = Math.abs(b - p4) / r[4];
      if (u > t) t = u;
      u = Math.abs(c - p5) / r[5];
      if (u > t) t = u;
      sums[SUM_RAPID_MIN] += t;
      this.tools.touch(line);
    } else {
      this.move[MOVE_XYZ] = xyz;
      this.move[MOVE_ROT] = rot;
      this.cut(line, (present & BIT_F) !== 0);
    }
    // extent and limits of the named axes
    const min = this.min;
    const max = this.max;
    const lo = this.alarmLo;
    const hi = this.alarmHi;
    if ((named & 1) !== 0) {
      if (x < min[0]) { min[0] = x; this.minLine[0] = line; }
      if (x > max[0]) { max[0] = x; this.maxLine[0] = line; }
      if (x < lo[0] || x > hi[0]) this.limits.checkAxis(0, x, line, false);
    }
    if ((named & 2) !== 0) {
      if (y < min[1]) { min[1] = y; this.minLine[1] = line; }
      if (y > max[1]) { max[1] = y; this.maxLine[1] = line; }
      if (y < lo[1] || y > hi[1]) this.limits.checkAxis(1, y, line, false);
    }
    if ((named & 4) !== 0) {
      if (z < min[2]) { min[2] = z; this.minLine[2] = line; }
      if (z > max[2]) { max[2] = z; this.maxLine[2] = line; }
      if (z < lo[2] || z > hi[2]) this.limits.checkAxis(2, z, line, false);
    }
    if ((named & 8) !== 0) {
      if (a < min[3]) { min[3] = a; this.minLine[3] = line; }
      if (a > max[3]) { max[3] = a; this.maxLine[3] = line; }
      if (a < lo[3] || a > hi[3]) this.limits.checkAxis(3, a, line, false);
    }
    if ((named & 16) !== 0) {
      if (b < min[4]) { min[4] = b; this.minLine[4] = line; }
      if (b > max[4]) { max[4] = b; this.maxLine[4] = line; }
      if (b < lo[4] || b > hi[4]) this.limits.checkAxis(4, b, line, false);
    }
    if ((named & 32) !== 0) {
      if (c < min[5]) { min[5] = c; this.minLine[5] = line; }
      if (c > max[5]) { max[5] = c; this.maxLine[5] = line; }
      if (c < lo[5] || c > hi[5]) this.limits.checkAxis(5, c, line, false);
    }
    pos[0] = x;
    pos[1] = y;
    pos[2] = z;
    pos[3] = a;
    pos[4] = b;
    pos[5] = c;
    if ((known & XYZ_MASK) === XYZ_MASK && (dx !== 0 || dy !== 0 || dz !== 0)) {
      const tgt = this.target;
      tgt[0] = x;
      tgt[1] = y;
      tgt[2] = z;
      this.preview.add(tgt, this.toolBits | (rapid ? PREVIEW_RAPID : 0), line);
    }
  }

  /** Fills `target` and returns the known-mask after the move, for axis words read as work coordinates. */
  private readTargets(w: BlockWords): number {
    const pos = this.pos;
    const tgt = this.target;
    const present = w.present;
    const scale = this.inch ? MM_PER_INCH : 1;
    let known = this.known;
    for (let k = 0; k < 6; k++) {
      const letter = AXIS_LETTER[k];
      if ((present & (1 << letter)) === 0) {
        tgt[k] = pos[k];
        continue;
      }
      const v = k < 3 ? w.values[letter] * scale : w.values[letter];
      if (this.incremental) {
        tgt[k] = pos[k] + v; // stays unknown if the start was unknown
      } else {
        tgt[k] = v;
        known |= 1 << k;
      }
    }
    return known;
  }

  /** Axes named in the block as a mask of axis indices. */
  private namedAxes(w: BlockWords): number {
    const present = w.present;
    let mask = 0;
    for (let k = 0; k < 6; k++) if ((present & (1 << AXIS_LETTER[k])) !== 0) mask |= 1 << k;
    return mask;
  }

  private straight(w: BlockWords, line: number, rapid: boolean, machineReferenced: boolean): void {
    const knownAfter = this.readTargets(w);
    this.linearMove(this.namedAxes(w), knownAfter, line, rapid, machineReferenced, w.has(L_F));
  }

  /** G53: axis words are machine coordinates (absolute, non-modal), placed via the plate's work offset. */
  private machineMove(w: BlockWords, line: number): void {
    const m = this.motion;
    if (m !== 0 && m !== 10) {
      this.log.add("modal-conflict", line, "G53 needs G0 or G1 in effect (RS274/NGC §3.5.9); line skipped");
      return;
    }
    this.machineCoordinateMoves++;
    const pos = this.pos;
    const tgt = this.target;
    const scale = this.inch ? MM_PER_INCH : 1;
    let known = this.known;
    const named = this.namedAxes(w);
    for (let k = 0; k < 6; k++) {
      tgt[k] = pos[k];
      if ((named & (1 << k)) === 0) continue;
      const letter = AXIS_LETTER[k];
      if (k >= 3) {
        tgt[k] = w.values[letter];
        known |= 1 << k;
      } else if (this.workOffset) {
        tgt[k] = w.values[letter] * scale - this.workOffset[k];
        known |= 1 << k;
      } else {
        known &= ~(1 << k);
      }
    }
    this.linearMove(named, known, line, m === 0, true, w.has(L_F));
  }

  /** G28/G30: rapid to the optional intermediate point, then to home on the named axes (all if none). */
  private homeReturn(w: BlockWords, line: number, second: boolean): void {
    this.homeReturns++;
    const named = this.namedAxes(w);
    if (named !== 0) this.straight(w, line, true, false);
    const axes = named !== 0 ? named : ALL_AXES;
    const tgt = this.target;
    let known = this.known;
    for (let k = 0; k < 6; k++) {
      tgt[k] = this.pos[k];
      if ((axes & (1 << k)) === 0) continue;
      const h = k < 3 && !second ? this.home[k] : NaN;
      if (this.workOffset && !Number.isNaN(h)) {
        tgt[k] = h - this.workOffset[k];
        known |= 1 << k;
      } else {
        known &= ~(1 << k);
      }
    }
    this.linearMove(axes, known, line, true, true, false);
  }

  private cannedCycle(w: BlockWords, line: number): void {
    this.log.add("canned-cycle-not-supported", line, () => `${gName(this.motion)} canned cycle is not simulated; its length and time are not counted and Z is unknown after it`);
    const knownAfter = this.readTargets(w) & ~(1 << 2);
    this.jump(this.namedAxes(w) | (1 << 2), knownAfter, line);
  }

  private unmodelledMove(w: BlockWords, line: number, message: string): void {
    this.log.add("unsupported-code", line, message);
    const named = this.namedAxes(w);
    this.jump(named, this.known & ~named, line);
  }

  /** A move whose path is not known: the end point is taken, nothing is measured. */
  private jump(named: number, knownAfter: number, line: number): void {
    this.movedThisBlock = true;
    this.unmeasuredMoves++;
    this.pos.set(this.target);
    this.known = knownAfter;
    this.extendTo(named & knownAfter, line, false);
    this.previewAtPosition = false;
  }

  private linearMove(named: number, knownAfter: number, line: number, rapid: boolean, machineReferenced: boolean, hasF: boolean): void {
    const pos = this.pos;
    const tgt = this.target;
    this.movedThisBlock = true;
    this.noteFirstUse(named, line);
    if (!this.unitsSet) this.unitsMissing(line);
    const measurable = (named & ~(this.known & knownAfter)) === 0;
    if (!measurable) {
      this.unmeasuredMoves++;
      if (!rapid) {
        this.log.add("feed-from-unknown-position", line, "cutting move from a position that is not known; its length and time are not counted");
      }
    } else {
      const dx = tgt[0] - pos[0];
      const dy = tgt[1] - pos[1];
      const dz = tgt[2] - pos[2];
      const da = tgt[3] - pos[3];
      const db = tgt[4] - pos[4];
      const dc = tgt[5] - pos[5];
      const xyz = Math.sqrt(dx * dx + dy * dy + dz * dz);
      const sums = this.sums;
      sums[SUM_ROTARY_A] += Math.abs(da);
      sums[SUM_ROTARY_A + 1] += Math.abs(db);
      sums[SUM_ROTARY_A + 2] += Math.abs(dc);
      if (rapid) {
        sums[SUM_RAPID_MM] += xyz;
        // the slowest axis governs: each axis at its own rapid rate
        const r = this.rapidRate;
        let t = Math.abs(dx) / r[0];
        let u = Math.abs(dy) / r[1];
        if (u > t) t = u;
        u = Math.abs(dz) / r[2];
        if (u > t) t = u;
        u = Math.abs(da) / r[3];
        if (u > t) t = u;
        u = Math.abs(db) / r[4];
        if (u > t) t = u;
        u = Math.abs(dc) / r[5];
        if (u > t) t = u;
        sums[SUM_RAPID_MIN] += t;
        this.tools.touch(line);
      } else {
        this.move[MOVE_XYZ] = xyz;
        this.move[MOVE_ROT] = Math.sqrt(da * da + db * db + dc * dc);
        this.cut(line, hasF);
      }
    }
    this.extendTo(named & knownAfter, line, machineReferenced);
    const xyzChanged = tgt[0] !== pos[0] || tgt[1] !== pos[1] || tgt[2] !== pos[2] || (this.known & XYZ_MASK) !== XYZ_MASK;
    pos[0] = tgt[0];
    pos[1] = tgt[1];
    pos[2] = tgt[2];
    pos[3] = tgt[3];
    pos[4] = tgt[4];
    pos[5] = tgt[5];
    this.known = knownAfter;
    if ((knownAfter & XYZ_MASK) === XYZ_MASK) {
      if (xyzChanged || !this.previewAtPosition) {
        let flags = this.toolBits | (rapid ? PREVIEW_RAPID : 0);
        if (!this.previewAtPosition) flags |= PREVIEW_BREAK;
        this.preview.add(tgt, flags, line);
      }
      this.previewAtPosition = true;
    } else {
      this.previewAtPosition = false;
    }
  }

  /**
   * Time and bookkeeping of a cutting move: F applies along the XYZ path when X, Y or Z moves,
   * else to the rotary motion in deg/min as √(dA² + dB² + dC²) (§2.1.2.5); in G93 the move
   * lasts 1/F minutes (§3.5.19).
   * Too big to be inlined into plainStraight; a small inlinable copy for the common case
   * (tool in, spindle on, G94) measured within noise, so there is one version.
   */
  private cut(line: number, hasF: boolean): void {
    let tool = this.tools.active;
    if (!tool) {
      this.log.once("cut-before-tool-change", line, "cutting before any tool change (T… M6): listed as tool 0, the tool already in the spindle");
      tool = this.mount(0, line);
    }
    if (!this.spindleOn) {
      this.log.add("cut-with-spindle-off", line, "cutting move with the spindle stopped (no M3/M4 in effect)");
    }
    const xyzMm = this.move[MOVE_XYZ];
    const f = this.feed;
    let minutes = 0;
    let rate = 0; // mm/min along the XYZ path; 0 when not applicable
    if (this.inverseTime) {
      this.inverseTimeBlocks++;
      if (!hasF) {
        this.log.add("feed-rate-missing", line, f > 0
          ? "inverse time (G93) needs F on every cutting move (§3.5.19); the previous F was used"
          : "inverse time (G93) needs F on every cutting move (§3.5.19); no time counted");
      }
      if (f > 0) {
        minutes = 1 / f;
        rate = xyzMm * f;
      }
    } else if (!(f > 0)) {
      this.log.add("feed-rate-missing", line, "cutting move with no feed rate (F) set; no time counted");
    } else if (xyzMm > 0) {
      rate = this.inch ? f * MM_PER_INCH : f;
      minutes = xyzMm / rate;
    } else {
      minutes = this.move[MOVE_ROT] / f; // rotary-only: F in deg/min
    }
    const sums = this.sums;
    sums[SUM_FEED_MM] += xyzMm;
    sums[SUM_FEED_MIN] += minutes;
    const ts = tool.stats;
    ts[TOOL_FEED_MM] += xyzMm;
    ts[TOOL_FEED_MIN] += minutes;
    if (rate > 0) {
      if (rate < ts[TOOL_FEED_LOW]) ts[TOOL_FEED_LOW] = rate;
      if (rate > ts[TOOL_FEED_HIGH]) ts[TOOL_FEED_HIGH] = rate;
      if (this.maxFeedCheck && rate > this.maxFeed) this.limits.checkFeed(rate, line);
    }
    if (this.spindleOn) {
      const rpm = this.spindleRpm;
      if (rpm < ts[TOOL_RPM_LOW]) ts[TOOL_RPM_LOW] = rpm;
      if (rpm > ts[TOOL_RPM_HIGH]) ts[TOOL_RPM_HIGH] = rpm;
    }
    this.tools.touch(line);
  }

  private arc(w: BlockWords, line: number, clockwise: boolean): void {
    const p = this.plane;
    const iu = PLANE_U[p];
    const iv = PLANE_V[p];
    const inn = PLANE_N[p];
    const startKnown = this.known;
    const knownAfter = this.readTargets(w);
    const named = this.namedAxes(w);
    const pos = this.pos;
    const tgt = this.target;
    const hasCentre = w.has(PLANE_OU[p]) || w.has(PLANE_OV[p]);
    const hasR = w.has(L_R);
    if (!hasCentre && !hasR) {
      this.log.add("arc-missing-centre", line, `arc with neither R nor a centre offset in the ${PLANE_NAME[p]} plane; line skipped`);
      return;
    }
    const planeMask = (1 << iu) | (1 << iv) | (named & (1 << inn));
    if ((planeMask & ~(startKnown & knownAfter)) !== 0) {
      this.noteFirstUse(named, line);
      this.log.add("feed-from-unknown-position", line, "arc from a position that is not known; its length and time are not counted");
      this.jump(named, knownAfter, line);
      return;
    }
    const scale = this.inch ? MM_PER_INCH : 1;
    const tolerance = this.inch ? ARC_TOLERANCE_INCH * MM_PER_INCH : ARC_TOLERANCE_MM;
    const su = pos[iu];
    const sv = pos[iv];
    const eu = tgt[iu];
    const ev = tgt[iv];
    let outcome;
    if (hasR) {
      outcome = arcFromRadius(su, sv, eu, ev, w.values[L_R] * scale, clockwise, tolerance);
    } else {
      let ou = w.has(PLANE_OU[p]) ? w.values[PLANE_OU[p]] * scale : 0;
      let ov = w.has(PLANE_OV[p]) ? w.values[PLANE_OV[p]] * scale : 0;
      if (this.arcCentresAbsolute) {
        ou = w.has(PLANE_OU[p]) ? ou - su : 0;
        ov = w.has(PLANE_OV[p]) ? ov - sv : 0;
      }
      outcome = arcFromCentre(su, sv, eu, ev, ou, ov, clockwise, tolerance);
    }
    if (outcome.problem) {
      const { code, detail } = outcome.problem;
      this.log.add(code, line, code === "arc-full-circle-with-r" ? `${detail}; line skipped` : detail);
    }
    const arc = outcome.arc;
    if (!arc) return;

    this.movedThisBlock = true;
    this.arcs++;
    this.noteFirstUse(named, line);
    if (!this.unitsSet) this.unitsMissing(line);
    const rise = tgt[inn] - pos[inn];
    const length = Math.hypot(arc.planarLength, rise);
    const da = tgt[3] - pos[3];
    const db = tgt[4] - pos[4];
    const dc = tgt[5] - pos[5];
    this.sums[SUM_ROTARY_A] += Math.abs(da);
    this.sums[SUM_ROTARY_A + 1] += Math.abs(db);
    this.sums[SUM_ROTARY_A + 2] += Math.abs(dc);
    this.move[MOVE_XYZ] = length;
    this.move[MOVE_ROT] = Math.sqrt(da * da + db * db + dc * dc);
    this.cut(line, w.has(L_F));

    // extent: the arc's own box in the plane, end points elsewhere
    const [minU, minV, maxU, maxV] = arcExtent(arc, su, sv, eu, ev);
    this.extendAxis(iu, minU, line, false);
    this.extendAxis(iu, maxU, line, false);
    this.extendAxis(iv, minV, line, false);
    this.extendAxis(iv, maxV, line, false);
    this.extendTo(named & knownAfter & ~((1 << iu) | (1 << iv)), line, false);

    if ((startKnown & XYZ_MASK) === XYZ_MASK && (knownAfter & XYZ_MASK) === XYZ_MASK) {
      this.drawArc(arc, iu, iv, inn, pos[inn], rise, line, !this.previewAtPosition);
      this.previewAtPosition = true;
    } else {
      this.previewAtPosition = false;
    }
    pos.set(tgt);
    this.known = knownAfter;
  }

  private drawArc(arc: ArcGeometry, iu: number, iv: number, inn: number, n0: number, rise: number, line: number, brk: boolean): void {
    const n = arcSegments(arc, ARC_DRAW_TOLERANCE_MM, ARC_MAX_SEGMENTS);
    const p = this.arcPoint;
    for (let k = 1; k <= n; k++) {
      const t = k / n;
      const [u, v] = arcPointAt(arc, t);
      p[iu] = u;
      p[iv] = v;
      p[inn] = n0 + rise * t;
      this.preview.add(p, this.toolBits | (brk && k === 1 ? PREVIEW_BREAK : 0), line);
    }
  }

  // ------------------------------------------------------------------ extent and checks

  private extendTo(mask: number, line: number, machineReferenced: boolean): void {
    const tgt = this.target;
    const min = this.min;
    const max = this.max;
    for (let k = 0; k < 6; k++) {
      if ((mask & (1 << k)) === 0) continue;
      const v = tgt[k];
      if (v < min[k]) {
        min[k] = v;
        this.minLine[k] = line;
      }
      if (v > max[k]) {
        max[k] = v;
        this.maxLine[k] = line;
      }
      if (v < this.alarmLo[k] || v > this.alarmHi[k]) this.limits.checkAxis(k, v, line, machineReferenced);
    }
  }

  private extendAxis(k: number, v: number, line: number, machineReferenced: boolean): void {
    if (v < this.min[k]) {
      this.min[k] = v;
      this.minLine[k] = line;
    }
    if (v > this.max[k]) {
      this.max[k] = v;
      this.maxLine[k] = line;
    }
    if (v < this.alarmLo[k] || v > this.alarmHi[k]) this.limits.checkAxis(k, v, line, machineReferenced);
  }

  private noteFirstUse(named: number, line: number): void {
    if ((named & ~this.usedAxes) === 0) return;
    this.usedAxes |= named;
    for (let k = 0; k < 6; k++) if ((named & (1 << k)) !== 0 && this.firstUse[k] === 0) this.firstUse[k] = line;
  }

  private unitsMissing(line: number): void {
    this.unitsSet = true; // report once; millimetres stay assumed
    this.log.add("units-not-set", line, "motion before G20/G21 set the units: millimetres assumed");
  }
}
