/**
 * What a file really is, from its first bytes, whatever its name says. Enough to refuse a photo
 * uploaded as a program or a ZIP as a point cloud; the engines do the deep checks.
 */
export type Detected =
  | "png"
  | "jpeg"
  | "gif"
  | "webp"
  | "pdf"
  | "zip"
  | "gzip"
  | "ply"
  | "stl-ascii"
  | "stl-binary"
  | "gcode"
  | "point-text"
  | "text"
  | "binary"
  | "empty";

export const DETECTED_LABEL: Record<Detected, string> = {
  png: "a PNG image",
  jpeg: "a JPEG image",
  gif: "a GIF image",
  webp: "a WebP image",
  pdf: "a PDF document",
  zip: "a ZIP archive (or an Office document)",
  gzip: "a gzip-compressed file",
  ply: "a PLY point cloud",
  "stl-ascii": "an STL mesh (text)",
  "stl-binary": "an STL mesh (binary)",
  gcode: "a G-code program",
  "point-text": "a text point list (XYZ/CSV)",
  text: "a text file that is neither G-code nor a point list",
  binary: "a binary file of unknown type",
  empty: "an empty file",
};

/** How many leading bytes the sniffer looks at. */
export const SNIFF_BYTES = 8192;

const startsWith = (b: Uint8Array, sig: number[], at = 0) => sig.every((v, i) => b[at + i] === v);
const ascii = (s: string) => [...s].map((c) => c.charCodeAt(0));

function isText(b: Uint8Array): boolean {
  let control = 0;
  let high = 0;
  for (const c of b) {
    if (c === 0) return false;
    if ((c < 32 && c !== 9 && c !== 10 && c !== 13 && c !== 12) || c === 127) control++;
    else if (c >= 128) high++;
  }
  return control * 50 <= b.length && high * 10 <= b.length * 3;
}

/** Drops `( … )` and `;` comments so only words remain. */
function gcodeWords(text: string): string[] {
  return text
    .split(/\r?\n|\r/)
    .map((l) => l.replace(/\([^)]*\)?/g, " ").replace(/;.*$/, "").trim())
    .filter((l) => l.length > 0);
}

function looksLikeGcode(text: string): boolean {
  const lines = gcodeWords(text).slice(0, 200);
  if (lines.length === 0) return /\(/.test(text); // comments only: let the engine decide
  let words = 0;
  let motion = 0;
  for (const l of lines) {
    if (/^%$/.test(l)) continue;
    // A block is address letters followed by numbers (or # parameters), blanks allowed.
    if (/^(\/?\s*)([A-Za-z]\s*[-+]?\s*(\d[\d\s]*\.?[\d\s]*|\.\s*\d[\d\s]*|#\d+|\[[^\]]*\])\s*)+$/.test(l)) words++;
    if (/(^|[^A-Za-z])[GgMmTtXxYyZz]\s*[-+]?\s*[\d.]/.test(l)) motion++;
  }
  return words >= Math.max(1, Math.ceil(lines.length * 0.6)) && motion > 0;
}

function looksLikePoints(text: string): boolean {
  const lines = text.split(/\r?\n|\r/).map((l) => l.trim()).filter((l) => l && !l.startsWith("#") && !l.startsWith("//"));
  const sample = lines.slice(0, 50);
  if (sample.length === 0) return false;
  const numeric = sample.filter((l) => {
    const parts = l.split(/[\s,;]+/).filter(Boolean);
    return parts.length >= 3 && parts.slice(0, 3).every((p) => /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(p));
  });
  // A header line is allowed; most lines must be three or more numbers.
  return numeric.length >= Math.max(1, sample.length - 1);
}

/**
 * Detects the type from the first bytes; `sizeBytes` (the whole file's) tells binary STL apart,
 * whose size is exactly 84 + 50 × its triangle count (3D Systems STL specification).
 */
export function sniffContent(head: Uint8Array, sizeBytes: number): Detected {
  if (head.length === 0) return "empty";
  if (startsWith(head, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return "png";
  if (startsWith(head, [0xff, 0xd8, 0xff])) return "jpeg";
  if (startsWith(head, ascii("GIF87a")) || startsWith(head, ascii("GIF89a"))) return "gif";
  if (startsWith(head, ascii("RIFF")) && startsWith(head, ascii("WEBP"), 8)) return "webp";
  if (startsWith(head, ascii("%PDF-"))) return "pdf";
  if (startsWith(head, [0x50, 0x4b, 0x03, 0x04]) || startsWith(head, [0x50, 0x4b, 0x05, 0x06])) return "zip";
  if (startsWith(head, [0x1f, 0x8b])) return "gzip";
  if (startsWith(head, ascii("ply\n")) || startsWith(head, ascii("ply\r\n"))) return "ply";
  if (head.length >= 84) {
    const triangles = new DataView(head.buffer, head.byteOffset, head.byteLength).getUint32(80, true);
    if (sizeBytes === 84 + 50 * triangles && triangles > 0) return "stl-binary";
  }
  if (!isText(head)) return "binary";
  // Cut at the last line end: the sniffed window may end mid-line.
  let text = new TextDecoder("latin1").decode(head);
  if (head.length < sizeBytes) {
    const cut = Math.max(text.lastIndexOf("\n"), text.lastIndexOf("\r"));
    if (cut > 0) text = text.slice(0, cut);
  }
  if (/^\s*solid\b/i.test(text) && /facet|endsolid/i.test(text)) return "stl-ascii";
  if (looksLikePoints(text)) return "point-text";
  if (looksLikeGcode(text)) return "gcode";
  return "text";
}
