import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { getRevision } from "@/db/queries/programs";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { REVISION_EDITORS, updateRevision } from "@/lib/programs/revisions";

/** GET /api/revisions/:id — the revision with its program, files, analyses, moves and flow-test count. */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const row = getRevision(db(), idParam(params.id));
  if (!row) throw notFound("That revision");
  return row;
});

/** PUT /api/revisions/:id — drafts only. */
export const PUT = apiRoute<{ id: string }>(REVISION_EDITORS, async ({ req, actor, params }) => updateRevision(db(), actor, idParam(params.id), await jsonBody(req)));
