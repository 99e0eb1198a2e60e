import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listHeads } from "@/db/queries/heads";
import { EVERYONE, MACHINISTS } from "@/lib/auth/roles";
import { createHead } from "@/lib/jobs/heads";
import { headListQuerySchema } from "@/lib/jobs/query";
import { paramsRecord } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

/** GET /api/heads?page&pageSize&sort&dir&q&jobId&customerId&state — everyone reads. */
export const GET = apiRoute(EVERYONE, async ({ req }) => listHeads(db(), parseInput(headListQuerySchema, paramsRecord(req.nextUrl.searchParams))));

/** POST /api/heads { jobId?, headTypeId?, serial, castingNumber?, source, incomingNotes } — machinist, lead, admin (receiving is shop-floor work). */
export const POST = apiRoute(MACHINISTS, async ({ req, actor }) => NextResponse.json(createHead(db(), actor, await jsonBody(req)), { status: 201 }));
