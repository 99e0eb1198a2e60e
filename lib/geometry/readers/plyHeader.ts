import { GeometryInputError } from "../errors";

/** PLY header grammar (Turk's format): element/property declarations up to `end_header`. */
export type PlyScalarType = "int8" | "uint8" | "int16" | "uint16" | "int32" | "uint32" | "float32" | "float64";

export type PlyProperty =
  | { kind: "scalar"; name: string; type: PlyScalarType }
  | { kind: "list"; name: string; countType: PlyScalarType; itemType: PlyScalarType };

export type PlyElement = { name: string; count: number; properties: PlyProperty[] };

export type PlyHeader = {
  format: "ascii" | "binary_little_endian" | "binary_big_endian";
  elements: PlyElement[];
  /** Bytes from the start of the file to the first data byte. */
  length: number;
  /** Lines in the header, so errors in ascii data can name the file's line. */
  lines: number;
};

const TYPE_ALIASES: Record<string, PlyScalarType> = {
  char: "int8",
  int8: "int8",
  uchar: "uint8",
  uint8: "uint8",
  short: "int16",
  int16: "int16",
  ushort: "uint16",
  uint16: "uint16",
  int: "int32",
  int32: "int32",
  uint: "uint32",
  uint32: "uint32",
  float: "float32",
  float32: "float32",
  double: "float64",
  float64: "float64",
};

export const PLY_TYPE_SIZE: Record<PlyScalarType, number> = {
  int8: 1,
  uint8: 1,
  int16: 2,
  uint16: 2,
  int32: 4,
  uint32: 4,
  float32: 4,
  float64: 8,
};

function scalarType(word: string | undefined, line: number): PlyScalarType {
  const t = word ? TYPE_ALIASES[word] : undefined;
  if (!t) throw new GeometryInputError("bad-header", `PLY header line ${line}: unknown property type "${word ?? ""}"`);
  return t;
}

/** Largest header we accept before deciding the file is not PLY at all. */
export const MAX_PLY_HEADER = 1 << 16;

/**
 * Parses the header from the first bytes of a file. Returns null when `end_header` has not been
 * seen yet (the caller reads more), throws when the text cannot be a PLY header.
 */
export function parsePlyHeader(bytes: Uint8Array): PlyHeader | null {
  // Find "end_header" followed by a line end; the data starts after that line end.
  const limit = Math.min(bytes.length, MAX_PLY_HEADER);
  let headerEnd = -1;
  const marker = "end_header";
  for (let i = 0; i + marker.length <= limit; i++) {
    if (bytes[i] !== 101) continue; // 'e'
    let ok = true;
    for (let k = 1; k < marker.length; k++) {
      if (bytes[i + k] !== marker.charCodeAt(k)) {
        ok = false;
        break;
      }
    }
    if (!ok || (i > 0 && bytes[i - 1] !== 10)) continue;
    let j = i + marker.length;
    while (j < limit && (bytes[j] === 32 || bytes[j] === 9)) j++;
    if (j < limit && bytes[j] === 13) j++;
    if (j < limit && bytes[j] === 10) {
      headerEnd = j + 1;
      break;
    }
    if (j >= limit) break;
  }
  if (headerEnd < 0) {
    if (bytes.length >= MAX_PLY_HEADER) {
      throw new GeometryInputError("bad-header", "PLY header: no end_header line in the first 64 KiB");
    }
    return null;
  }
  const text = new TextDecoder("latin1").decode(bytes.subarray(0, headerEnd));
  const lines = text.split("\n").map((l) => l.replace(/\r$/, "").trim());
  if (lines[0] !== "ply") throw new GeometryInputError("bad-header", 'PLY header: the first line must be "ply"');
  let format: PlyHeader["format"] | null = null;
  const elements: PlyElement[] = [];
  for (let n = 1; n < lines.length; n++) {
    const line = lines[n];
    if (line === "" ) continue;
    const words = line.split(/\s+/);
    const lineNo = n + 1;
    switch (words[0]) {
      case "format": {
        const f = words[1];
        if (f !== "ascii" && f !== "binary_little_endian" && f !== "binary_big_endian") {
          throw new GeometryInputError("bad-header", `PLY header line ${lineNo}: unknown format "${f ?? ""}"`);
        }
        if (words[2] !== "1.0") {
          throw new GeometryInputError("bad-header", `PLY header line ${lineNo}: unsupported version "${words[2] ?? ""}"`);
        }
        format = f;
        break;
      }
      case "comment":
      case "obj_info":
        break;
      case "element": {
        const count = Number(words[2]);
        if (!words[1] || !Number.isInteger(count) || count < 0) {
          throw new GeometryInputError("bad-header", `PLY header line ${lineNo}: bad element declaration`);
        }
        elements.push({ name: words[1], count, properties: [] });
        break;
      }
      case "property": {
        const el = elements[elements.length - 1];
        if (!el) throw new GeometryInputError("bad-header", `PLY header line ${lineNo}: property before any element`);
        if (words[1] === "list") {
          if (words.length < 5) throw new GeometryInputError("bad-header", `PLY header line ${lineNo}: bad list property`);
          el.properties.push({
            kind: "list",
            countType: scalarType(words[2], lineNo),
            itemType: scalarType(words[3], lineNo),
            name: words[4],
          });
        } else {
          if (words.length < 3) throw new GeometryInputError("bad-header", `PLY header line ${lineNo}: bad property`);
          el.properties.push({ kind: "scalar", type: scalarType(words[1], lineNo), name: words[2] });
        }
        break;
      }
      case "end_header":
        break;
      default:
        throw new GeometryInputError("bad-header", `PLY header line ${lineNo}: unexpected "${words[0]}"`);
    }
  }
  if (!format) throw new GeometryInputError("bad-header", "PLY header: missing format line");
  return { format, elements, length: headerEnd, lines: text.split("\n").length - 1 };
}
