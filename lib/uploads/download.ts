/**
 * Every download is checked against the SHA-256 recorded when the file was stored: bytes stream
 * through a verifying pass-through, and a mismatch breaks the download (the stream errors at
 * the end instead of finishing) and leaves an audit event. Nothing is buffered.
 */
import type { Readable } from "node:stream";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { storedFiles } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { EVERYONE } from "../auth/roles";
import { AppError } from "../errors";
import { StorageChecksumMismatchError, type Storage } from "../storage";

export type Download = { body: Readable; fileName: string; contentType: string; sizeBytes: number; sha256: string };

export async function openDownload(db: Db, store: Storage, actor: Actor | null, fileId: number): Promise<Download> {
  const who = requireRole(actor, EVERYONE);
  const file = db.select().from(storedFiles).where(eq(storedFiles.id, fileId)).get();
  if (!file) throw new AppError("not_found", "That file was not found.");
  if (file.state !== "stored" || !file.sha256) throw new AppError("conflict", "That file has not finished uploading.");
  const got = await store.getVerifiedStream(file.storageKey, file.sha256);
  got.body.once("error", (err) => {
    if (!(err instanceof StorageChecksumMismatchError)) return;
    console.error(`[files] checksum mismatch on file ${file.id} (${file.storageKey}): expected ${err.expectedSha256}, read ${err.actualSha256}`);
    try {
      recordAudit(db, {
        actor: who,
        action: "file.checksum_mismatch",
        entity: "stored_file",
        entityId: file.id,
        after: { key: file.storageKey, expected: err.expectedSha256, actual: err.actualSha256, sizeBytes: err.sizeBytes },
      });
    } catch (auditErr) {
      console.error("[files] could not record the mismatch", auditErr);
    }
  });
  return { body: got.body, fileName: file.originalName, contentType: file.contentType, sizeBytes: file.sizeBytes, sha256: file.sha256 };
}
