import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listPlates } from "@/db/queries/library";
import { EVERYONE } from "@/lib/auth/roles";
import { createPlate, PLATE_EDITORS } from "@/lib/library/plates";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

/** GET /api/plates?page&pageSize&sort&dir&q */
export const GET = apiRoute(EVERYONE, async ({ req }) => listPlates(db(), parseInput(tableQuerySchema, paramsRecord(req.nextUrl.searchParams))));

/** POST /api/plates — leads and admins. */
export const POST = apiRoute(PLATE_EDITORS, async ({ req, actor }) => NextResponse.json(createPlate(db(), actor, await jsonBody(req)), { status: 201 }));
