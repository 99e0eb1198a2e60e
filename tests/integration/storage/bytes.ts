/**
 * Deterministic pseudo-random bytes for storage tests, produced chunk by chunk so a large body
 * never has to exist in memory at once, and hashed independently of the code under test.
 */
import crypto from "node:crypto";

/** xorshift32 bytes: cheap, reproducible, and not compressible into a repeating pattern. */
export function* pseudoRandomChunks(totalBytes: number, seed = 1, chunkBytes = 1 << 20): Generator<Buffer> {
  let x = seed >>> 0 || 1;
  let left = totalBytes;
  while (left > 0) {
    const n = Math.min(chunkBytes, left);
    const chunk = Buffer.allocUnsafe(n);
    for (let i = 0; i < n; i += 4) {
      x ^= x << 13;
      x >>>= 0;
      x ^= x >>> 17;
      x ^= x << 5;
      x >>>= 0;
      chunk[i] = x & 0xff;
      if (i + 1 < n) chunk[i + 1] = (x >>> 8) & 0xff;
      if (i + 2 < n) chunk[i + 2] = (x >>> 16) & 0xff;
      if (i + 3 < n) chunk[i + 3] = (x >>> 24) & 0xff;
    }
    left -= n;
    yield chunk;
  }
}

/** SHA-256 by Node's crypto (OpenSSL), the reference the storage adapter is checked against. */
export function referenceSha256(chunks: Iterable<Buffer>): string {
  const hash = crypto.createHash("sha256");
  for (const c of chunks) hash.update(c);
  return hash.digest("hex");
}

export function concat(chunks: Iterable<Buffer>): Buffer {
  return Buffer.concat([...chunks]);
}

/** A copy typed as fetch and Blob accept it (Node's Buffer type may sit on a SharedArrayBuffer). */
export function asBody(bytes: Uint8Array): Uint8Array<ArrayBuffer> {
  return new Uint8Array(bytes);
}
