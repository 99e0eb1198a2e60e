/** Forgotten password: a one-time link by e-mail. The answer never says whether the account exists. */
import { and, eq, isNull } from "drizzle-orm";
import type { Db } from "@/db/client";
import { passwordResets, users } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { hashPassword } from "../auth/passwords";
import { RESET_TTL_MS, hashToken, newToken, tokenState } from "../auth/tokens";
import { AppError } from "../errors";
import { sendMail } from "../mail";
import { passwordResetMail } from "../mail/templates";
import { parseInput } from "../validation";
import { forgotSchema, setPasswordSchema } from "./schema";

export async function requestPasswordReset(db: Db, input: unknown, appUrl: string, now = Date.now()): Promise<void> {
  const { email } = parseInput(forgotSchema, input);
  const user = db.select().from(users).where(eq(users.email, email)).get();
  if (!user || !user.active) return;
  const { token, tokenHash } = newToken();
  const expiresAt = now + RESET_TTL_MS;
  const link = `${appUrl.replace(/\/$/, "")}/reset-password/${token}`;
  await sendMail({ to: email, ...passwordResetMail({ link, name: user.name, expiresAt: new Date(expiresAt) }) });
  db.transaction((tx) => {
    tx.update(passwordResets).set({ usedAt: now }).where(and(eq(passwordResets.userId, user.id), isNull(passwordResets.usedAt))).run();
    tx.insert(passwordResets).values({ userId: user.id, tokenHash, expiresAt, createdAt: now }).run();
  });
}

const MESSAGES = {
  expired: "This reset link has expired. Ask for a new one.",
  used: "This reset link has already been used. Ask for a new one if you need it.",
  revoked: "This reset link was replaced by a newer one.",
} as const;

export function inspectReset(db: Db, token: string, now = Date.now()) {
  const row = db.select().from(passwordResets).where(eq(passwordResets.tokenHash, hashToken(token))).get();
  if (!row) return { ok: false as const, message: "This reset link is not valid. Check that you copied all of it." };
  const state = tokenState(row, now);
  if (state !== "valid") return { ok: false as const, message: MESSAGES[state] };
  const user = db.select({ email: users.email, active: users.active }).from(users).where(eq(users.id, row.userId)).get();
  if (!user?.active) return { ok: false as const, message: "This account is not active." };
  return { ok: true as const, email: user.email };
}

export async function resetPassword(db: Db, input: unknown, now = Date.now()) {
  const { token, password } = parseInput(setPasswordSchema, input);
  const check = inspectReset(db, token, now);
  if (!check.ok) throw new AppError("invalid", check.message);
  const passwordHash = await hashPassword(password);
  return db.transaction((tx) => {
    const row = tx.select().from(passwordResets).where(eq(passwordResets.tokenHash, hashToken(token))).get();
    if (!row || tokenState(row, now) !== "valid") throw new AppError("conflict", MESSAGES.used);
    const user = tx.select().from(users).where(eq(users.id, row.userId)).get()!;
    // A new password ends every other session of this account.
    tx.update(users)
      .set({ passwordHash, sessionVersion: user.sessionVersion + 1, updatedAt: now })
      .where(eq(users.id, user.id))
      .run();
    tx.update(passwordResets).set({ usedAt: now }).where(eq(passwordResets.id, row.id)).run();
    recordAudit(tx, { actor: { id: user.id, email: user.email }, action: "user.password_reset", entity: "user", entityId: user.id }, now);
    return { email: user.email };
  });
}
