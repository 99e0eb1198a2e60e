/** Inputs of the browser's direct-to-storage uploads. */
import { z } from "zod";

export const startUploadSchema = z
  .object({
    kind: z.enum(["toolpath", "point_cloud"], { message: "Choose a toolpath or a point cloud." }),
    fileName: z.string().trim().min(1, { message: "The file has no name." }).max(255, { message: "The file name is too long (255 characters at most)." }),
    sizeBytes: z.number().int().positive({ message: "The file is empty." }),
    contentType: z.string().max(200).optional(),
    revisionId: z.number().int().positive().optional(),
    scanId: z.number().int().positive().optional(),
  })
  .refine((v) => (v.kind === "toolpath" ? v.revisionId != null && v.scanId == null : v.scanId != null && v.revisionId == null), {
    message: "A toolpath belongs to a revision and a point cloud to a scan.",
    path: ["kind"],
  });
export type StartUploadInput = z.input<typeof startUploadSchema>;

export const partsSchema = z.object({
  partNumbers: z.array(z.number().int().min(1).max(10_000)).min(1).max(200),
});

export const completeSchema = z.object({
  parts: z
    .array(z.object({ partNumber: z.number().int().min(1).max(10_000), etag: z.string().min(1).max(200) }))
    .min(1, { message: "No parts were uploaded." }),
});
