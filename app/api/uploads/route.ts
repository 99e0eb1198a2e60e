import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { storage } from "@/lib/storage";
import { startUpload, UPLOADERS } from "@/lib/uploads/sessions";

/**
 * POST /api/uploads { kind: "toolpath"|"point_cloud", fileName, sizeBytes, revisionId? | scanId? }
 * → 201 { fileId, partSizeBytes, partCount, parts: [{ partNumber, url }] } (the first batch of
 * presigned part URLs; ask /api/uploads/:id/parts for the rest).
 */
export const POST = apiRoute(UPLOADERS, async ({ req, actor }) => NextResponse.json(await startUpload(db(), storage(), actor, await jsonBody(req)), { status: 201 }));
