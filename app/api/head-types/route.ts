import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { listHeadTypes } from "@/db/queries/head-types";
import { EVERYONE } from "@/lib/auth/roles";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

/** GET /api/head-types?page&pageSize&sort&dir&q */
export const GET = apiRoute(EVERYONE, async ({ req }) =>
  listHeadTypes(db(), parseInput(tableQuerySchema, paramsRecord(req.nextUrl.searchParams))),
);
