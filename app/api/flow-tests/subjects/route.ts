import { z } from "zod";
import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { flowSubjectOptions } from "@/db/queries/flow-tests";
import { paramsRecord } from "@/lib/paging";
import { FLOW_READERS } from "@/lib/flowtests/roles";
import { parseInput } from "@/lib/validation";

const querySchema = z.object({ headTypeId: z.coerce.number().int().positive().optional() });

/** GET /api/flow-tests/subjects?headTypeId — head types, and the masters, revisions and heads of one (lists may be empty). */
export const GET = apiRoute(FLOW_READERS, async ({ req }) => {
  const { headTypeId } = parseInput(querySchema, paramsRecord(req.nextUrl.searchParams));
  return flowSubjectOptions(db(), headTypeId);
});
