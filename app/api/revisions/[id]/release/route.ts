import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { RELEASERS, releaseRevision } from "@/lib/programs/revisions";

/** POST /api/revisions/:id/release { password, overrideReason? } → { revision, superseded, notice }. */
export const POST = apiRoute<{ id: string }>(RELEASERS, async ({ req, actor, params }) => releaseRevision(db(), actor, idParam(params.id), await jsonBody(req)));
