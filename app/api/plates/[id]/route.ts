import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { getPlate } from "@/db/queries/library";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { PLATE_EDITORS, updatePlate } from "@/lib/library/plates";

export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const row = getPlate(db(), idParam(params.id));
  if (!row) throw notFound("That fixture plate");
  return row;
});

export const PUT = apiRoute<{ id: string }>(PLATE_EDITORS, async ({ req, actor, params }) => updatePlate(db(), actor, idParam(params.id), await jsonBody(req)));
