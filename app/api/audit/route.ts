import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { listAuditEvents } from "@/db/queries/audit";
import { paramsRecord } from "@/lib/paging";
import { auditListQuerySchema } from "@/lib/trace/audit-export";
import { parseInput } from "@/lib/validation";

/** GET /api/audit?page&pageSize&sort&dir&q&entity&entityId&actor&action(or family "job.")&from&to (YYYY-MM-DD, UTC, inclusive) — auditor, lead, admin. */
export const GET = apiRoute(["auditor", "lead", "admin"], async ({ req }) =>
  listAuditEvents(db(), parseInput(auditListQuerySchema, paramsRecord(req.nextUrl.searchParams))),
);
