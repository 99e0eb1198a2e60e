import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { jobsOfRevision, revisionLineage, revisionTraceHeader } from "@/db/queries/trace";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { recallSummary } from "@/lib/trace/revision";

/** GET /api/trace/revisions/:id — the revision, its lineage, the jobs that chose it or cut with it, and a tally of its cuts. The cut rows: /api/cuts?revisionId=:id; the recall CSV: ./recall. */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const id = idParam(params.id);
  const revision = revisionTraceHeader(db(), id);
  if (!revision) throw notFound("That revision");
  return { revision, lineage: revisionLineage(db(), id), jobs: jobsOfRevision(db(), id), summary: recallSummary(db(), id) };
});
