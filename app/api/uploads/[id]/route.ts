import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { storage } from "@/lib/storage";
import { abortUpload, UPLOADERS } from "@/lib/uploads/sessions";

/** DELETE /api/uploads/:id — cancel: aborts the multipart upload and forgets the file. */
export const DELETE = apiRoute<{ id: string }>(UPLOADERS, async ({ actor, params }) => abortUpload(db(), storage(), actor, idParam(params.id)));
