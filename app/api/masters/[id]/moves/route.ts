import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { SHOP_FLOOR } from "@/lib/auth/roles";
import { moveMaster } from "@/lib/library/masters";

/** POST /api/masters/:id/moves { to, note? } → { master, notice } (the verb checks the role per move). */
export const POST = apiRoute<{ id: string }>(SHOP_FLOOR, async ({ req, actor, params }) => moveMaster(db(), actor, idParam(params.id), await jsonBody(req)));
