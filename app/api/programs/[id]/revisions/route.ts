import { NextResponse } from "next/server";
import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listRevisions } from "@/db/queries/programs";
import { EVERYONE } from "@/lib/auth/roles";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { createRevision, REVISION_EDITORS } from "@/lib/programs/revisions";
import { parseInput } from "@/lib/validation";

/** GET /api/programs/:id/revisions — this program's revisions as a table page. */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ req, params }) =>
  listRevisions(db(), { ...parseInput(tableQuerySchema, paramsRecord(req.nextUrl.searchParams)), programId: idParam(params.id) }),
);

/** POST /api/programs/:id/revisions { parentId?, sourceScanId?, plateId?, machineId?, changeNote } → the new draft. */
export const POST = apiRoute<{ id: string }>(REVISION_EDITORS, async ({ req, actor, params }) =>
  NextResponse.json(createRevision(db(), actor, idParam(params.id), await jsonBody(req)), { status: 201 }),
);
