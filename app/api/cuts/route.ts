import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listCuts } from "@/db/queries/cuts";
import { EVERYONE, MACHINISTS } from "@/lib/auth/roles";
import { recordCut } from "@/lib/jobs/cuts";
import { cutListQuerySchema } from "@/lib/jobs/query";
import { paramsRecord } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

/** GET /api/cuts?page&pageSize&sort&dir&q&jobId&headId&revisionId&machineId&outcome — everyone reads. */
export const GET = apiRoute(EVERYONE, async ({ req }) => listCuts(db(), parseInput(cutListQuerySchema, paramsRecord(req.nextUrl.searchParams))));

/**
 * POST /api/cuts { headId, port, startedAt, outcome, reason?, endedAt?, cylinder?, machineId?, revisionId?, notes?, flowTestId? }
 * — machinist, lead, admin. The revision is the job's chosen one (409 if `revisionId` names another);
 * its toolpath SHA-256 is frozen on the cut.
 */
export const POST = apiRoute(MACHINISTS, async ({ req, actor }) => NextResponse.json(recordCut(db(), actor, await jsonBody(req)), { status: 201 }));
