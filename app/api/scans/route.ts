import { NextResponse } from "next/server";
import { z } from "zod";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listScans } from "@/db/queries/scans";
import { EVERYONE } from "@/lib/auth/roles";
import { createScan, SCAN_EDITORS } from "@/lib/library/scans";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

const querySchema = tableQuerySchema.extend({ masterId: z.coerce.number().int().positive().optional() });

/** GET /api/scans?page&pageSize&sort&dir&q&masterId */
export const GET = apiRoute(EVERYONE, async ({ req }) => listScans(db(), parseInput(querySchema, paramsRecord(req.nextUrl.searchParams))));

/** POST /api/scans — machinists, leads, admins. */
export const POST = apiRoute(SCAN_EDITORS, async ({ req, actor }) => NextResponse.json(createScan(db(), actor, await jsonBody(req)), { status: 201 }));
