import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listJobs } from "@/db/queries/jobs";
import { EVERYONE, LEADS } from "@/lib/auth/roles";
import { createJob } from "@/lib/jobs/jobs";
import { jobListQuerySchema } from "@/lib/jobs/query";
import { paramsRecord } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

/** GET /api/jobs?page&pageSize&sort&dir&q&state(|open)&customerId&revisionId&flagged — everyone reads. */
export const GET = apiRoute(EVERYONE, async ({ req }) => listJobs(db(), parseInput(jobListQuerySchema, paramsRecord(req.nextUrl.searchParams))));

/** POST /api/jobs { number?, customerId, headTypeId, quantity, cutIntake, cutExhaust, machineId?, dueOn?, setupMinutes, portsPerHead?, notes } — lead, admin. */
export const POST = apiRoute(LEADS, async ({ req, actor }) => NextResponse.json(createJob(db(), actor, await jsonBody(req)), { status: 201 }));
