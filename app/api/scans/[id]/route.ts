import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { getScan } from "@/db/queries/scans";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { SCAN_EDITORS, updateScan } from "@/lib/library/scans";

/** GET /api/scans/:id — with its files, their analyses (geometry) and photos. */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const row = getScan(db(), idParam(params.id));
  if (!row) throw notFound("That scan");
  return row;
});

export const PUT = apiRoute<{ id: string }>(SCAN_EDITORS, async ({ req, actor, params }) => updateScan(db(), actor, idParam(params.id), await jsonBody(req)));
