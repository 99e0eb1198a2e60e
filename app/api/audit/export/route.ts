import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { auditEventsMatching } from "@/db/queries/audit";
import { paramsRecord } from "@/lib/paging";
import { AUDIT_CSV_COLUMNS, auditFilterSchema } from "@/lib/trace/audit-export";
import { csvLines, csvStream } from "@/lib/trace/csv";
import { parseInput } from "@/lib/validation";

/** GET /api/audit/export?<same filters as /api/audit> — the matching events as CSV, oldest first, streamed, with both hashes so the chain can be re-checked outside. */
export const GET = apiRoute(["auditor", "lead", "admin"], async ({ req }) => {
  const filter = parseInput(auditFilterSchema, paramsRecord(req.nextUrl.searchParams));
  const name = `audit-log-${new Date().toISOString().slice(0, 10)}.csv`;
  return new Response(csvStream(csvLines(AUDIT_CSV_COLUMNS, auditEventsMatching(db(), filter))), {
    headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="${name}"`, "Cache-Control": "no-store" },
  });
});
