import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { cutsOfHead } from "@/db/queries/cuts";
import { getHead } from "@/db/queries/heads";
import { EVERYONE, MACHINISTS } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { updateHead } from "@/lib/jobs/heads";

/** GET /api/heads/:id — the head with its cuts. */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const id = idParam(params.id);
  const head = getHead(db(), id);
  if (!head) throw notFound("That head");
  return { ...head, cutLog: cutsOfHead(db(), id) };
});

/** PATCH /api/heads/:id { serial?, castingNumber?, source?, incomingNotes? } — machinist, lead, admin. */
export const PATCH = apiRoute<{ id: string }>(MACHINISTS, async ({ req, actor, params }) => updateHead(db(), actor, idParam(params.id), await jsonBody(req)));
