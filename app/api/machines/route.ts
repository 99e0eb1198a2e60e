import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listMachines } from "@/db/queries/library";
import { EVERYONE } from "@/lib/auth/roles";
import { createMachine, MACHINE_EDITORS } from "@/lib/library/machines";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

/** GET /api/machines?page&pageSize&sort&dir&q */
export const GET = apiRoute(EVERYONE, async ({ req }) => listMachines(db(), parseInput(tableQuerySchema, paramsRecord(req.nextUrl.searchParams))));

/** POST /api/machines — admins. */
export const POST = apiRoute(MACHINE_EDITORS, async ({ req, actor }) => NextResponse.json(createMachine(db(), actor, await jsonBody(req)), { status: 201 }));
