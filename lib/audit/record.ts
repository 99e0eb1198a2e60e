/**
 * Writes one audit event inside the caller's transaction, chained to the previous event.
 * better-sqlite3 transactions are serialised, so reading the last hash here cannot race.
 */
import { desc } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { auditEvents } from "@/db/schema";
import { eventHash } from "./canonical";

export type AuditActor = { id: number | null; email: string };

export type AuditInput = {
  actor: AuditActor;
  action: string;
  entity: string;
  entityId?: string | number | null;
  before?: unknown;
  after?: unknown;
};

/** Fields never copied into the audit trail. */
const SECRET_KEYS = new Set(["passwordHash", "tokenHash", "password", "token"]);

function scrub(value: unknown): unknown {
  if (value == null || typeof value !== "object") return value ?? null;
  if (Array.isArray(value)) return value.map(scrub);
  return Object.fromEntries(
    Object.entries(value as Record<string, unknown>).map(([k, v]) => [k, SECRET_KEYS.has(k) ? "[redacted]" : scrub(v)]),
  );
}

export function recordAudit(tx: Tx | Db, input: AuditInput, now = Date.now()): { id: number; hash: string } {
  const last = tx.select({ hash: auditEvents.hash }).from(auditEvents).orderBy(desc(auditEvents.id)).limit(1).get();
  const prevHash = last?.hash ?? "";
  const content = {
    at: now,
    actorId: input.actor.id,
    actorEmail: input.actor.email,
    action: input.action,
    entity: input.entity,
    entityId: input.entityId == null ? null : String(input.entityId),
    before: scrub(input.before),
    after: scrub(input.after),
  };
  const hash = eventHash(prevHash, content);
  const row = tx
    .insert(auditEvents)
    .values({ ...content, prevHash, hash })
    .returning({ id: auditEvents.id })
    .get();
  return { id: row.id, hash };
}
