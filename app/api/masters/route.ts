import { NextResponse } from "next/server";
import { z } from "zod";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listMasters } from "@/db/queries/library";
import { EVERYONE } from "@/lib/auth/roles";
import { createMaster, MASTER_EDITORS } from "@/lib/library/masters";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

const querySchema = tableQuerySchema.extend({ stage: z.string().max(40).optional(), headTypeId: z.coerce.number().int().positive().optional() });

/** GET /api/masters?page&pageSize&sort&dir&q&stage&headTypeId */
export const GET = apiRoute(EVERYONE, async ({ req }) => listMasters(db(), parseInput(querySchema, paramsRecord(req.nextUrl.searchParams))));

/** POST /api/masters — porters, leads, admins. */
export const POST = apiRoute(MASTER_EDITORS, async ({ req, actor }) => NextResponse.json(createMaster(db(), actor, await jsonBody(req)), { status: 201 }));
