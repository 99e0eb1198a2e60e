/** Customers: the lead and the administrator keep them; everyone else reads. */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { customers } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { LEADS } from "../auth/roles";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { customerSchema, customerUpdateSchema } from "./schema";

export function createCustomer(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, LEADS);
  const values = parseInput(customerSchema, input);
  return db.transaction((tx) => {
    const row = tx
      .insert(customers)
      .values({ ...values, createdAt: now, updatedAt: now })
      .returning()
      .get();
    recordAudit(tx, { actor: who, action: "customer.create", entity: "customer", entityId: row.id, after: values }, now);
    return row;
  });
}

export function updateCustomer(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, LEADS);
  const change = parseInput(customerUpdateSchema, input);
  return db.transaction((tx) => {
    const before = tx.select().from(customers).where(eq(customers.id, id)).get();
    if (!before) throw new AppError("not_found", "That customer was not found.");
    const changed = Object.fromEntries(Object.entries(change).filter(([k, v]) => v !== undefined && before[k as keyof typeof before] !== v));
    if (Object.keys(changed).length === 0) return before;
    const after = tx
      .update(customers)
      .set({ ...changed, updatedAt: now })
      .where(eq(customers.id, id))
      .returning()
      .get();
    recordAudit(
      tx,
      {
        actor: who,
        action: "customer.update",
        entity: "customer",
        entityId: id,
        before: Object.fromEntries(Object.keys(changed).map((k) => [k, before[k as keyof typeof before]])),
        after: changed,
      },
      now,
    );
    return after;
  });
}
