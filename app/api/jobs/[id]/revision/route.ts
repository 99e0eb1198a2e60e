import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { LEADS } from "@/lib/auth/roles";
import { chooseRevision } from "@/lib/jobs/jobs";

/** PUT /api/jobs/:id/revision { port, revisionId|null } — lead, admin. Only a released revision of the job's casting and port (422 with the reason otherwise). */
export const PUT = apiRoute<{ id: string }>(LEADS, async ({ req, actor, params }) => chooseRevision(db(), actor, idParam(params.id), await jsonBody(req)));
