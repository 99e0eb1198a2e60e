/** Admin changes to an account: role and active flag. Deactivation ends the user's sessions at once. */
import { and, count, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { users } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { ADMINS } from "../auth/roles";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { updateUserSchema } from "./schema";

export function updateUser(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, ADMINS);
  const change = parseInput(updateUserSchema, input);
  return db.transaction((tx) => {
    const before = tx
      .select({ id: users.id, email: users.email, name: users.name, role: users.role, active: users.active, sessionVersion: users.sessionVersion })
      .from(users)
      .where(eq(users.id, id))
      .get();
    if (!before) throw new AppError("not_found", "That user was not found.");
    const losesAdmin = before.role === "admin" && before.active && (change.active === false || (change.role && change.role !== "admin"));
    if (losesAdmin) {
      if (before.id === who.id) throw new AppError("conflict", "You cannot remove your own administrator access.");
      const admins = tx.select({ n: count() }).from(users).where(and(eq(users.role, "admin"), eq(users.active, true))).get()!.n;
      if (admins <= 1) throw new AppError("conflict", "The shop needs at least one active administrator.");
    }
    const deactivating = change.active === false && before.active;
    const after = {
      role: change.role ?? before.role,
      active: change.active ?? before.active,
      sessionVersion: deactivating ? before.sessionVersion + 1 : before.sessionVersion,
      updatedAt: now,
    };
    tx.update(users).set(after).where(eq(users.id, id)).run();
    recordAudit(
      tx,
      {
        actor: who,
        action: "user.update",
        entity: "user",
        entityId: id,
        before: { role: before.role, active: before.active },
        after: { role: after.role, active: after.active },
      },
      now,
    );
    return { id, email: before.email, name: before.name, role: after.role, active: after.active };
  });
}
