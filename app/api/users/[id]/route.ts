import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { ADMINS } from "@/lib/auth/roles";
import { updateUser } from "@/lib/users/update";

/** PATCH /api/users/:id { role?, active? } — admin only. */
export const PATCH = apiRoute<{ id: string }>(ADMINS, async ({ req, actor, params }) =>
  updateUser(db(), actor, idParam(params.id), await jsonBody(req)),
);
