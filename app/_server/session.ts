/**
 * The signed-in user for this request, re-read from the database every time: a deactivated
 * account or a reset password ends the session on the next request, whatever the cookie says.
 */
import "server-only";
import { getToken } from "next-auth/jwt";
import { cookies, headers } from "next/headers";
import { forbidden, redirect } from "next/navigation";
import { cache } from "react";
import { db } from "@/db/client";
import { actorForSession } from "@/lib/auth/credentials";
import { hasRole, type Actor } from "@/lib/auth/guard";
import type { Role } from "@/lib/auth/roles";

type TokenRequest = { headers: Record<string, string>; cookies: Record<string, string> };

/** Reads the session JWT from a request's cookies and checks it against the account. */
export async function actorFromToken(req: TokenRequest | Request): Promise<Actor | null> {
  const token = await getToken({ req: req as never, secret: process.env.NEXTAUTH_SECRET });
  if (!token?.uid || token.sv == null) return null;
  return actorForSession(db(), { userId: token.uid, sessionVersion: token.sv });
}

export const currentActor = cache(async (): Promise<Actor | null> => {
  const [h, c] = await Promise.all([headers(), cookies()]);
  return actorFromToken({
    headers: Object.fromEntries(h.entries()),
    cookies: Object.fromEntries(c.getAll().map((k) => [k.name, k.value])),
  });
});

/** For pages: sign-in redirect when nobody is signed in, the 403 page when the role is wrong. */
export async function requirePageRole(roles: readonly Role[], from?: string): Promise<Actor> {
  const actor = await currentActor();
  if (!actor) redirect(from ? `/sign-in?callbackUrl=${encodeURIComponent(from)}` : "/sign-in");
  if (!hasRole(actor, roles)) forbidden();
  return actor;
}
