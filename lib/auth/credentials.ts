/**
 * Checks an e-mail and password. An unknown e-mail, an inactive account and a wrong password
 * give the same answer after the same bcrypt work, so the form does not reveal accounts.
 */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { users } from "@/db/schema";
import { AppError } from "../errors";
import type { Actor } from "./guard";
import { checkPassword } from "./passwords";
import { isThrottled, recordAttempt } from "./throttle";

export const WRONG_CREDENTIALS = "That e-mail and password do not match an active account.";
export const THROTTLED = "Too many failed sign-ins. Wait 15 minutes and try again, or reset your password.";

export type SignedIn = Actor & { sessionVersion: number };

export async function verifyCredentials(db: Db, input: { email: string; password: string; ip: string }): Promise<SignedIn> {
  const email = input.email.trim().toLowerCase();
  if (isThrottled(db, email, input.ip)) throw new AppError("throttled", THROTTLED);
  const user = db.select().from(users).where(eq(users.email, email)).get();
  const ok = await checkPassword(input.password, user?.active ? user.passwordHash : null);
  recordAttempt(db, email, input.ip, ok && !!user);
  if (!ok || !user) throw new AppError("unauthenticated", WRONG_CREDENTIALS);
  db.update(users).set({ lastSignInAt: Date.now() }).where(eq(users.id, user.id)).run();
  return { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
}

/** A session is only as good as the account behind it: deactivation or a role change ends it. */
export function actorForSession(db: Db, claims: { userId: number; sessionVersion: number }): Actor | null {
  const user = db.select().from(users).where(eq(users.id, claims.userId)).get();
  if (!user || !user.active || user.sessionVersion !== claims.sessionVersion) return null;
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}
