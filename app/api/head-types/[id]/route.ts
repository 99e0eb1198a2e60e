import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { getHeadType } from "@/db/queries/head-types";
import { headTypeRelations } from "@/db/queries/library";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { HEAD_TYPE_EDITORS, updateHeadType } from "@/lib/library/head-types";

/** GET /api/head-types/:id — the casting with its plates, masters and programs. */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const id = idParam(params.id);
  const row = getHeadType(db(), id);
  if (!row) throw notFound("That head type");
  return { ...row, ...headTypeRelations(db(), id) };
});

/** PUT /api/head-types/:id — the whole record, as the form sends it. */
export const PUT = apiRoute<{ id: string }>(HEAD_TYPE_EDITORS, async ({ req, actor, params }) =>
  updateHeadType(db(), actor, idParam(params.id), await jsonBody(req)),
);
