/**
 * Browser uploads straight to the bucket: open (row + multipart upload + presigned part URLs),
 * complete (join the parts, then stream the object once to hash and sniff it), abort, and the
 * sweep that removes uploads abandoned half-way. The app server never holds a whole file.
 */
import crypto from "node:crypto";
import { and, eq, lt } from "drizzle-orm";
import type { Db } from "@/db/client";
import { revisionFiles, revisions, scanFiles, scans, storedFiles, type FileKind } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { LEADS, MACHINISTS } from "../auth/roles";
import { AppError } from "../errors";
import { enqueueAnalysis } from "../analysis/queue";
import { newObjectId, objectKey, planParts, type Storage } from "../storage";
import { parseInput } from "../validation";
import { checkDeclared, KIND_RULES } from "./limits";
import { completeSchema, partsSchema, startUploadSchema } from "./schema";
import { DETECTED_LABEL, SNIFF_BYTES, sniffContent } from "./sniff";

export const UPLOADERS = MACHINISTS;
/** Presigned URLs handed out with the answer to `start`; the rest come from `presignParts`. */
const FIRST_BATCH = 64;
const PART_URL_TTL_S = 6 * 3600;

type FileRow = typeof storedFiles.$inferSelect;

export type StartedUpload = {
  fileId: number;
  partSizeBytes: number;
  partCount: number;
  parts: Array<{ partNumber: number; url: string }>;
};

export async function startUpload(db: Db, store: Storage, actor: Actor | null, input: unknown, now = Date.now()): Promise<StartedUpload> {
  const who = requireRole(actor, UPLOADERS);
  const v = parseInput(startUploadSchema, input);
  const refused = checkDeclared(v.kind, v.fileName, v.sizeBytes);
  if (refused) throw new AppError(v.sizeBytes > KIND_RULES[v.kind].maxBytes ? "too_large" : "unsupported_type", refused, { file: [refused] });
  if (v.revisionId != null) {
    const rev = db.select({ state: revisions.state, letter: revisions.letter }).from(revisions).where(eq(revisions.id, v.revisionId)).get();
    if (!rev) throw new AppError("not_found", "That revision was not found.");
    if (rev.state !== "draft") throw new AppError("conflict", `Revision ${rev.letter} is no longer a draft: its files are fixed.`);
  }
  if (v.scanId != null && !db.select({ id: scans.id }).from(scans).where(eq(scans.id, v.scanId)).get()) {
    throw new AppError("not_found", "That scan was not found.");
  }
  const plan = planParts(v.sizeBytes);
  const key = objectKey(v.kind, newObjectId());
  const contentType = v.kind === "toolpath" ? "text/plain" : "application/octet-stream";
  const ref = await store.createMultipartUpload(key, { contentType });
  const file = db.transaction((tx) => {
    const row = tx
      .insert(storedFiles)
      .values({ kind: v.kind, storageKey: key, originalName: v.fileName, contentType, sizeBytes: v.sizeBytes, state: "uploading", uploadId: ref.uploadId, uploadedById: who.id, createdAt: now, updatedAt: now })
      .returning()
      .get();
    if (v.revisionId != null) tx.insert(revisionFiles).values({ revisionId: v.revisionId, fileId: row.id, role: "toolpath" }).run();
    if (v.scanId != null) tx.insert(scanFiles).values({ scanId: v.scanId, fileId: row.id }).run();
    return row;
  });
  const first = plan.parts.slice(0, FIRST_BATCH).map((p) => p.partNumber);
  const parts = await store.presignUploadParts({ ...ref, partNumbers: first, expiresInSeconds: PART_URL_TTL_S });
  return { fileId: file.id, partSizeBytes: plan.partSizeBytes, partCount: plan.partCount, parts };
}

function loadUploading(db: Db, who: Actor, fileId: number): FileRow & { uploadId: string } {
  const file = db.select().from(storedFiles).where(eq(storedFiles.id, fileId)).get();
  if (!file) throw new AppError("not_found", "That upload was not found.");
  if (file.uploadedById !== who.id && !LEADS.includes(who.role)) throw new AppError("forbidden", "This upload belongs to someone else.");
  if (file.state !== "uploading" || !file.uploadId) throw new AppError("conflict", "This upload is already finished or cancelled.");
  return file as FileRow & { uploadId: string };
}

export async function presignParts(db: Db, store: Storage, actor: Actor | null, fileId: number, input: unknown) {
  const who = requireRole(actor, UPLOADERS);
  const { partNumbers } = parseInput(partsSchema, input);
  const file = loadUploading(db, who, fileId);
  const plan = planParts(file.sizeBytes);
  if (partNumbers.some((n) => n > plan.partCount)) throw new AppError("invalid", `This file has ${plan.partCount} parts.`);
  return { parts: await store.presignUploadParts({ key: file.storageKey, uploadId: file.uploadId, partNumbers, expiresInSeconds: PART_URL_TTL_S }) };
}

/** Removes a file that never became stored, with its links (the object is deleted by the caller). */
function forgetFile(db: Db, fileId: number) {
  db.transaction((tx) => {
    tx.delete(revisionFiles).where(eq(revisionFiles.fileId, fileId)).run();
    tx.delete(scanFiles).where(eq(scanFiles.fileId, fileId)).run();
    tx.delete(storedFiles).where(eq(storedFiles.id, fileId)).run();
  });
}

