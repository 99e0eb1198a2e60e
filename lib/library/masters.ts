/**
 * Master heads: porters register and edit them (notes, measurements), and move them along the
 * handoff. Handing a master over for digitizing e-mails the machinists.
 */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { headTypes, masterHeads, users, type MasterStage } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { MACHINISTS, PORTERS } from "../auth/roles";
import { AppError } from "../errors";
import type { Mailer } from "../mail";
import { addressesOfRoles, appLink, sendNotice, type NoticeResult } from "../programs/notices";
import { parseInput } from "../validation";
import { masterMoveSchema, masterSchema } from "./schema";
import { findMasterMove, MASTER_STAGE_LABEL } from "./stages";
import { uniqueViolation } from "./unique";

export const MASTER_EDITORS = PORTERS;

type MasterValues = ReturnType<typeof masterSchema.parse>;

function checkRefs(db: Db, values: MasterValues) {
  if (!db.select({ id: headTypes.id }).from(headTypes).where(eq(headTypes.id, values.headTypeId)).get()) {
    throw new AppError("invalid", "That head type does not exist.", { headTypeId: ["Choose a head type from the list."] });
  }
  if (values.porterId != null) {
    const porter = db.select({ role: users.role, active: users.active }).from(users).where(eq(users.id, values.porterId)).get();
    if (!porter || !porter.active) throw new AppError("invalid", "That porter is not an active user.", { porterId: ["Choose an active person."] });
  }
}

function rowValues(values: MasterValues) {
  return {
    label: values.label,
    headTypeId: values.headTypeId,
    porterId: values.porterId ?? null,
    startedOn: values.startedOn ?? null,
    finishedOn: values.finishedOn ?? null,
    handPortNotes: values.handPortNotes,
    measurements: { intake: dropNulls(values.measurements.intake), exhaust: dropNulls(values.measurements.exhaust) },
    notes: values.notes,
  };
}

/** Stored JSON keeps only the readings that were taken. */
function dropNulls<T extends Record<string, unknown>>(o: T): { [K in keyof T]?: Exclude<T[K], null> } {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v != null && v !== "")) as { [K in keyof T]?: Exclude<T[K], null> };
}

const LABEL_TAKEN = { label: "Another master already has this label." };

export function createMaster(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, MASTER_EDITORS);
  const values = parseInput(masterSchema, input);
  checkRefs(db, values);
  return uniqueViolation(
    () =>
      db.transaction((tx) => {
        const row = tx
          .insert(masterHeads)
          .values({ ...rowValues(values), porterId: values.porterId ?? (who.role === "porter" ? who.id : null), stage: "hand_porting", createdAt: now, updatedAt: now })
          .returning()
          .get();
        recordAudit(tx, { actor: who, action: "master.create", entity: "master_head", entityId: row.id, after: row }, now);
        return row;
      }),
    LABEL_TAKEN,
  );
}

export function updateMaster(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, MASTER_EDITORS);
  const values = parseInput(masterSchema, input);
  checkRefs(db, values);
  return uniqueViolation(
    () =>
      db.transaction((tx) => {
        const before = tx.select().from(masterHeads).where(eq(masterHeads.id, id)).get();
        if (!before) throw new AppError("not_found", "That master head was not found.");
        if (before.stage === "retired") throw new AppError("conflict", "A retired master is kept as it was.");
        // An edit that does not mention the porter keeps the one on record (null clears it).
        const porterId = values.porterId === undefined ? before.porterId : values.porterId;
        const row = tx.update(masterHeads).set({ ...rowValues(values), porterId, updatedAt: now }).where(eq(masterHeads.id, id)).returning().get();
        recordAudit(tx, { actor: who, action: "master.update", entity: "master_head", entityId: id, before, after: row }, now);
        return row;
      }),
    LABEL_TAKEN,
  );
}

/** Moves a master to another stage (the role table is in ./stages); notices go out after commit. */
export async function moveMaster(db: Db, actor: Actor | null, id: number, input: unknown, opts: { now?: number; mailer?: Mailer } = {}) {
  const now = opts.now ?? Date.now();
  const who = requireRole(actor, [...new Set([...PORTERS, ...MACHINISTS])]);
  const { to, note } = parseInput(masterMoveSchema, input);
  const moved = db.transaction((tx) => {
    const before = tx.select().from(masterHeads).where(eq(masterHeads.id, id)).get();
    if (!before) throw new AppError("not_found", "That master head was not found.");
    return applyMasterMove(tx as unknown as Db, who, before, to, note, now);
  });
  const notice = await masterNotice(db, moved);
  return { master: moved, notice };
}

type MasterRow = typeof masterHeads.$inferSelect;

/** The move itself, inside the caller's transaction (also used when a scan marks a master digitized). */
export function applyMasterMove(tx: Db, who: Actor, before: MasterRow, to: MasterStage, note: string, now: number): MasterRow {
  const move = findMasterMove(before.stage, to);
  if (!move) {
    throw new AppError("conflict", `A master cannot go from ${MASTER_STAGE_LABEL[before.stage].toLowerCase()} to ${MASTER_STAGE_LABEL[to].toLowerCase()}.`);
  }
  requireRole(who, move.roles);
  const finishedOn = to === "ready_to_digitize" && !before.finishedOn ? new Date(now).toISOString().slice(0, 10) : before.finishedOn;
  const row = tx.update(masterHeads).set({ stage: to, finishedOn, updatedAt: now }).where(eq(masterHeads.id, before.id)).returning().get();
  recordAudit(
    tx,
    { actor: who, action: "master.move", entity: "master_head", entityId: before.id, before: { stage: before.stage }, after: { stage: to, note } },
    now,
  );
  return row;
}

export async function masterNotice(db: Db, master: MasterRow, mailer?: Mailer): Promise<NoticeResult | null> {
  if (master.stage !== "ready_to_digitize") return null;
  const head = db.select({ castingNumber: headTypes.castingNumber }).from(headTypes).where(eq(headTypes.id, master.headTypeId)).get();
  return sendNotice(
    addressesOfRoles(db, ["machinist"]),
    {
      subject: `Master ${master.label} is ready to digitize`,
      lines: [
        `The hand-ported master ${master.label} (casting ${head?.castingNumber ?? "?"}) has been handed over for digitizing.`,
        "Mount it on its fixture plate, digitize the ports and record the scan in Portolan.",
      ],
      link: appLink(`/masters/${master.id}`),
    },
    mailer,
  );
}
