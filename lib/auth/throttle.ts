/**
 * Sign-in throttling: at most 5 failures per 15 minutes for one account from one address,
 * and 25 from one address over all accounts (a spray across accounts).
 */
import { and, count, eq, gte } from "drizzle-orm";
import type { Db } from "@/db/client";
import { signInAttempts } from "@/db/schema";

export const THROTTLE_WINDOW_MS = 15 * 60 * 1000;
export const MAX_FAILURES_PER_ACCOUNT = 5;
export const MAX_FAILURES_PER_ADDRESS = 25;

export function isThrottled(db: Db, email: string, ip: string, now = Date.now()): boolean {
  const since = now - THROTTLE_WINDOW_MS;
  const failed = eq(signInAttempts.succeeded, false);
  const perAccount = db
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, email), eq(signInAttempts.ip, ip), failed, gte(signInAttempts.at, since)))
    .get()!.n;
  if (perAccount >= MAX_FAILURES_PER_ACCOUNT) return true;
  const perAddress = db
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.ip, ip), failed, gte(signInAttempts.at, since)))
    .get()!.n;
  return perAddress >= MAX_FAILURES_PER_ADDRESS;
}

export function recordAttempt(db: Db, email: string, ip: string, succeeded: boolean, now = Date.now()): void {
  db.insert(signInAttempts).values({ email, ip, succeeded, at: now }).run();
}
