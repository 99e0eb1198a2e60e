/**
 * Invitations: an admin names an e-mail and a role; the invitee gets a one-time link (72 h)
 * and sets a password. The mail goes out before the row is written, so an SMTP failure leaves
 * nothing half-done.
 */
import { and, eq, isNull } from "drizzle-orm";
import type { Db } from "@/db/client";
import { invitations, users } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { ADMINS, ROLE_LABEL } from "../auth/roles";
import { hashPassword } from "../auth/passwords";
import { INVITATION_TTL_MS, hashToken, newToken, tokenState } from "../auth/tokens";
import { AppError } from "../errors";
import { sendMail, type Mailer } from "../mail";
import { invitationMail } from "../mail/templates";
import { parseInput } from "../validation";
import { inviteSchema, setPasswordSchema } from "./schema";

export async function inviteUser(db: Db, actor: Actor | null, input: unknown, appUrl: string, now = Date.now(), mailer?: Mailer) {
  const who = requireRole(actor, ADMINS);
  const { email, role } = parseInput(inviteSchema, input);
  if (db.select({ id: users.id }).from(users).where(eq(users.email, email)).get()) {
    throw new AppError("conflict", "Someone with that e-mail already has an account.", { email: ["Already a user."] });
  }
  const { token, tokenHash } = newToken();
  const expiresAt = now + INVITATION_TTL_MS;
  const link = `${appUrl.replace(/\/$/, "")}/invite/${token}`;
  const mail = invitationMail({ link, roleLabel: ROLE_LABEL[role], inviterName: who.name, expiresAt: new Date(expiresAt) });
  await sendMail({ to: email, ...mail }, mailer);
  return db.transaction((tx) => {
    // A newer invitation replaces any still-open one for the same address.
    tx.update(invitations)
      .set({ revokedAt: now })
      .where(and(eq(invitations.email, email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
      .run();
    const row = tx
      .insert(invitations)
      .values({ email, role, tokenHash, invitedById: who.id, expiresAt, createdAt: now })
      .returning({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt })
      .get();
    recordAudit(tx, { actor: who, action: "invitation.create", entity: "invitation", entityId: row.id, after: row }, now);
    return row;
  });
}

export function revokeInvitation(db: Db, actor: Actor | null, id: number, now = Date.now()) {
  const who = requireRole(actor, ADMINS);
  return db.transaction((tx) => {
    const row = tx.select().from(invitations).where(eq(invitations.id, id)).get();
    if (!row) throw new AppError("not_found", "That invitation was not found.");
    if (tokenState(row, now) !== "valid") throw new AppError("conflict", "That invitation is no longer open.");
    tx.update(invitations).set({ revokedAt: now }).where(eq(invitations.id, id)).run();
    recordAudit(tx, { actor: who, action: "invitation.revoke", entity: "invitation", entityId: id, before: { email: row.email } }, now);
  });
}

const TOKEN_MESSAGES = {
  expired: "This invitation has expired. Ask your administrator for a new one.",
  used: "This invitation has already been used. Sign in, or reset your password.",
  revoked: "This invitation was withdrawn. Ask your administrator for a new one.",
} as const;

/** What the invitation page shows before the form: who it is for, or why it cannot be used. */
export function inspectInvitation(db: Db, token: string, now = Date.now()) {
  const row = db.select().from(invitations).where(eq(invitations.tokenHash, hashToken(token))).get();
  if (!row) return { ok: false as const, message: "This invitation link is not valid. Check that you copied all of it." };
  const state = tokenState(row, now);
  if (state !== "valid") return { ok: false as const, message: TOKEN_MESSAGES[state] };
  return { ok: true as const, email: row.email, role: row.role, expiresAt: row.expiresAt };
}

export async function acceptInvitation(db: Db, input: unknown, now = Date.now()) {
  const { token, name, password } = parseInput(setPasswordSchema, input);
  const check = inspectInvitation(db, token, now);
  if (!check.ok) throw new AppError("invalid", check.message);
  if (!name) throw new AppError("invalid", "Enter your name.", { name: ["Enter your name."] });
  const passwordHash = await hashPassword(password);
  return db.transaction((tx) => {
    // Re-read inside the transaction: two clicks on the same link must not create two accounts.
    const row = tx.select().from(invitations).where(eq(invitations.tokenHash, hashToken(token))).get();
    if (!row || tokenState(row, now) !== "valid") throw new AppError("conflict", TOKEN_MESSAGES.used);
    if (tx.select({ id: users.id }).from(users).where(eq(users.email, row.email)).get()) {
      throw new AppError("conflict", "An account with this e-mail already exists. Sign in instead.");
    }
    const user = tx
      .insert(users)
      .values({ email: row.email, name, role: row.role, passwordHash, createdAt: now, updatedAt: now })
      .returning({ id: users.id, email: users.email, name: users.name, role: users.role })
      .get();
    tx.update(invitations).set({ acceptedAt: now }).where(eq(invitations.id, row.id)).run();
    recordAudit(tx, { actor: { id: user.id, email: user.email }, action: "user.create", entity: "user", entityId: user.id, after: user }, now);
    return user;
  });
}
