import { and, asc, count, eq, gt, gte, like, lt, or, type SQL } from "drizzle-orm";
import type { Db } from "../client";
import { auditEvents } from "../schema";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { likePattern, offsetFor, orderFor } from "./paging";

export type AuditRow = typeof auditEvents.$inferSelect;

const sortable = { id: auditEvents.id, at: auditEvents.at, actorEmail: auditEvents.actorEmail, action: auditEvents.action, entity: auditEvents.entity };

/** The auditor's filters; dates are calendar days (UTC) and `to` is inclusive. */
export type AuditFilter = {
  q?: string;
  entity?: string;
  entityId?: string;
  /** Part of the actor's e-mail (people) or token label (machines). */
  actor?: string;
  /** An exact action ("job.move") or a family ending in a dot ("job."). */
  action?: string;
  from?: string;
  to?: string;
};

const DAY_MS = 86_400_000;
const dayStart = (d: string) => Date.parse(`${d}T00:00:00Z`);

function whereOf(f: AuditFilter): SQL | undefined {
  return and(
    f.q ? or(like(auditEvents.action, likePattern(f.q)), like(auditEvents.actorEmail, likePattern(f.q)), like(auditEvents.entity, likePattern(f.q))) : undefined,
    f.entity ? eq(auditEvents.entity, f.entity) : undefined,
    f.entityId ? eq(auditEvents.entityId, f.entityId) : undefined,
    f.actor ? like(auditEvents.actorEmail, likePattern(f.actor)) : undefined,
    f.action ? (f.action.endsWith(".") ? like(auditEvents.action, `${f.action.replace(/[\\%_]/g, (c) => `\\${c}`)}%`) : eq(auditEvents.action, f.action)) : undefined,
    f.from ? gte(auditEvents.at, dayStart(f.from)) : undefined,
    f.to ? lt(auditEvents.at, dayStart(f.to) + DAY_MS) : undefined,
  );
}

export function listAuditEvents(db: Db, query: TableQuery & AuditFilter): Page<AuditRow> {
  const where = whereOf(query);
  const rows = db
    .select()
    .from(auditEvents)
    .where(where)
    .orderBy(...orderFor(query, sortable, "id"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db.select({ n: count() }).from(auditEvents).where(where).get()!.n;
  return pageOf(rows, total, query);
}

/** Every matching event in id order, read a batch at a time (for the CSV export). */
export function* auditEventsMatching(db: Db, filter: AuditFilter, batch = 500): Generator<AuditRow> {
  let after = 0;
  for (;;) {
    const rows = db
      .select()
      .from(auditEvents)
      .where(and(whereOf(filter), gt(auditEvents.id, after)))
      .orderBy(asc(auditEvents.id))
      .limit(batch)
      .all();
    yield* rows;
    if (rows.length < batch) return;
    after = rows[rows.length - 1]!.id;
  }
}

/** The distinct record kinds and actions, for the filter selects. */
export function auditVocabulary(db: Db): { entities: string[]; actions: string[] } {
  return {
    entities: db.selectDistinct({ v: auditEvents.entity }).from(auditEvents).orderBy(asc(auditEvents.entity)).all().map((r) => r.v),
    actions: db.selectDistinct({ v: auditEvents.action }).from(auditEvents).orderBy(asc(auditEvents.action)).all().map((r) => r.v),
  };
}
