/**
 * What each kind of file may be: its size ceiling, the names we accept, and the contents the
 * sniffer must find. Pure data, shared by the browser (early refusal) and the server (the rule).
 */
import type { FileKind } from "@/db/enums";
import type { Detected } from "./sniff";

export type KindRule = {
  label: string;
  maxBytes: number;
  extensions: string[];
  accepts: Detected[];
  /** Words for the message when the content is something else. */
  expected: string;
  /** Goes to storage by presigned multipart (large) or through the upload service (small). */
  route: "multipart" | "service" | "internal";
};

const MB = 1024 * 1024;
const GB = 1024 * MB;

export const KIND_RULES: Record<FileKind, KindRule> = {
  toolpath: {
    label: "toolpath",
    maxBytes: 2 * GB,
    extensions: ["nc", "ngc", "tap", "gcode", "cnc", "txt", "mpf", "eia", "iso"],
    accepts: ["gcode"],
    expected: "a G-code program (text)",
    route: "multipart",
  },
  point_cloud: {
    label: "point cloud",
    maxBytes: 2 * GB,
    extensions: ["ply", "stl", "xyz", "csv", "txt", "asc", "pts"],
    accepts: ["ply", "stl-ascii", "stl-binary", "point-text"],
    expected: "a point cloud or mesh (PLY, STL, XYZ or CSV)",
    route: "multipart",
  },
  photo: {
    label: "photo",
    maxBytes: 16 * MB,
    extensions: ["png", "jpg", "jpeg", "webp", "gif"],
    accepts: ["png", "jpeg", "webp", "gif"],
    expected: "a photo (PNG, JPEG, WebP or GIF)",
    route: "service",
  },
  setup_sheet: {
    label: "setup sheet",
    maxBytes: 32 * MB,
    extensions: ["pdf"],
    accepts: ["pdf"],
    expected: "a PDF document",
    route: "service",
  },
  toolpath_preview: { label: "toolpath preview", maxBytes: 2 * GB, extensions: [], accepts: [], expected: "", route: "internal" },
  cloud_preview: { label: "point-cloud preview", maxBytes: 2 * GB, extensions: [], accepts: [], expected: "", route: "internal" },
};

export function formatBytes(n: number): string {
  if (n >= GB) return `${(n / GB).toFixed(n % GB === 0 ? 0 : 1)} GB`;
  if (n >= MB) return `${(n / MB).toFixed(n % MB === 0 ? 0 : 1)} MB`;
  if (n >= 1024) return `${(n / 1024).toFixed(0)} KB`;
  return `${n} bytes`;
}

export function extensionOf(name: string): string {
  const m = /\.([A-Za-z0-9]+)$/.exec(name);
  return m ? m[1].toLowerCase() : "";
}

/** Null when the name and size are acceptable for the kind, else the reason in words. */
export function checkDeclared(kind: FileKind, name: string, sizeBytes: number): string | null {
  const rule = KIND_RULES[kind];
  if (rule.route === "internal") return `${rule.label} files are made by Portolan, not uploaded.`;
  if (!Number.isSafeInteger(sizeBytes) || sizeBytes < 1) return "The file is empty.";
  if (sizeBytes > rule.maxBytes) return `The file is ${formatBytes(sizeBytes)}; a ${rule.label} may be at most ${formatBytes(rule.maxBytes)}.`;
  const ext = extensionOf(name);
  if (!rule.extensions.includes(ext)) {
    return `A ${rule.label} must be ${rule.expected} named .${rule.extensions.join(", .")}${ext ? `; .${ext} is not accepted` : ""}.`;
  }
  return null;
}
