import { z } from "zod";
import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { paramsRecord } from "@/lib/paging";
import { idListSchema } from "@/lib/flowtests/query";
import { flowSeries } from "@/lib/flowtests/read";
import { FLOW_READERS } from "@/lib/flowtests/roles";
import { parseInput } from "@/lib/validation";

const querySchema = z.object({ ids: idListSchema });

/**
 * GET /api/flow-tests/series?ids=3,5,8 → [{ id, label, subject, port, testedOn, points: [{ liftMm,
 * flowCfmAt28, ld, cdValve, cdCurtain }] }] in the order asked; for overlay charts elsewhere.
 */
export const GET = apiRoute(FLOW_READERS, async ({ req }) => {
  const { ids } = parseInput(querySchema, paramsRecord(req.nextUrl.searchParams));
  return flowSeries(db(), ids);
});
