/**
 * A record's links must point at things that exist and fit: the master and the production head
 * of the same casting, a revision of a program for that casting and that port, an operator who
 * works the bench. Checked inside the writing transaction.
 */
import { and, eq } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { headTypes, heads, masterHeads, programs, revisions, users } from "@/db/schema";
import { SHOP_FLOOR } from "../auth/roles";
import { AppError, type FieldErrors } from "../errors";
import type { StoredFlowTest } from "./normalize";

export function checkLinks(tx: Tx, test: StoredFlowTest): void {
  const fields: FieldErrors = {};
  const add = (key: string, message: string) => (fields[key] ??= []).push(message);

  const type = tx.select({ cylinders: headTypes.cylinders, casting: headTypes.castingNumber }).from(headTypes).where(eq(headTypes.id, test.headTypeId)).get();
  if (!type) add("headTypeId", "That head type does not exist.");
  if (type && test.cylinder != null && test.cylinder > type.cylinders) {
    add("cylinder", `${type.casting} has ${type.cylinders} cylinders.`);
  }
  if (test.masterId != null) {
    const master = tx.select({ headTypeId: masterHeads.headTypeId }).from(masterHeads).where(eq(masterHeads.id, test.masterId)).get();
    if (!master) add("masterId", "That master head does not exist.");
    else if (master.headTypeId !== test.headTypeId) add("masterId", "That master head is of another casting.");
  }
  if (test.revisionId != null) {
    const rev = tx
      .select({ headTypeId: programs.headTypeId, port: programs.port })
      .from(revisions)
      .innerJoin(programs, eq(programs.id, revisions.programId))
      .where(eq(revisions.id, test.revisionId))
      .get();
    if (!rev) add("revisionId", "That program revision does not exist.");
    else if (rev.headTypeId !== test.headTypeId) add("revisionId", "That revision belongs to a program of another casting.");
    else if (rev.port !== test.port) add("revisionId", `That revision cuts the ${rev.port} port; this test is of the ${test.port} port.`);
  }
  if (test.headId != null) {
    const head = tx.select({ headTypeId: heads.headTypeId }).from(heads).where(eq(heads.id, test.headId)).get();
    if (!head) add("headId", "That production head does not exist.");
    else if (head.headTypeId !== test.headTypeId) add("headId", "That production head is of another casting.");
  }
  if (test.operatorId != null) {
    const op = tx.select({ role: users.role }).from(users).where(and(eq(users.id, test.operatorId), eq(users.active, true))).get();
    if (!op || !SHOP_FLOOR.includes(op.role)) add("operatorId", "Choose an active person of the shop floor as operator.");
  }
  if (Object.keys(fields).length) throw new AppError("invalid", "Some fields need attention.", fields);
}
