import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { SHOP_FLOOR } from "@/lib/auth/roles";
import { moveRevision } from "@/lib/programs/revisions";

/** POST /api/revisions/:id/moves { to: "proving" | "draft" | "withdrawn", note } → { revision, notice }. */
export const POST = apiRoute<{ id: string }>(SHOP_FLOOR, async ({ req, actor, params }) => moveRevision(db(), actor, idParam(params.id), await jsonBody(req)));
