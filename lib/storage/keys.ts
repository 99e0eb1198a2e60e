/**
 * Object keys are ours: a kind, then an id we generated or a content hash. A client's file name
 * never becomes a key (it could collide, leak, or smuggle `../`); it is kept as a record field
 * and offered back as the download name.
 */
import crypto from "node:crypto";

const KIND = /^[a-z][a-z0-9_]{0,31}$/;
const ID = /^[A-Za-z0-9_-]{8,64}$/;
const SHA256 = /^[0-9a-f]{64}$/;

/** A new random id for an object (128 bits, hex). */
export function newObjectId(): string {
  return crypto.randomUUID().replaceAll("-", "");
}

/**
 * `<kind>/<first two characters>/<id>`, e.g. `toolpath/3f/3f2a…`. The short fan-out keeps any
 * one folder small on stores that map keys to directories.
 */
export function objectKey(kind: string, id: string): string {
  if (!KIND.test(kind)) throw new Error(`storage kind must be lower-case letters, digits or _: ${JSON.stringify(kind)}`);
  if (kind === "sha256") throw new Error("the sha256 kind is reserved for contentKey");
  if (!ID.test(id)) throw new Error(`storage id must be 8-64 letters, digits, _ or -: ${JSON.stringify(id)}`);
  return `${kind}/${id.slice(0, 2).toLowerCase()}/${id}`;
}

/** `sha256/<first two hex digits>/<hex>`: one object per distinct content. */
export function contentKey(sha256Hex: string): string {
  const hex = sha256Hex.toLowerCase();
  if (!SHA256.test(hex)) throw new Error("content key needs a SHA-256 as 64 hex digits");
  return `sha256/${hex.slice(0, 2)}/${hex}`;
}

/** Reads a key made by objectKey or contentKey back; null for anything else. */
export function parseKey(key: string): { kind: string; id: string } | null {
  const m = /^([a-z][a-z0-9_]{0,31})\/([A-Za-z0-9_-]{2})\/([A-Za-z0-9_-]{8,64})$/.exec(key);
  if (!m || m[2] !== m[3]!.slice(0, 2).toLowerCase()) return null;
  if (m[1] === "sha256" && !SHA256.test(m[3]!)) return null;
  return { kind: m[1]!, id: m[3]! };
}
