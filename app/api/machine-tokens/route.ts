import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { listMachineTokens } from "@/db/queries/machine-tokens";
import { ADMINS } from "@/lib/auth/roles";
import { issueMachineToken } from "@/lib/delivery/tokens";

/** GET /api/machine-tokens — admin and auditor (no hashes, no tokens). */
export const GET = apiRoute(["admin", "auditor"], async () => ({ rows: listMachineTokens(db()) }));

/** POST /api/machine-tokens { machineId, label } — admin. The answer carries `token`, shown this once. */
export const POST = apiRoute(ADMINS, async ({ req, actor }) =>
  NextResponse.json(issueMachineToken(db(), actor, await jsonBody(req)), { status: 201, headers: { "Cache-Control": "no-store" } }),
);
