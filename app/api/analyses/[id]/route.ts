import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { getAnalysis } from "@/db/queries/files";
import { kickAnalyses } from "@/lib/analysis/scheduler";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";

/**
 * GET /api/analyses/:id → { id, engine, state, progress, error, result, previewFileId, … }.
 * Pages poll this while an analysis runs; each poll also starts queued work if a slot is free.
 */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  kickAnalyses(db());
  const row = getAnalysis(db(), idParam(params.id));
  if (!row) throw notFound("That analysis");
  return row;
});
