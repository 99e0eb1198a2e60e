import { NextResponse } from "next/server";
import { apiRoute, appUrl, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { pendingInvitations } from "@/db/queries/users";
import { ADMINS } from "@/lib/auth/roles";
import { inviteUser } from "@/lib/users/invite";

/** GET /api/invitations — open invitations. */
export const GET = apiRoute(ADMINS, async () => ({ rows: pendingInvitations(db()) }));

/** POST /api/invitations { email, role } — sends the one-time link by e-mail. */
export const POST = apiRoute(ADMINS, async ({ req, actor }) => {
  const row = await inviteUser(db(), actor, await jsonBody(req), appUrl(req));
  return NextResponse.json(row, { status: 201 });
});
