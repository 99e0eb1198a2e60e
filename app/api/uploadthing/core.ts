/**
 * Photos and setup sheets go through the upload service's file router. The middleware checks
 * the session and the role before any byte is sent; when a file is done we copy it into our own
 * bucket (our key, SHA-256, content sniffed) and link it to its record.
 */
import { createUploadthing, type FileRouter } from "uploadthing/next";
import { UploadThingError } from "uploadthing/server";
import { actorFromToken } from "@/app/_server/session";
import { db } from "@/db/client";
import { isAppError } from "@/lib/errors";
import { storage } from "@/lib/storage";
import { authorizePhoto, authorizeSheet, keepServiceUpload, photoInputSchema, sheetInputSchema } from "@/lib/uploads/service";

const f = createUploadthing();

function refuse(err: unknown): never {
  throw new UploadThingError({ code: isAppError(err) && err.code === "forbidden" ? "FORBIDDEN" : "BAD_REQUEST", message: err instanceof Error ? err.message : "Not allowed." });
}

async function keep(...args: Parameters<typeof keepServiceUpload> extends [unknown, unknown, ...infer R] ? R : never) {
  try {
    return { ok: true as const, ...(await keepServiceUpload(db(), storage(), ...args)) };
  } catch (err) {
    return { ok: false as const, message: err instanceof Error ? err.message : "The file could not be kept." };
  }
}

export const fileRouter = {
  photo: f({ image: { maxFileSize: "16MB", maxFileCount: 6 } })
    .input(photoInputSchema)
    .middleware(async ({ req, input }) => {
      try {
        const { who, input: v } = authorizePhoto(db(), await actorFromToken(req), input);
        return { actorId: who.id, actorEmail: who.email, entity: v.entity, entityId: v.entityId, caption: v.caption ?? "" };
      } catch (err) {
        refuse(err);
      }
    })
    .onUploadComplete(({ metadata, file }) =>
      keep({ id: metadata.actorId, email: metadata.actorEmail }, { name: file.name, size: file.size, url: file.ufsUrl }, { kind: "photo", entity: metadata.entity, entityId: metadata.entityId, caption: metadata.caption }),
    ),
  setupSheet: f({ pdf: { maxFileSize: "32MB", maxFileCount: 1 } })
    .input(sheetInputSchema)
    .middleware(async ({ req, input }) => {
      try {
        const { who, input: v } = authorizeSheet(db(), await actorFromToken(req), input);
        return { actorId: who.id, actorEmail: who.email, revisionId: v.revisionId };
      } catch (err) {
        refuse(err);
      }
    })
    .onUploadComplete(({ metadata, file }) =>
      keep({ id: metadata.actorId, email: metadata.actorEmail }, { name: file.name, size: file.size, url: file.ufsUrl }, { kind: "setup_sheet", revisionId: metadata.revisionId }),
    ),
} satisfies FileRouter;

export type PortolanFileRouter = typeof fileRouter;
