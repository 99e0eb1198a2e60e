import { z } from "zod";
import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { listAuditEvents } from "@/db/queries/audit";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

const querySchema = tableQuerySchema.extend({ entity: z.string().max(40).optional(), entityId: z.string().max(40).optional() });

/** GET /api/audit?page&pageSize&sort&dir&q&entity&entityId — auditor, lead, admin. */
export const GET = apiRoute(["auditor", "lead", "admin"], async ({ req }) =>
  listAuditEvents(db(), parseInput(querySchema, paramsRecord(req.nextUrl.searchParams))),
);
