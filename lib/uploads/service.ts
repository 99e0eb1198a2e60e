/**
 * Photos and setup sheets arrive through the upload service (uploadthing); when one is done we
 * copy it into our own bucket under our own key — streaming, hashing and sniffing on the way —
 * so every file the shop keeps lives in one place with a SHA-256, whatever route it came by.
 */
import { Readable, Transform } from "node:stream";
import { eq } from "drizzle-orm";
import { z } from "zod";
import type { Db } from "@/db/client";
import { attachments, fixturePlates, masterHeads, revisionFiles, revisions, scans, storedFiles } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { MACHINISTS, PORTERS, LEADS, type Role } from "../auth/roles";
import { AppError } from "../errors";
import { newObjectId, objectKey, type Storage } from "../storage";
import { parseInput } from "../validation";
import { checkDeclared, KIND_RULES } from "./limits";
import { DETECTED_LABEL, SNIFF_BYTES, sniffContent } from "./sniff";

export const ATTACHABLE = ["master_head", "fixture_plate", "scan", "revision"] as const;
export type AttachableEntity = (typeof ATTACHABLE)[number];

/** Who may add photos to what: the people who keep that record. */
export const PHOTO_ROLES: Record<AttachableEntity, readonly Role[]> = {
  master_head: PORTERS,
  fixture_plate: LEADS,
  scan: MACHINISTS,
  revision: MACHINISTS,
};

export const photoInputSchema = z.object({
  entity: z.enum(ATTACHABLE),
  entityId: z.number().int().positive(),
  caption: z.string().trim().max(200).optional(),
});
export type PhotoInput = z.infer<typeof photoInputSchema>;

export const sheetInputSchema = z.object({ revisionId: z.number().int().positive() });

/** Checks, before any byte is sent, that this person may attach to this record. */
export function authorizePhoto(db: Db, actor: Actor | null, input: unknown) {
  const v = parseInput(photoInputSchema, input);
  const who = requireRole(actor, PHOTO_ROLES[v.entity]);
  const exists =
    v.entity === "master_head"
      ? db.select({ id: masterHeads.id }).from(masterHeads).where(eq(masterHeads.id, v.entityId)).get()
      : v.entity === "fixture_plate"
        ? db.select({ id: fixturePlates.id }).from(fixturePlates).where(eq(fixturePlates.id, v.entityId)).get()
        : v.entity === "scan"
          ? db.select({ id: scans.id }).from(scans).where(eq(scans.id, v.entityId)).get()
          : db.select({ id: revisions.id }).from(revisions).where(eq(revisions.id, v.entityId)).get();
  if (!exists) throw new AppError("not_found", "The record to attach to was not found.");
  return { who, input: v };
}

export function authorizeSheet(db: Db, actor: Actor | null, input: unknown) {
  const v = parseInput(sheetInputSchema, input);
  const who = requireRole(actor, MACHINISTS);
  if (!refuseUnlessDraft(db, v.revisionId)) throw new AppError("not_found", "That revision was not found.");
  return { who, input: v };
}

/** A revision's files and photos change only while it is a draft: 409 otherwise. Returns whether it exists. */
export function refuseUnlessDraft(db: Db, revisionId: number): boolean {
  const rev = db.select({ state: revisions.state, letter: revisions.letter }).from(revisions).where(eq(revisions.id, revisionId)).get();
  if (rev && rev.state !== "draft") throw new AppError("conflict", `Revision ${rev.letter} is no longer a draft: its files are fixed.`);
  return rev !== undefined;
}

export type ServiceFile = { name: string; size: number; url: string };
export type Target = { kind: "photo"; entity: AttachableEntity; entityId: number; caption?: string } | { kind: "setup_sheet"; revisionId: number };

/** Streams the finished upload into our bucket, sniffs it, and records it with its link. */
export async function keepServiceUpload(db: Db, store: Storage, who: { id: number; email: string }, file: ServiceFile, target: Target, fetcher: typeof fetch = fetch) {
  const rule = KIND_RULES[target.kind];
  const declared = checkDeclared(target.kind, file.name, file.size);
  if (declared) throw new AppError("unsupported_type", declared);
  const res = await fetcher(file.url);
  if (!res.ok || !res.body) throw new AppError("unavailable", `The uploaded file could not be fetched from the upload service (${res.status}).`);
  const head = new Uint8Array(SNIFF_BYTES);
  let headLength = 0;
  const capture = new Transform({
    transform(chunk: Buffer, _enc, done) {
      if (headLength < SNIFF_BYTES) {
        const take = Math.min(SNIFF_BYTES - headLength, chunk.length);
        head.set(chunk.subarray(0, take), headLength);
        headLength += take;
      }
      done(null, chunk);
    },
  });
  const key = objectKey(target.kind, newObjectId());
  const source = Readable.fromWeb(res.body as import("node:stream/web").ReadableStream<Uint8Array>).pipe(capture);
  const put = await store.putStream(key, source, { contentType: target.kind === "photo" ? "application/octet-stream" : "application/pdf" });
  const detected = sniffContent(head.subarray(0, headLength), put.sizeBytes);
  if (!rule.accepts.includes(detected) || put.sizeBytes > rule.maxBytes) {
    await store.delete(key);
    const message = `“${file.name}” is ${DETECTED_LABEL[detected]}, not ${rule.expected}. It was not kept.`;
    recordAudit(db, { actor: who, action: "file.refused", entity: "stored_file", after: { name: file.name, kind: target.kind, detected } });
    throw new AppError("unsupported_type", message);
  }
  const contentType = { png: "image/png", jpeg: "image/jpeg", gif: "image/gif", webp: "image/webp", pdf: "application/pdf" }[detected as string] ?? "application/octet-stream";
  return db.transaction((tx) => {
    const row = tx
      .insert(storedFiles)
      .values({ kind: target.kind, storageKey: key, originalName: file.name, contentType, sizeBytes: put.sizeBytes, sha256: put.sha256, state: "stored", uploadedById: who.id })
      .returning()
      .get();
    if (target.kind === "photo") {
      tx.insert(attachments).values({ entity: target.entity, entityId: target.entityId, fileId: row.id, caption: target.caption ?? "" }).run();
    } else {
      tx.insert(revisionFiles).values({ revisionId: target.revisionId, fileId: row.id, role: "setup_sheet" }).run();
    }
    recordAudit(tx, { actor: who, action: "file.upload", entity: "stored_file", entityId: row.id, after: { name: row.originalName, kind: row.kind, sha256: row.sha256, target } });
    return { fileId: row.id, sha256: row.sha256!, sizeBytes: row.sizeBytes };
  });
}
