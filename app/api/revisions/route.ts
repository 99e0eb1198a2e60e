import { z } from "zod";
import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { listRevisions } from "@/db/queries/programs";
import { EVERYONE } from "@/lib/auth/roles";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

const querySchema = tableQuerySchema.extend({ state: z.string().max(20).optional(), programId: z.coerce.number().int().positive().optional() });

/** GET /api/revisions?page&pageSize&sort&dir&q&state&programId — every revision of every program. */
export const GET = apiRoute(EVERYONE, async ({ req }) => listRevisions(db(), parseInput(querySchema, paramsRecord(req.nextUrl.searchParams))));
