import { NextResponse } from "next/server";
import { actorFromToken } from "@/app/_server/session";
import { db } from "@/db/client";
import { hasRole } from "@/lib/auth/guard";
import { LEADS } from "@/lib/auth/roles";
import { checkAll, describeProblems, withoutDetails } from "@/lib/health";
import { checkMail } from "@/lib/mail";
import { checkStorage } from "@/lib/storage";

export const dynamic = "force-dynamic";

/**
 * GET /api/health — 200 when the database, storage and mail answer; 503 saying which does not.
 * Why (host, port, error) goes to the server log, and to a signed-in lead or admin.
 */
export async function GET(req: Request) {
  const health = await checkAll(db(), () => checkStorage(), () => checkMail());
  if (!health.ok) console.warn(`[health] ${describeProblems(health)}`);
  const actor = await actorFromToken(req).catch(() => null);
  const body = hasRole(actor, LEADS) ? health : withoutDetails(health);
  return NextResponse.json(body, { status: health.ok ? 200 : 503, headers: { "cache-control": "no-store" } });
}
