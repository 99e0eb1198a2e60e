import { NextResponse } from "next/server";
import { z } from "zod";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listPrograms } from "@/db/queries/programs";
import { EVERYONE } from "@/lib/auth/roles";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { createProgram, PROGRAM_EDITORS } from "@/lib/programs/programs";
import { parseInput } from "@/lib/validation";

const querySchema = tableQuerySchema.extend({ headTypeId: z.coerce.number().int().positive().optional() });

/** GET /api/programs?page&pageSize&sort&dir&q&headTypeId */
export const GET = apiRoute(EVERYONE, async ({ req }) => listPrograms(db(), parseInput(querySchema, paramsRecord(req.nextUrl.searchParams))));

/** POST /api/programs { headTypeId, port, name, notes } — machinists, leads, admins. */
export const POST = apiRoute(PROGRAM_EDITORS, async ({ req, actor }) => NextResponse.json(createProgram(db(), actor, await jsonBody(req)), { status: 201 }));
