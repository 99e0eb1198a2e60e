import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { ADMINS } from "@/lib/auth/roles";
import { revokeInvitation } from "@/lib/users/invite";

/** DELETE /api/invitations/:id — withdraws an open invitation. */
export const DELETE = apiRoute<{ id: string }>(ADMINS, async ({ actor, params }) => {
  revokeInvitation(db(), actor, idParam(params.id));
  return { ok: true };
});
