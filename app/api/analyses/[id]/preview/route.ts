import { Readable } from "node:stream";
import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { getAnalysis } from "@/db/queries/files";
import { EVERYONE } from "@/lib/auth/roles";
import { AppError, notFound } from "@/lib/errors";
import { storage } from "@/lib/storage";
import { openDownload } from "@/lib/uploads/download";

/**
 * GET /api/analyses/:id/preview — the engine's preview blob for the 3D viewer:
 * toolpath analyses give the toolpath engine's encoded preview ("PTVW", lib/toolpath/preview.ts),
 * geometry analyses the geometry engine's preview cloud ("PPV1", lib/geometry/preview.ts).
 */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ actor, params }) => {
  const row = getAnalysis(db(), idParam(params.id));
  if (!row) throw notFound("That analysis");
  if (row.state !== "done" || !row.previewFileId) throw new AppError("not_found", "This analysis has no preview (yet).");
  const file = await openDownload(db(), storage(), actor, row.previewFileId);
  return new Response(Readable.toWeb(file.body) as ReadableStream<Uint8Array>, {
    headers: { "content-type": "application/octet-stream", "content-length": String(file.sizeBytes), "x-content-sha256": file.sha256, "x-preview-format": row.engine === "toolpath" ? "PTVW" : "PPV1" },
  });
});
