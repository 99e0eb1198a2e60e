/**
 * Files that arrive on the server side (the demo seed, the command line): streamed into the
 * bucket under our key with their SHA-256, sniffed like a browser upload, linked to their
 * revision or scan, and queued for analysis — the same records a browser upload leaves.
 */
import { Readable, Transform } from "node:stream";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { revisionFiles, revisions, scanFiles, storedFiles } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { AppError } from "../errors";
import { enqueueAnalysis } from "../analysis/queue";
import { newObjectId, objectKey, type Storage } from "../storage";
import { checkDeclared, KIND_RULES } from "./limits";
import { DETECTED_LABEL, SNIFF_BYTES, sniffContent } from "./sniff";
import { UPLOADERS } from "./sessions";

export type IngestInput = {
  kind: "toolpath" | "point_cloud";
  fileName: string;
  /** Chunks (strings are UTF-8 encoded); never collected whole. */
  source: AsyncIterable<Uint8Array | string> | Iterable<Uint8Array | string>;
} & ({ revisionId: number } | { scanId: number });

export async function ingestFile(db: Db, store: Storage, actor: Actor | null, input: IngestInput, now = Date.now()) {
  const who = requireRole(actor, UPLOADERS);
  if ("revisionId" in input) {
    const rev = db.select({ state: revisions.state }).from(revisions).where(eq(revisions.id, input.revisionId)).get();
    if (!rev) throw new AppError("not_found", "That revision was not found.");
    if (rev.state !== "draft") throw new AppError("conflict", "Only a draft revision takes new files.");
  }
  const named = checkDeclared(input.kind, input.fileName, 1);
  if (named) throw new AppError("unsupported_type", named);
  const head = new Uint8Array(SNIFF_BYTES);
  let headLength = 0;
  const encoder = new TextEncoder();
  const capture = new Transform({
    transform(chunk: Buffer | string, _enc, done) {
      const bytes = typeof chunk === "string" ? encoder.encode(chunk) : chunk;
      if (headLength < SNIFF_BYTES) {
        const take = Math.min(SNIFF_BYTES - headLength, bytes.length);
        head.set(bytes.subarray(0, take), headLength);
        headLength += take;
      }
      done(null, bytes);
    },
  });
  const key = objectKey(input.kind, newObjectId());
  const put = await store.putStream(key, Readable.from(input.source as Iterable<Uint8Array>).pipe(capture), { contentType: input.kind === "toolpath" ? "text/plain" : "application/octet-stream" });
  const rule = KIND_RULES[input.kind];
  const detected = sniffContent(head.subarray(0, headLength), put.sizeBytes);
  if (!rule.accepts.includes(detected) || put.sizeBytes > rule.maxBytes) {
    await store.delete(key);
    throw new AppError("unsupported_type", `“${input.fileName}” is ${DETECTED_LABEL[detected]}, not ${rule.expected}.`);
  }
  return db.transaction((tx) => {
    const row = tx
      .insert(storedFiles)
      .values({ kind: input.kind, storageKey: key, originalName: input.fileName, contentType: input.kind === "toolpath" ? "text/plain" : "application/octet-stream", sizeBytes: put.sizeBytes, sha256: put.sha256, state: "stored", uploadedById: who.id, createdAt: now, updatedAt: now })
      .returning()
      .get();
    if ("revisionId" in input) tx.insert(revisionFiles).values({ revisionId: input.revisionId, fileId: row.id, role: "toolpath" }).run();
    else tx.insert(scanFiles).values({ scanId: input.scanId, fileId: row.id }).run();
    const analysisId = enqueueAnalysis(tx as unknown as Db, row.id, row.kind, now);
    recordAudit(tx, { actor: who, action: "file.upload", entity: "stored_file", entityId: row.id, after: { name: row.originalName, kind: row.kind, sizeBytes: row.sizeBytes, sha256: row.sha256 } }, now);
    return { file: row, analysisId };
  });
}
