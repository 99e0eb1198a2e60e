/**
 * The release signature: a SHA-256 binding who released, when, which revision, and the exact
 * bytes of its toolpaths (their SHA-256s). Recomputing it later from the stored rows proves the
 * release record and the files were not changed afterwards.
 */
import crypto from "node:crypto";

export type SignatureInput = { userId: number; at: number; revisionId: number; fileSha256s: string[] };

export function releaseSignature(input: SignatureInput): string {
  const files = [...input.fileSha256s].map((s) => s.toLowerCase()).sort();
  const canonical = JSON.stringify(["portolan-release-v1", input.userId, input.at, input.revisionId, files]);
  return crypto.createHash("sha256").update(canonical).digest("hex");
}
