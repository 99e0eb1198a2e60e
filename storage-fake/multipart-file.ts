/**
 * Streams one file field out of a multipart/form-data body (RFC 7578) without holding the file
 * in memory: bytes are yielded as they arrive, except for a tail as long as the boundary
 * delimiter, which may be the start of the delimiter split across two chunks.
 */

export class MultipartError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "MultipartError";
  }
}

export type FilePartInfo = { fieldName: string; fileName?: string; contentType?: string };

/** The boundary parameter of a multipart/form-data Content-Type header. */
export function boundaryOf(contentType: string | undefined): string {
  const match = /^\s*multipart\/form-data\s*;(?:.*;)?\s*boundary=(?:"([^"]+)"|([^\s;]+))/i.exec(contentType ?? "");
  const boundary = match?.[1] ?? match?.[2];
  if (!boundary) throw new MultipartError("expected a multipart/form-data body with a boundary");
  if (boundary.length > 70) throw new MultipartError("multipart boundary longer than 70 characters");
  return boundary;
}

function parsePartHeaders(block: string): FilePartInfo & { hasDisposition: boolean } {
  let fieldName = "";
  let fileName: string | undefined;
  let contentType: string | undefined;
  let hasDisposition = false;
  for (const line of block.split("\r\n")) {
    const colon = line.indexOf(":");
    if (colon < 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    const value = line.slice(colon + 1).trim();
    if (name === "content-disposition") {
      hasDisposition = true;
      fieldName = /;\s*name="([^"]*)"/i.exec(value)?.[1] ?? /;\s*name=([^;\s]+)/i.exec(value)?.[1] ?? "";
      fileName = /;\s*filename="([^"]*)"/i.exec(value)?.[1];
    } else if (name === "content-type") {
      contentType = value;
    }
  }
  return { fieldName, fileName, contentType, hasDisposition };
}

const MAX_HEADER_BYTES = 16 * 1024;
const CRLF = Buffer.from("\r\n");
const HEADER_END = Buffer.from("\r\n\r\n");

/**
 * Yields the bytes of the first part named `fieldName`. `onPart` is told its headers before
 * the first byte. Throws MultipartError when the field is missing or the body ends early
 * (a truncated upload must never count as a complete file).
 */
export async function* multipartFileBytes(
  body: AsyncIterable<Uint8Array>,
  contentType: string | undefined,
  fieldName: string,
  onPart?: (info: FilePartInfo) => void,
): AsyncGenerator<Buffer> {
  const delimiter = Buffer.from(`\r\n--${boundaryOf(contentType)}`);
  // A leading CRLF lets the first boundary line match the same delimiter as the others.
  let buf: Buffer = Buffer.from(CRLF);
  type State = "preamble" | "afterDelimiter" | "headers" | "body" | "done";
  // Widened on purpose: step() changes it, which TypeScript's flow analysis does not see.
  let state = "preamble" as State;
  let inTarget = false;
  let found = false;

  const step = function* (final: boolean): Generator<Buffer, boolean> {
    // `final` means no more input: nothing may be yielded that could be a delimiter's start.
    // Returns true when more input is needed.
    for (;;) {
      if (state === "done") return true;
      if (state === "preamble") {
        const at = buf.indexOf(delimiter);
        if (at < 0) {
          buf = buf.subarray(Math.max(0, buf.length - delimiter.length + 1));
          return true;
        }
        buf = buf.subarray(at + delimiter.length);
        state = "afterDelimiter";
      } else if (state === "afterDelimiter") {
        if (buf.length < 2) return true;
        if (buf[0] === 0x2d && buf[1] === 0x2d) {
          state = "done";
          return true;
        }
        // Linear whitespace may pad the boundary line before its CRLF.
        const eol = buf.indexOf(CRLF);
        if (eol < 0) {
          if (buf.length > 256) throw new MultipartError("malformed boundary line");
          return true;
        }
        if (buf.subarray(0, eol).toString("latin1").trim() !== "") throw new MultipartError("malformed boundary line");
        buf = buf.subarray(eol + 2);
        state = "headers";
      } else if (state === "headers") {
        const end = buf.indexOf(HEADER_END);
        // A part without headers starts directly with the blank line.
        const emptyHeaders = buf.length >= 2 && buf[0] === 0x0d && buf[1] === 0x0a;
        if (end < 0 && !emptyHeaders) {
          if (buf.length > MAX_HEADER_BYTES) throw new MultipartError("part headers too large");
          return true;
        }
        const block = emptyHeaders ? "" : buf.subarray(0, end).toString("utf8");
        buf = buf.subarray(emptyHeaders ? 2 : end + 4);
        const info = parsePartHeaders(block);
        inTarget = !found && info.hasDisposition && info.fieldName === fieldName;
        if (inTarget) onPart?.({ fieldName: info.fieldName, fileName: info.fileName, contentType: info.contentType });
        state = "body";
      } else {
        const at = buf.indexOf(delimiter);
        if (at >= 0) {
          if (inTarget && at > 0) yield buf.subarray(0, at);
          buf = buf.subarray(at + delimiter.length);
          if (inTarget) found = true;
          inTarget = false;
          state = "afterDelimiter";
          continue;
        }
        const safe = final ? 0 : buf.length - delimiter.length + 1;
        if (safe > 0) {
          if (inTarget) yield buf.subarray(0, safe);
          buf = buf.subarray(safe);
        }
        return true;
      }
    }
  };

  const finished = () => state === "done";
  for await (const chunk of body) {
    if (finished()) continue; // drain the epilogue
    buf = buf.length ? Buffer.concat([buf, chunk]) : Buffer.from(chunk);
    yield* step(false);
  }
  if (!finished()) throw new MultipartError("multipart body ended before its closing boundary");
  if (!found) throw new MultipartError(`no "${fieldName}" field in the multipart body`);
}