export type CompletedUpload = { file: FileRow; analysisId: number };

/** Reads the object once: SHA-256, true size and the first bytes for the sniffer. */
async function inspectObject(store: Storage, key: string) {
  const { body } = await store.getStream(key);
  const hash = crypto.createHash("sha256");
  const head = new Uint8Array(SNIFF_BYTES);
  let headLength = 0;
  let sizeBytes = 0;
  for await (const chunk of body as AsyncIterable<Uint8Array>) {
    hash.update(chunk);
    if (headLength < SNIFF_BYTES) {
      const take = Math.min(SNIFF_BYTES - headLength, chunk.length);
      head.set(chunk.subarray(0, take), headLength);
      headLength += take;
    }
    sizeBytes += chunk.length;
  }
  return { sha256: hash.digest("hex"), sizeBytes, head: head.subarray(0, headLength) };
}

export async function completeUpload(db: Db, store: Storage, actor: Actor | null, fileId: number, input: unknown, now = Date.now()): Promise<CompletedUpload> {
  const who = requireRole(actor, UPLOADERS);
  const { parts } = parseInput(completeSchema, input);
  const file = loadUploading(db, who, fileId);
  await store.completeMultipartUpload({ key: file.storageKey, uploadId: file.uploadId, parts });
  const seen = await inspectObject(store, file.storageKey);
  const rule = KIND_RULES[file.kind];
  const detected = sniffContent(seen.head, seen.sizeBytes);
  const refusal =
    seen.sizeBytes > rule.maxBytes
      ? { code: "too_large" as const, message: `The file arrived as ${seen.sizeBytes} bytes, over the limit for a ${rule.label}.` }
      : !rule.accepts.includes(detected)
        ? { code: "unsupported_type" as const, message: `“${file.originalName}” is ${DETECTED_LABEL[detected]}, not ${rule.expected}. It was not kept.` }
        : null;
  if (refusal) {
    await store.delete(file.storageKey);
    forgetFile(db, fileId);
    recordAudit(db, { actor: who, action: "file.refused", entity: "stored_file", entityId: fileId, after: { name: file.originalName, kind: file.kind, detected, reason: refusal.message } }, now);
    throw new AppError(refusal.code, refusal.message, { file: [refusal.message] });
  }
  return db.transaction((tx) => {
    const row = tx
      .update(storedFiles)
      .set({ state: "stored", sha256: seen.sha256, sizeBytes: seen.sizeBytes, uploadId: null, updatedAt: now })
      .where(and(eq(storedFiles.id, fileId), eq(storedFiles.state, "uploading")))
      .returning()
      .get();
    if (!row) throw new AppError("conflict", "This upload was finished or cancelled meanwhile.");
    const analysisId = enqueueAnalysis(tx as unknown as Db, row.id, row.kind as FileKind, now);
    recordAudit(tx, { actor: who, action: "file.upload", entity: "stored_file", entityId: row.id, after: { name: row.originalName, kind: row.kind, sizeBytes: row.sizeBytes, sha256: row.sha256 } }, now);
    return { file: row, analysisId };
  });
}

/** Cancel: drops the parts already sent and the half-made record. */
export async function abortUpload(db: Db, store: Storage, actor: Actor | null, fileId: number): Promise<{ fileId: number; aborted: true }> {
  const who = requireRole(actor, UPLOADERS);
  const file = loadUploading(db, who, fileId);
  await store.abortMultipartUpload({ key: file.storageKey, uploadId: file.uploadId });
  forgetFile(db, fileId);
  return { fileId, aborted: true };
}

export type SweepResult = { rowsRemoved: number; uploadsAborted: number; orphanUploadsAborted: number };

/**
 * Uploads left half-way (closed tab, lost network): rows still `uploading` after
 * `olderThanHours` are aborted and removed, and any multipart upload the bucket still holds
 * from before that is aborted too. Safe to run at any time, e.g. at server start.
 */
export async function sweepAbandonedUploads(db: Db, store: Storage, opts: { olderThanHours?: number; now?: number } = {}): Promise<SweepResult> {
  const hours = opts.olderThanHours ?? 24;
  const now = opts.now ?? Date.now();
  const cutoff = now - hours * 3600_000;
  const stale = db.select().from(storedFiles).where(and(eq(storedFiles.state, "uploading"), lt(storedFiles.createdAt, cutoff))).all();
  let uploadsAborted = 0;
  for (const f of stale) {
    if (f.uploadId) {
      await store.abortMultipartUpload({ key: f.storageKey, uploadId: f.uploadId });
      uploadsAborted++;
    }
    await store.delete(f.storageKey);
    forgetFile(db, f.id);
  }
  const orphans = await store.abortStaleMultipartUploads({ olderThanHours: hours, now: new Date(now) });
  if (stale.length > 0) {
    recordAudit(db, { actor: { id: null, email: "system" }, action: "file.sweep", entity: "stored_file", after: { removed: stale.map((f) => f.id), olderThanHours: hours } }, now);
  }
  return { rowsRemoved: stale.length, uploadsAborted, orphanUploadsAborted: orphans.aborted.length };
}
