import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { getCut } from "@/db/queries/cuts";
import { EVERYONE, MACHINISTS } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { updateCut } from "@/lib/jobs/cuts";

export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const cut = getCut(db(), idParam(params.id));
  if (!cut) throw notFound("That cut");
  return cut;
});

/** PATCH /api/cuts/:id { endedAt?, outcome?, reason?, notes?, flowTestId? } — machinist, lead, admin. Revision and checksum never change. */
export const PATCH = apiRoute<{ id: string }>(MACHINISTS, async ({ req, actor, params }) => updateCut(db(), actor, idParam(params.id), await jsonBody(req)));
