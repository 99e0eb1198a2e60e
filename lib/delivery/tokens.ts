/**
 * Per-machine API tokens for the cell computer: 32 random bytes shown once, only their SHA-256
 * stored, revocable, with the last use recorded. A token speaks for one machine only.
 */
import { randomBytes } from "node:crypto";
import { and, eq, isNull } from "drizzle-orm";
import type { Db } from "@/db/client";
import { machines, machineTokens } from "@/db/schema";
import { recordAudit, type AuditActor } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { ADMINS } from "../auth/roles";
import { hashToken } from "../auth/tokens";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { issueTokenSchema } from "./schema";

/** Recognisable in logs and config files; the random part is 32 bytes, base64url. */
export const TOKEN_PREFIX = "ptm_";

export function newMachineToken(): { token: string; tokenHash: string } {
  const token = `${TOKEN_PREFIX}${randomBytes(32).toString("base64url")}`;
  return { token, tokenHash: hashToken(token) };
}

export function issueMachineToken(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, ADMINS);
  const { machineId, label } = parseInput(issueTokenSchema, input);
  const { token, tokenHash } = newMachineToken();
  return db.transaction((tx) => {
    const machine = tx.select({ id: machines.id, name: machines.name, active: machines.active }).from(machines).where(eq(machines.id, machineId)).get();
    if (!machine) throw new AppError("invalid", "That machine was not found.", { machineId: ["Not found."] });
    if (!machine.active) throw new AppError("invalid", "That machine is out of service.", { machineId: ["Out of service."] });
    const row = tx
      .insert(machineTokens)
      .values({ machineId, label, tokenHash, createdById: who.id, createdAt: now })
      .returning({ id: machineTokens.id, machineId: machineTokens.machineId, label: machineTokens.label, createdAt: machineTokens.createdAt })
      .get();
    recordAudit(tx, { actor: who, action: "machine_token.issue", entity: "machine_token", entityId: row.id, after: { ...row, machineName: machine.name } }, now);
    // The only time the token itself leaves the server.
    return { ...row, machineName: machine.name, token };
  });
}

export function revokeMachineToken(db: Db, actor: Actor | null, id: number, now = Date.now()) {
  const who = requireRole(actor, ADMINS);
  return db.transaction((tx) => {
    const row = tx.select().from(machineTokens).where(eq(machineTokens.id, id)).get();
    if (!row) throw new AppError("not_found", "That token was not found.");
    if (row.revokedAt) throw new AppError("conflict", "That token is already revoked.");
    tx.update(machineTokens).set({ revokedAt: now }).where(eq(machineTokens.id, id)).run();
    recordAudit(tx, { actor: who, action: "machine_token.revoke", entity: "machine_token", entityId: id, before: { label: row.label, machineId: row.machineId, revokedAt: null }, after: { revokedAt: now } }, now);
    return { id, revokedAt: now };
  });
}

export type MachineCaller = { tokenId: number; label: string; machineId: number; machineName: string; actor: AuditActor };

/** `Authorization: Bearer <token>` → the machine it speaks for; 401 for anything else. */
export function authenticateMachine(db: Db, authorization: string | null | undefined): MachineCaller {
  const m = /^Bearer\s+(\S+)\s*$/i.exec(authorization ?? "");
  if (!m) throw new AppError("unauthenticated", "Send the machine token as `Authorization: Bearer <token>`.");
  const row = db
    .select({ id: machineTokens.id, label: machineTokens.label, machineId: machineTokens.machineId, machineName: machines.name, active: machines.active })
    .from(machineTokens)
    .innerJoin(machines, eq(machines.id, machineTokens.machineId))
    .where(and(eq(machineTokens.tokenHash, hashToken(m[1]!)), isNull(machineTokens.revokedAt)))
    .get();
  // Unknown and revoked look the same from outside: nothing to learn by guessing.
  if (!row || !row.active) throw new AppError("unauthenticated", "This machine token is not valid (unknown or revoked).");
  return {
    tokenId: row.id,
    label: row.label,
    machineId: row.machineId,
    machineName: row.machineName,
    actor: { id: null, email: `machine-token:${row.id} (${row.machineName})` },
  };
}
