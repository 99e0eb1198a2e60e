import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { getProgram } from "@/db/queries/programs";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { PROGRAM_EDITORS, updateProgram } from "@/lib/programs/programs";

/** GET /api/programs/:id — with its head type and revision history. */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const row = getProgram(db(), idParam(params.id));
  if (!row) throw notFound("That program");
  return row;
});

/** PUT /api/programs/:id — name and notes (casting and port are fixed). */
export const PUT = apiRoute<{ id: string }>(PROGRAM_EDITORS, async ({ req, actor, params }) => updateProgram(db(), actor, idParam(params.id), await jsonBody(req)));
