import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { paramsRecord } from "@/lib/paging";
import { flowTestListQuerySchema } from "@/lib/flowtests/query";
import { listFlowTestsWithFigures } from "@/lib/flowtests/read";
import { FLOW_READERS, FLOW_RECORDERS } from "@/lib/flowtests/roles";
import { createFlowTest } from "@/lib/flowtests/write";
import { parseInput } from "@/lib/validation";

/** GET /api/flow-tests?page&pageSize&sort&dir&q&headTypeId&masterId&revisionId&headId&subject&port — everyone reads. */
export const GET = apiRoute(FLOW_READERS, async ({ req }) =>
  listFlowTestsWithFigures(db(), parseInput(flowTestListQuerySchema, paramsRecord(req.nextUrl.searchParams))),
);

/** POST /api/flow-tests { record } — porter, machinist, lead, admin. */
export const POST = apiRoute(FLOW_RECORDERS, async ({ req, actor }) =>
  NextResponse.json(createFlowTest(db(), actor, await jsonBody(req)), { status: 201 }),
);
