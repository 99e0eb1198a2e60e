import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { kickAnalyses } from "@/lib/analysis/scheduler";
import { storage } from "@/lib/storage";
import { completeUpload, UPLOADERS } from "@/lib/uploads/sessions";

/**
 * POST /api/uploads/:id/complete { parts: [{ partNumber, etag }] } → { file, analysisId }.
 * The object is read once to hash and sniff it; content that does not match the kind is
 * deleted and answered 415 with the reason. The analysis then starts off the request path.
 */
export const POST = apiRoute<{ id: string }>(UPLOADERS, async ({ req, actor, params }) => {
  const done = await completeUpload(db(), storage(), actor, idParam(params.id), await jsonBody(req));
  kickAnalyses(db());
  return done;
});
