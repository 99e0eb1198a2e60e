/**
 * Scans: one digitizing run of a master's port on a plate and machine. Machinists record them;
 * the first scan of a master that is waiting for digitizing moves it to "digitized".
 */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { fixturePlates, machines, masterHeads, scans, users } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { MACHINISTS } from "../auth/roles";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { applyMasterMove } from "./masters";
import { scanSchema } from "./schema";

export const SCAN_EDITORS = MACHINISTS;

type ScanValues = ReturnType<typeof scanSchema.parse>;

function checkRefs(db: Db, v: ScanValues) {
  const master = db.select().from(masterHeads).where(eq(masterHeads.id, v.masterId)).get();
  if (!master) throw new AppError("invalid", "That master head does not exist.", { masterId: ["Choose a master head."] });
  const plate = db.select({ headTypeId: fixturePlates.headTypeId }).from(fixturePlates).where(eq(fixturePlates.id, v.plateId)).get();
  if (!plate) throw new AppError("invalid", "That fixture plate does not exist.", { plateId: ["Choose a fixture plate."] });
  if (plate.headTypeId !== master.headTypeId) {
    throw new AppError("invalid", "That plate is made for another casting than the master's.", { plateId: ["Choose a plate for the master's casting."] });
  }
  if (!db.select({ id: machines.id }).from(machines).where(eq(machines.id, v.machineId)).get()) {
    throw new AppError("invalid", "That machine does not exist.", { machineId: ["Choose a machine."] });
  }
  if (v.operatorId != null && !db.select({ id: users.id }).from(users).where(eq(users.id, v.operatorId)).get()) {
    throw new AppError("invalid", "That operator is not a user.", { operatorId: ["Choose a person."] });
  }
  return master;
}

function rowValues(v: ScanValues, who: Actor) {
  return {
    masterId: v.masterId,
    plateId: v.plateId,
    machineId: v.machineId,
    port: v.port,
    operatorId: v.operatorId ?? who.id,
    stylusDiameterMm: v.stylusDiameterMm,
    pointSpacingMm: v.pointSpacingMm,
    scannedOn: v.scannedOn,
    notes: v.notes,
  };
}

export function createScan(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, SCAN_EDITORS);
  const values = parseInput(scanSchema, input);
  const master = checkRefs(db, values);
  if (master.stage === "hand_porting" || master.stage === "retired") {
    throw new AppError("conflict", `Master ${master.label} is not handed over for digitizing yet.`, { masterId: ["The porter has not handed this master over."] });
  }
  return db.transaction((tx) => {
    const row = tx.insert(scans).values({ ...rowValues(values, who), createdAt: now, updatedAt: now }).returning().get();
    recordAudit(tx, { actor: who, action: "scan.create", entity: "scan", entityId: row.id, after: row }, now);
    if (master.stage === "ready_to_digitize") applyMasterMove(tx as unknown as Db, who, master, "digitized", `scan ${row.id} recorded`, now);
    return row;
  });
}

export function updateScan(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, SCAN_EDITORS);
  const values = parseInput(scanSchema, input);
  checkRefs(db, values);
  return db.transaction((tx) => {
    const before = tx.select().from(scans).where(eq(scans.id, id)).get();
    if (!before) throw new AppError("not_found", "That scan was not found.");
    const row = tx.update(scans).set({ ...rowValues(values, who), operatorId: values.operatorId ?? before.operatorId, updatedAt: now }).where(eq(scans.id, id)).returning().get();
    recordAudit(tx, { actor: who, action: "scan.update", entity: "scan", entityId: id, before, after: row }, now);
    return row;
  });
}
