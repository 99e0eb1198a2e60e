import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { recallRows, revisionTraceHeader } from "@/db/queries/trace";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { csvLines, csvStream } from "@/lib/trace/csv";
import { recallColumns, recallFileName } from "@/lib/trace/recall";

/** GET /api/trace/revisions/:id/recall — the recall list as CSV (streamed; one line per cut made with the revision). */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const id = idParam(params.id);
  const revision = revisionTraceHeader(db(), id);
  if (!revision) throw notFound("That revision");
  const lines = csvLines(recallColumns({ label: revision.label, sha256: revision.toolpath?.sha256 ?? null }), recallRows(db(), id));
  return new Response(csvStream(lines), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${recallFileName(revision.label)}"`,
      "Cache-Control": "no-store",
    },
  });
});
