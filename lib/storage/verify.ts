/**
 * Proving a stored file is the one recorded: its SHA-256, computed by streaming it back.
 * A cut record freezes the hash of the program it used; these functions check it.
 */
import { sha256OfStream, verifyingPassThrough, type Digest } from "./checksum";
import type { StorageTarget } from "./client";
import { StorageChecksumMismatchError } from "./errors";
import { getStream, type GetResult } from "./objects";

export async function sha256OfObject(t: StorageTarget, key: string): Promise<Digest> {
  const { body } = await getStream(t, key);
  return sha256OfStream(body);
}

/** Reads the whole object and throws StorageChecksumMismatchError unless it hashes as expected. */
export async function verifyObject(t: StorageTarget, key: string, expectedSha256: string): Promise<Digest> {
  const digest = await sha256OfObject(t, key);
  const expected = expectedSha256.toLowerCase();
  if (digest.sha256 !== expected) throw new StorageChecksumMismatchError(key, expected, digest.sha256, digest.sizeBytes);
  return digest;
}

/**
 * The object's bytes, failing with StorageChecksumMismatchError at the end instead of ending
 * normally when they do not match `expectedSha256`. Bytes are unconfirmed until the end.
 */
export async function getVerifiedStream(t: StorageTarget, key: string, expectedSha256: string): Promise<GetResult> {
  const checker = verifyingPassThrough(key, expectedSha256);
  const got = await getStream(t, key);
  got.body.on("error", (err) => checker.destroy(err));
  return { ...got, body: got.body.pipe(checker) };
}
