/**
 * Route-handler plumbing: resolve the actor, check the role, run the handler, and answer every
 * failure in the one shape `{ error: { code, message, fields? } }`.
 */
import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import { requireRole, type Actor } from "@/lib/auth/guard";
import type { Role } from "@/lib/auth/roles";
import { AppError, isAppError } from "@/lib/errors";
import { actorFromToken } from "./session";

export type ApiContext<P> = { req: NextRequest; actor: Actor; params: P };

export function errorResponse(err: unknown): NextResponse {
  if (isAppError(err)) {
    return NextResponse.json({ error: { code: err.code, message: err.message, fields: err.fields } }, { status: err.status });
  }
  console.error("[api] unexpected error", err);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on our side. Try again." } }, { status: 500 });
}

export function apiRoute<P = Record<string, string>>(
  roles: readonly Role[],
  handler: (ctx: ApiContext<P>) => Promise<Response | unknown>,
) {
  return async (req: NextRequest, route: { params: Promise<P> }): Promise<Response> => {
    try {
      const actor = requireRole(await actorFromToken(req), roles);
      const result = await handler({ req, actor, params: await route.params });
      return result instanceof Response ? result : NextResponse.json(result);
    } catch (err) {
      return errorResponse(err);
    }
  };
}

/** JSON body, or a 400 that says the body was not JSON. */
export async function jsonBody(req: Request): Promise<unknown> {
  try {
    return await req.json();
  } catch {
    throw new AppError("bad_request", "The request body must be JSON.");
  }
}

export function idParam(value: string | undefined): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0) throw new AppError("not_found", "No such record.");
  return id;
}

export function appUrl(req: Request): string {
  return process.env.APP_URL ?? new URL(req.url).origin;
}
