import { and, count, eq, like, or } from "drizzle-orm";
import type { Db } from "../client";
import { auditEvents } from "../schema";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { likePattern, offsetFor, orderFor } from "./paging";

export type AuditRow = typeof auditEvents.$inferSelect;

const sortable = { id: auditEvents.id, at: auditEvents.at, actorEmail: auditEvents.actorEmail, action: auditEvents.action, entity: auditEvents.entity };

export function listAuditEvents(db: Db, query: TableQuery & { entity?: string; entityId?: string }): Page<AuditRow> {
  const where = and(
    query.q
      ? or(like(auditEvents.action, likePattern(query.q)), like(auditEvents.actorEmail, likePattern(query.q)), like(auditEvents.entity, likePattern(query.q)))
      : undefined,
    query.entity ? eq(auditEvents.entity, query.entity) : undefined,
    query.entityId ? eq(auditEvents.entityId, query.entityId) : undefined,
  );
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
