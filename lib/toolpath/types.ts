/**
 * Public types of the toolpath analysis engine. Plain data, no zod, no framework:
 * the web app stores a ToolpathReport (JSON) and the encoded preview separately.
 *
 * Units everywhere in results: X Y Z and lengths in millimetres, A B C in degrees,
 * feeds in mm/min, times in seconds, whatever units the program itself was written in.
 */

import type { ToolpathPreview } from "./preview";

export type LinearAxis = "X" | "Y" | "Z";
export type RotaryAxis = "A" | "B" | "C";
export type AxisName = LinearAxis | RotaryAxis;

export const AXIS_NAMES: readonly AxisName[] = ["X", "Y", "Z", "A", "B", "C"];
export const LINEAR_AXES: readonly LinearAxis[] = ["X", "Y", "Z"];
export const ROTARY_AXES: readonly RotaryAxis[] = ["A", "B", "C"];

export type Range = { min: number; max: number };

/** A CNC machine as far as the analysis needs it. */
export type MachineProfile = {
  name: string;
  /** Axes the machine has; a program using any other axis is a violation. */
  axes: AxisName[];
  /** Travel of each linear axis in machine coordinates, mm. Omit an axis to leave it unchecked. */
  travelMm?: Partial<Record<LinearAxis, Range>>;
  /** Limits of each rotary axis, degrees. Omit an axis for a continuous (unlimited) one. */
  rotaryLimitsDeg?: Partial<Record<RotaryAxis, Range>>;
  /** Rapid (traverse) rate per axis: mm/min for X Y Z, deg/min for A B C. */
  rapidRate: Partial<Record<AxisName, number>>;
  maxFeedMmPerMin?: number;
  maxSpindleRpm?: number;
  /** Time of one automatic tool change, seconds. */
  toolChangeTimeS: number;
  /** Where G28 sends each linear axis, in machine coordinates, mm. Unknown if omitted. */
  homeMm?: Partial<Record<LinearAxis, number>>;
};

/** The fixture plate's safe box for the tool, in work coordinates (mm). */
export type PlateEnvelope = {
  name?: string;
  min: Record<LinearAxis, number>;
  max: Record<LinearAxis, number>;
  /**
   * Machine coordinates of the program's work zero on this plate (the value in the work-offset
   * register). When known, machine travel is checked in absolute terms and G53/G28 moves can be
   * placed in work coordinates.
   */
  workOffsetMm?: Record<LinearAxis, number>;
};

export type AnalyzeOptions = {
  machine?: MachineProfile;
  plate?: PlateEnvelope;
  /** Block-delete switch: true skips lines starting with `/`. Default false (they run). */
  blockDelete?: boolean;
  /** Upper bound on preview vertices (default 200 000). */
  previewMaxVertices?: number;
  /** Called after each chunk with the number of bytes read so far. */
  onProgress?: (bytesRead: number) => void;
  /** Stops the analysis between chunks. */
  signal?: AbortSignal;
  /**
   * "wasm" (default): plain lines are read, and runs of plain moves measured, in WebAssembly;
   * "typescript": every line in TypeScript. Same results either way (tests compare them); the
   * switch is for those tests and for diagnosis.
   */
  engine?: "wasm" | "typescript";
};

export type ToolpathWarning = { line: number; code: WarningCode; message: string };

export type WarningCode =
  | "feed-rate-missing"
  | "arc-radius-mismatch"
  | "arc-radius-too-small"
  | "arc-full-circle-with-r"
  | "arc-missing-centre"
  | "units-not-set"
  | "unsupported-word"
  | "unsupported-code"
  | "unknown-code"
  | "parameters-not-supported"
  | "subroutine-not-supported"
  | "canned-cycle-not-supported"
  | "malformed-number"
  | "malformed-block"
  | "bad-character"
  | "repeated-word"
  | "modal-conflict"
  | "unclosed-comment"
  | "unclosed-percent"
  | "stray-percent"
  | "text-after-end"
  | "no-program-end"
  | "no-final-line-end"
  | "line-over-256"
  | "line-too-long"
  | "checksum-stripped"
  | "checksum-mismatch"
  | "axis-words-without-motion"
  | "feed-from-unknown-position"
  | "cut-with-spindle-off"
  | "cut-before-tool-change"
  | "length-offset-mismatch"
  | "long-dwell"
  | "negative-value"
  | "too-many-tools";

