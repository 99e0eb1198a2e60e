import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { SHOP_FLOOR } from "@/lib/auth/roles";
import { removeAttachment } from "@/lib/uploads/attachments";

/**
 * DELETE /api/attachments/:id — takes a photo off its record. Only shop-floor roles get past the
 * door; which of them may depends on the record (the verb checks).
 */
export const DELETE = apiRoute<{ id: string }>(SHOP_FLOOR, async ({ actor, params }) => {
  return removeAttachment(db(), actor, idParam(params.id));
});
