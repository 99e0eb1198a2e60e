import { Readable } from "node:stream";
import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { EVERYONE } from "@/lib/auth/roles";
import { attachmentDisposition, storage } from "@/lib/storage";
import { openDownload } from "@/lib/uploads/download";

/**
 * GET /api/files/:id[?inline=1] — streams the stored file, checked against its SHA-256 as it
 * passes: on a mismatch the download breaks before its end and an audit event is written.
 * `inline=1` shows images in the page instead of saving them.
 */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ req, actor, params }) => {
  const file = await openDownload(db(), storage(), actor, idParam(params.id));
  const inline = req.nextUrl.searchParams.get("inline") === "1" && /^image\//.test(file.contentType);
  return new Response(Readable.toWeb(file.body) as ReadableStream<Uint8Array>, {
    headers: {
      "content-type": file.contentType,
      "content-length": String(file.sizeBytes),
      "content-disposition": inline ? "inline" : attachmentDisposition(file.fileName),
      "x-content-sha256": file.sha256,
      "cache-control": "private, max-age=0",
      "x-content-type-options": "nosniff",
    },
  });
});
