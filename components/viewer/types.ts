/**
 * The parts of the stored analysis results the views read (the engines' full types stay in the
 * engines; a page passes the stored JSON through and these say what is relied on).
 */
import type { SectionLike, Vec3 } from "./sections";

type Range = { min: number; max: number };

export type ToolpathResultLite = {
  lines: number;
  cycleTimeS: number;
  feedLengthMm: number;
  rapidLengthMm: number;
  previewVertices?: number;
  previewToleranceMm?: number;
  machineProfile?: string;
  tools: Array<{ number: number; feedLengthMm: number; feedTimeS: number; feedMmPerMin: Range | null; spindleRpm: Range | null }>;
  violations: Array<{ kind: string; axis?: string; message: string; worstLine: number; firstLine: number; count: number }>;
  checks?: { plateEnvelope: boolean; travel: string };
};

export type GeometryResultLite = {
  points: number;
  stepMm: number;
  centerline: { lengthMm: number; points: Vec3[] };
  sections: SectionLike[];
  minSection: { stationMm: number; areaMm2: number; equivalentDiameterMm: number; percentOfValve: number | null } | null;
  volumeCc: number;
  valveDiameterMm: number | null;
  guideline?: { basis: string; verdict: "below" | "within" | "above" | null; lowPercent?: number; highPercent?: number };
};

export type BoxJson = { min: { x: number; y: number; z: number }; max: { x: number; y: number; z: number } };

/** What the revision page hands the toolpath view about the plate and machine. */
export type SetupContext = {
  plateCode: string | null;
  plateEnvelope: BoxJson | null;
  workOffset: { x?: number; y?: number; z?: number } | null;
  machineName: string | null;
  machineTravel: Partial<Record<"X" | "Y" | "Z", Range>> | null;
};

/** One side of a two-scan comparison, as the page hands it to the view. */
export type ScanSide = { analysisId: number; result: GeometryResultLite; label: string };
