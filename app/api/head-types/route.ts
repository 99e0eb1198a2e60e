import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listHeadTypes } from "@/db/queries/head-types";
import { EVERYONE } from "@/lib/auth/roles";
import { createHeadType, HEAD_TYPE_EDITORS } from "@/lib/library/head-types";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

/** GET /api/head-types?page&pageSize&sort&dir&q */
export const GET = apiRoute(EVERYONE, async ({ req }) =>
  listHeadTypes(db(), parseInput(tableQuerySchema, paramsRecord(req.nextUrl.searchParams))),
);

/** POST /api/head-types — leads and admins. */
export const POST = apiRoute(HEAD_TYPE_EDITORS, async ({ req, actor }) =>
  NextResponse.json(createHeadType(db(), actor, await jsonBody(req)), { status: 201 }),
);