export type ViolationKind =
  | "travel"
  | "travel-span"
  | "rotary-limit"
  | "plate-envelope"
  | "max-feed"
  | "max-spindle"
  | "missing-axis";

/** One rule broken, aggregated over all the lines that break it. */
export type ToolpathViolation = {
  kind: ViolationKind;
  /** Axis concerned, if any. */
  axis?: AxisName;
  /** Which side of the range was crossed. */
  side?: "min" | "max";
  /** The limit crossed (mm, deg, mm/min or rpm). */
  limit?: number;
  /** The worst value seen beyond the limit, and where. */
  worst: number;
  worstLine: number;
  firstLine: number;
  /** Number of moves (or words) that broke the rule. */
  count: number;
  message: string;
};

export type LineRange = { from: number; to: number };

export type ToolUsage = {
  /**
   * Tool number; 0 = whatever was in the spindle before the first tool change; −1 = all tools
   * after the first 1000 distinct ones (reported together, with a warning).
   */
  number: number;
  /** Line spans during which this tool was in the spindle (first 1000 spans). */
  ranges: LineRange[];
  firstLine: number;
  lastLine: number;
  /** Feed rates used for cutting moves with this tool, mm/min (null if it never cut). */
  feedMmPerMin: Range | null;
  /** Spindle speeds while cutting with this tool, rpm (null if it never cut with the spindle on). */
  spindleRpm: Range | null;
  feedLengthMm: number;
  feedTimeS: number;
  /** H words used with G43 while this tool was in the spindle. */
  lengthOffsets: number[];
};

export type AxisBounds = Range & { minLine: number; maxLine: number };

/** Which checks could be run with the profiles given, so "no violations" is never overstated. */
export type ChecksRun = {
  travel: "absolute" | "span-only" | "not-checked";
  rotaryLimits: boolean;
  plateEnvelope: boolean;
  maxFeed: boolean;
  maxSpindle: boolean;
};

/** Everything but the preview arrays: what the app stores as JSON and the CLI prints. */
export type ToolpathReport = {
  sha256: string;
  bytes: number;
  lines: number;
  blocks: number;
  motionBlocks: number;
  /** Units the program declared: "mm", "inch", "mixed" (both), or "unset" (assumed mm). */
  units: "mm" | "inch" | "mixed" | "unset";
  bounds: Partial<Record<AxisName, AxisBounds>>;
  tools: ToolUsage[];
  toolChanges: number;
  feedLengthMm: number;
  rapidLengthMm: number;
  arcs: number;
  rotaryTravelDeg: Partial<Record<RotaryAxis, number>>;
  feedTimeS: number;
  rapidTimeS: number;
  dwellTimeS: number;
  toolChangeTimeS: number;
  cycleTimeS: number;
  /**
   * Moves not measured because their start or end was unknown (before the first absolute
   * position, after G28/G53 without a plate work offset, canned cycles, probing).
   */
  unmeasuredMoves: number;
  homeReturns: number;
  machineCoordinateMoves: number;
  inverseTimeBlocks: number;
  programStops: number;
  workOffsets: string[];
  blockDeleteLines: number;
  machineProfile: string;
  checks: ChecksRun;
  warnings: ToolpathWarning[];
  warningCounts: Partial<Record<WarningCode, number>>;
  /** True when more warnings occurred than were kept (see warningCounts for the totals). */
  warningsTruncated: boolean;
  violations: ToolpathViolation[];
  /** Vertices in the decimated preview and the largest deviation it allows from the path, mm. */
  previewVertices: number;
  previewToleranceMm: number;
};

/** The report to store as JSON, and the preview to encode (encodePreview) and store as a blob. */
export type ToolpathAnalysis = { report: ToolpathReport; preview: ToolpathPreview };
