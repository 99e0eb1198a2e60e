import { apiRoute, appUrl, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { LEADS } from "@/lib/auth/roles";
import { moveJob } from "@/lib/jobs/jobs";

/** POST /api/jobs/:id/state { to, note? } — lead, admin. 409 with the reasons when the move is not open; shipping e-mails the customer (`notice` says whether it went). */
export const POST = apiRoute<{ id: string }>(LEADS, async ({ req, actor, params }) =>
  moveJob(db(), actor, idParam(params.id), await jsonBody(req), { appUrl: appUrl(req) }),
);
