import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { EVERYONE } from "@/lib/auth/roles";
import { removeAttachment } from "@/lib/uploads/attachments";

/** DELETE /api/attachments/:id — takes a photo off its record (who may depends on the record). */
export const DELETE = apiRoute<{ id: string }>(EVERYONE, async ({ actor, params }) => {
  return removeAttachment(db(), actor, idParam(params.id));
});
