/**
 * The one role check used by every page, server action, route handler and CLI verb.
 * Hiding a button is not a permission: this runs on the server for every request.
 */
import { AppError } from "../errors";
import type { Role } from "./roles";

export type Actor = { id: number; email: string; name: string; role: Role };

export function requireRole(actor: Actor | null | undefined, allowed: readonly Role[]): Actor {
  if (!actor) throw new AppError("unauthenticated", "Please sign in.");
  if (!allowed.includes(actor.role)) {
    throw new AppError("forbidden", "Your role does not allow this.");
  }
  return actor;
}

export function hasRole(actor: Actor | null | undefined, allowed: readonly Role[]): boolean {
  return !!actor && allowed.includes(actor.role);
}
