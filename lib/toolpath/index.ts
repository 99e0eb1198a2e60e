/** Toolpath analysis engine: public surface for the app, the CLI, workers and tests. */
export {
  analyzeToolpath,
  analyzeToolpathFile,
  analyzeToolpathText,
  ToolpathAnalyzer,
  ToolpathInputError,
  DEFAULT_PREVIEW_MAX_VERTICES,
  type ByteSource,
  type InputProblem,
} from "./analyze";
export {
  encodePreview,
  decodePreview,
  previewToolIndex,
  PREVIEW_RAPID,
  PREVIEW_BREAK,
  PREVIEW_TOOL_SHIFT,
  PREVIEW_MAX_TOOL_INDEX,
  type ToolpathPreview,
} from "./preview";
export { ASSUMED_MACHINE, parseMachineProfile, parsePlateEnvelope, ProfileError } from "./profile";
export { generatePortProgram, type PortProgramOptions } from "./generate";
export { formatSummary } from "./summary";
export * from "./types";
