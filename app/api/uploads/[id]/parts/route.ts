import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { storage } from "@/lib/storage";
import { presignParts, UPLOADERS } from "@/lib/uploads/sessions";

/** POST /api/uploads/:id/parts { partNumbers: [n…] } → { parts: [{ partNumber, url }] }. */
export const POST = apiRoute<{ id: string }>(UPLOADERS, async ({ req, actor, params }) => presignParts(db(), storage(), actor, idParam(params.id), await jsonBody(req)));
