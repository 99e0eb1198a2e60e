import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { removeRevisionFile, REVISION_EDITORS } from "@/lib/programs/revisions";

/** DELETE /api/revisions/:id/files/:fileId — takes a file off a draft revision (the stored copy stays). */
export const DELETE = apiRoute<{ id: string; fileId: string }>(REVISION_EDITORS, async ({ actor, params }) => {
  return removeRevisionFile(db(), actor, idParam(params.id), idParam(params.fileId));
});
