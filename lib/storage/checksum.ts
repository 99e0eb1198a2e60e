/** SHA-256 while bytes stream past, so no file is ever held whole in memory to be hashed. */
import crypto from "node:crypto";
import { Transform, type Readable } from "node:stream";
import { StorageChecksumMismatchError } from "./errors";

export type Digest = { sha256: string; sizeBytes: number };

/** A pass-through that hashes; `digest()` is valid once the stream has ended. */
export function hashingPassThrough(): Transform & { digest(): Digest } {
  const hash = crypto.createHash("sha256");
  let sizeBytes = 0;
  let hex: string | undefined;
  const stream = new Transform({
    transform(chunk: Buffer, _enc, done) {
      hash.update(chunk);
      sizeBytes += chunk.length;
      done(null, chunk);
    },
    flush(done) {
      hex = hash.digest("hex");
      done();
    },
  });
  return Object.assign(stream, {
    digest(): Digest {
      if (hex === undefined) throw new Error("digest() called before the stream ended");
      return { sha256: hex, sizeBytes };
    },
  });
}

export async function sha256OfStream(source: AsyncIterable<Uint8Array>): Promise<Digest> {
  const hash = crypto.createHash("sha256");
  let sizeBytes = 0;
  for await (const chunk of source) {
    hash.update(chunk);
    sizeBytes += chunk.length;
  }
  return { sha256: hash.digest("hex"), sizeBytes };
}

/**
 * Passes bytes through and fails the stream (instead of ending it) when they do not hash to
 * `expectedSha256`. Whoever consumes it must treat the bytes as unconfirmed until the end:
 * write to a temporary file and rename, or let the download break.
 */
export function verifyingPassThrough(key: string, expectedSha256: string): Transform {
  const expected = expectedSha256.toLowerCase();
  if (!/^[0-9a-f]{64}$/.test(expected)) throw new Error("expected SHA-256 must be 64 hex digits");
  const hash = crypto.createHash("sha256");
  let sizeBytes = 0;
  return new Transform({
    transform(chunk: Buffer, _enc, done) {
      hash.update(chunk);
      sizeBytes += chunk.length;
      done(null, chunk);
    },
    flush(done) {
      const actual = hash.digest("hex");
      done(actual === expected ? null : new StorageChecksumMismatchError(key, expected, actual, sizeBytes));
    },
  });
}

export type { Readable };
