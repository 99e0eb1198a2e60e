import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { verifyAuditChain } from "@/lib/audit/verify";

/** GET /api/audit/chain — walks the whole chain: { ok, events, lastHash } or { ok: false, events, brokenAt, reason }. */
export const GET = apiRoute(["auditor", "lead", "admin"], async () => verifyAuditChain(db().$client));
