import { NextResponse } from "next/server";
import { db } from "@/db/client";
import { checkAll } from "@/lib/health";
import { checkMail } from "@/lib/mail";
import { checkStorage } from "@/lib/storage";

export const dynamic = "force-dynamic";

/** GET /api/health — 200 when the database, storage and mail answer; 503 naming which does not. */
export async function GET() {
  const health = await checkAll(db(), () => checkStorage(), () => checkMail());
  return NextResponse.json(health, { status: health.ok ? 200 : 503, headers: { "cache-control": "no-store" } });
}
