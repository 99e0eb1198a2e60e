/**
 * Digitized port geometry: readers, the port profile, scan comparison and the preview cloud.
 * Plain TypeScript with no framework imports; `fileio.ts` (Node file helpers) is kept apart so a
 * browser bundle can import this index.
 */
export type { ByteSource } from "./bytes";
export { GeometryInputError, type GeometryErrorCode, type GeometryWarning } from "./errors";
export type { CloudFormat, LengthUnit, PointCloud, Vec3 } from "./types";
export { readPointCloud, formatFromFilename, type ReadFormat, type ReadOptions } from "./readers/index";
export {
  analyzePort,
  throatGuideline,
  MIN_POINTS,
  type AnalyzeOptions,
  type MinSection,
  type PortAnalysis,
  type PortKind,
  type PortReport,
  type SectionResult,
  type ThroatGuideline,
} from "./analyze";
export { compareScans, pointDeviation, type CompareOptions, type DeviationStats, type ScanComparison, type StationDifference } from "./compare";
export { meshReport, signedVolume, weldVertices, type MeshReport } from "./mesh";
export { buildPreviewCloud, decodePreviewCloud, encodePreviewCloud, PREVIEW_HEADER_BYTES, type PreviewCloud } from "./preview";
export { cloudStats, type Bounds, type CloudStats } from "./stats";
export { signedArea, perimeter, equivalentDiameter, hydraulicDiameter, convexHull } from "./polygon";
export * from "./generate";
export { writePly, writeStlAscii, writeStlBinary, writeXyz, collectBytes, type PlyLayout } from "./writers";
