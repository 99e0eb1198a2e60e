import { count, eq, like, or } from "drizzle-orm";
import type { Db } from "../client";
import { headTypes } from "../schema";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { likePattern, offsetFor, orderFor } from "./paging";

export type HeadTypeRow = typeof headTypes.$inferSelect;

const sortable = {
  castingNumber: headTypes.castingNumber,
  engineFamily: headTypes.engineFamily,
  cylinders: headTypes.cylinders,
  boreMm: headTypes.boreMm,
  strokeMm: headTypes.strokeMm,
  intakeValveMm: headTypes.intakeValveMm,
  exhaustValveMm: headTypes.exhaustValveMm,
};

export function listHeadTypes(db: Db, query: TableQuery): Page<HeadTypeRow> {
  const where = query.q ? or(like(headTypes.castingNumber, likePattern(query.q)), like(headTypes.engineFamily, likePattern(query.q))) : undefined;
  const rows = db
    .select()
    .from(headTypes)
    .where(where)
    .orderBy(...orderFor(query, sortable, "castingNumber"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db.select({ n: count() }).from(headTypes).where(where).get()!.n;
  return pageOf(rows, total, query);
}

export function getHeadType(db: Db, id: number): HeadTypeRow | undefined {
  return db.select().from(headTypes).where(eq(headTypes.id, id)).get();
}

/** Choices for forms: every casting, by number. */
export function headTypeOptions(db: Db) {
  return db
    .select({ id: headTypes.id, castingNumber: headTypes.castingNumber, engineFamily: headTypes.engineFamily, intakeValveMm: headTypes.intakeValveMm, exhaustValveMm: headTypes.exhaustValveMm })
    .from(headTypes)
    .orderBy(headTypes.castingNumber)
    .all();
}
