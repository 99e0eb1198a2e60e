/** Head types (castings): leads and admins keep the list; everyone reads it. */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { headTypes } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { LEADS } from "../auth/roles";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { headTypeSchema } from "./schema";
import { uniqueViolation } from "./unique";

export const HEAD_TYPE_EDITORS = LEADS;

export function createHeadType(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, HEAD_TYPE_EDITORS);
  const values = parseInput(headTypeSchema, input);
  return uniqueViolation(
    () =>
      db.transaction((tx) => {
        const row = tx.insert(headTypes).values({ ...values, createdAt: now, updatedAt: now }).returning().get();
        recordAudit(tx, { actor: who, action: "head_type.create", entity: "head_type", entityId: row.id, after: row }, now);
        return row;
      }),
    { castingNumber: "Another head type already has this casting number." },
  );
}

export function updateHeadType(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, HEAD_TYPE_EDITORS);
  const values = parseInput(headTypeSchema, input);
  return uniqueViolation(
    () =>
      db.transaction((tx) => {
        const before = tx.select().from(headTypes).where(eq(headTypes.id, id)).get();
        if (!before) throw new AppError("not_found", "That head type was not found.");
        const row = tx.update(headTypes).set({ ...values, updatedAt: now }).where(eq(headTypes.id, id)).returning().get();
        recordAudit(tx, { actor: who, action: "head_type.update", entity: "head_type", entityId: id, before, after: row }, now);
        return row;
      }),
    { castingNumber: "Another head type already has this casting number." },
  );
}
