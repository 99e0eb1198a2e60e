/** Programs: one per head type, port and name. Machinists create them; leads may too. */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { headTypes, programs } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { MACHINISTS } from "../auth/roles";
import { AppError } from "../errors";
import { uniqueViolation } from "../library/unique";
import { parseInput } from "../validation";
import { programSchema } from "./schema";

export const PROGRAM_EDITORS = MACHINISTS;
const TAKEN = { name: "This casting already has a program of that name for this port." };

function checkHeadType(db: Db, id: number) {
  if (!db.select({ id: headTypes.id }).from(headTypes).where(eq(headTypes.id, id)).get()) {
    throw new AppError("invalid", "That head type does not exist.", { headTypeId: ["Choose a head type from the list."] });
  }
}

export function createProgram(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, PROGRAM_EDITORS);
  const values = parseInput(programSchema, input);
  checkHeadType(db, values.headTypeId);
  return uniqueViolation(
    () =>
      db.transaction((tx) => {
        const row = tx.insert(programs).values({ ...values, createdAt: now }).returning().get();
        recordAudit(tx, { actor: who, action: "program.create", entity: "program", entityId: row.id, after: row }, now);
        return row;
      }),
    TAKEN,
  );
}

/** Name and notes only: the casting and port of a program with revisions never change. */
export function updateProgram(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, PROGRAM_EDITORS);
  const values = parseInput(programSchema, input);
  return uniqueViolation(
    () =>
      db.transaction((tx) => {
        const before = tx.select().from(programs).where(eq(programs.id, id)).get();
        if (!before) throw new AppError("not_found", "That program was not found.");
        if (before.headTypeId !== values.headTypeId || before.port !== values.port) {
          throw new AppError("conflict", "A program's casting and port are fixed; create a new program instead.", { headTypeId: ["Fixed once created."] });
        }
        const row = tx.update(programs).set({ name: values.name, notes: values.notes }).where(eq(programs.id, id)).returning().get();
        recordAudit(tx, { actor: who, action: "program.update", entity: "program", entityId: id, before, after: row }, now);
        return row;
      }),
    TAKEN,
  );
}
