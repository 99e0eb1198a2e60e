import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { getMaster } from "@/db/queries/library";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { MASTER_EDITORS, updateMaster } from "@/lib/library/masters";

/** GET /api/masters/:id — with head type, porter, scans and photos. */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const row = getMaster(db(), idParam(params.id));
  if (!row) throw notFound("That master head");
  return row;
});

/** PUT /api/masters/:id — notes, measurements and dates (not the stage: see /moves). */
export const PUT = apiRoute<{ id: string }>(MASTER_EDITORS, async ({ req, actor, params }) => updateMaster(db(), actor, idParam(params.id), await jsonBody(req)));
