/**
 * Taking a photo or document off a record: by the people who may add one to that record, not
 * once a revision has left draft. The stored file stays (the audit trail points at it).
 */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { attachments, storedFiles } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { AppError } from "../errors";
import { ATTACHABLE, PHOTO_ROLES, refuseUnlessDraft, type AttachableEntity } from "./service";

export function removeAttachment(db: Db, actor: Actor | null, attachmentId: number, now = Date.now()) {
  return db.transaction((tx) => {
    const t = tx as unknown as Db;
    const row = t
      .select({ id: attachments.id, entity: attachments.entity, entityId: attachments.entityId, fileId: attachments.fileId, caption: attachments.caption, name: storedFiles.originalName, sha256: storedFiles.sha256 })
      .from(attachments)
      .innerJoin(storedFiles, eq(storedFiles.id, attachments.fileId))
      .where(eq(attachments.id, attachmentId))
      .get();
    if (!row || !(ATTACHABLE as readonly string[]).includes(row.entity)) throw new AppError("not_found", "That photo was not found.");
    const entity = row.entity as AttachableEntity;
    const who = requireRole(actor, PHOTO_ROLES[entity]);
    if (entity === "revision") refuseUnlessDraft(t, row.entityId);
    t.delete(attachments).where(eq(attachments.id, attachmentId)).run();
    const before = { entity, entityId: row.entityId, fileId: row.fileId, caption: row.caption, name: row.name, sha256: row.sha256 };
    recordAudit(t, { actor: who, action: "attachment.remove", entity, entityId: row.entityId, before, after: null }, now);
    return { removed: before };
  });
}
