import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { ADMINS } from "@/lib/auth/roles";
import { revokeMachineToken } from "@/lib/delivery/tokens";

/** DELETE /api/machine-tokens/:id — admin; revokes at once (the row stays for the record). */
export const DELETE = apiRoute<{ id: string }>(ADMINS, async ({ actor, params }) => revokeMachineToken(db(), actor, idParam(params.id)));
