import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { rerunAnalysis } from "@/lib/analysis/queue";
import { kickAnalyses } from "@/lib/analysis/scheduler";
import { MACHINISTS } from "@/lib/auth/roles";

/** POST /api/analyses/:id/rerun — back in the queue (refused once its revision is released). */
export const POST = apiRoute<{ id: string }>(MACHINISTS, async ({ actor, params }) => {
  const out = rerunAnalysis(db(), actor, idParam(params.id));
  kickAnalyses(db());
  return out;
});
