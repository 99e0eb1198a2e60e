import { ByteCursor, type ByteSource } from "../bytes";
import { GeometryInputError } from "../errors";
import type { LengthUnit, PointCloud } from "../types";
import { readPly } from "./ply";
import { readStl } from "./stl";
import { readXyz } from "./xyz";

export type ReadFormat = "ply" | "stl" | "xyz" | "csv";

export type ReadOptions = {
  /** Overrides detection from the file name and the first bytes. */
  format?: ReadFormat;
  /** Used for detection by extension (.ply, .stl, .xyz, .csv, .txt, .asc, .pts). */
  filename?: string;
  /** Units of the coordinates in the file; results are always millimetres. Default mm. */
  units?: LengthUnit;
  /** Total size in bytes when known (file size, Content-Length): binary STL is detected by it. */
  sizeBytes?: number;
  /** Called after each chunk with the bytes read so far. */
  onProgress?: (bytesRead: number) => void;
};

const EXTENSIONS: Record<string, ReadFormat> = {
  ply: "ply",
  stl: "stl",
  xyz: "xyz",
  csv: "csv",
  txt: "xyz",
  asc: "xyz",
  pts: "xyz",
};

export function formatFromFilename(name: string | undefined): ReadFormat | undefined {
  const m = name ? /\.([A-Za-z0-9]+)$/.exec(name) : null;
  return m ? EXTENSIONS[m[1].toLowerCase()] : undefined;
}

function sniff(b: Uint8Array, pos: number, end: number): ReadFormat {
  const head = new TextDecoder("latin1").decode(b.subarray(pos, Math.min(end, pos + 512)));
  if (/^ply\r?\n/.test(head)) return "ply";
  if (/^\s*solid\b/i.test(head)) return "stl";
  // Binary content (NUL or other control bytes) can only be binary STL among our formats.
  for (let i = pos; i < Math.min(end, pos + 512); i++) {
    const c = b[i];
    if (c === 0 || (c < 32 && c !== 9 && c !== 10 && c !== 13)) return "stl";
  }
  if (/^[\s\d+\-.,;eE#/a-zA-Z_"()[\]]*$/.test(head)) return "xyz";
  throw new GeometryInputError("unknown-format", "cannot tell the file format (expected PLY, STL, XYZ or CSV)");
}

/**
 * Reads a point cloud or mesh from a stream of bytes into typed arrays.
 * Throws GeometryInputError with a one-line reason for anything it cannot read.
 */
export async function readPointCloud(source: ByteSource, options: ReadOptions = {}): Promise<PointCloud> {
  const scale = options.units === "in" ? 25.4 : 1;
  if (options.units && options.units !== "mm" && options.units !== "in") {
    throw new GeometryInputError("bad-option", `unknown units "${String(options.units)}" (mm or in)`);
  }
  const cur = new ByteCursor(source, options.onProgress);
  await cur.fill(512);
  if (cur.available === 0) throw new GeometryInputError("bad-header", "empty file");
  const format = options.format ?? formatFromFilename(options.filename) ?? sniff(cur.buf, cur.pos, cur.end);
  switch (format) {
    case "ply":
      return readPly(cur, scale);
    case "stl":
      return readStl(cur, scale, options.sizeBytes);
    case "xyz":
    case "csv":
      return readXyz(cur, scale, options.sizeBytes);
    default:
      throw new GeometryInputError("unknown-format", `unknown format "${String(format)}"`);
  }
}
