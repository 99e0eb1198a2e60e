/**
 * Errors and warnings of the geometry engine.
 * A `GeometryInputError` means "this input cannot be analysed" (bad header, truncated file, NaN,
 * not a tube...). Callers show `message` as a one-line reason; `code` is for programs.
 */
export type GeometryErrorCode =
  | "unknown-format"
  | "bad-header"
  | "truncated"
  | "bad-number"
  | "bad-index"
  | "too-few-points"
  | "not-a-tube"
  | "bad-option";

export class GeometryInputError extends Error {
  readonly code: GeometryErrorCode;
  constructor(code: GeometryErrorCode, message: string) {
    super(message);
    this.name = "GeometryInputError";
    this.code = code;
  }
}

/** Something the user should know, but which did not stop the analysis. */
export type GeometryWarning = { code: string; message: string };
