import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { getMachine } from "@/db/queries/library";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { MACHINE_EDITORS, updateMachine } from "@/lib/library/machines";

export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const row = getMachine(db(), idParam(params.id));
  if (!row) throw notFound("That machine");
  return row;
});

export const PUT = apiRoute<{ id: string }>(MACHINE_EDITORS, async ({ req, actor, params }) => updateMachine(db(), actor, idParam(params.id), await jsonBody(req)));
