/** Fixture plates: leads and admins keep them (their envelope feeds every toolpath check). */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { fixturePlates, headTypes } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { LEADS } from "../auth/roles";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { plateSchema, type WORK_OFFSET_CODES } from "./schema";
import { uniqueViolation } from "./unique";

export const PLATE_EDITORS = LEADS;

type PlateValues = ReturnType<typeof plateSchema.parse>;
export type WorkOffsetRow = { code: (typeof WORK_OFFSET_CODES)[number]; x: number; y: number; z: number; a?: number | null; b?: number | null };

/** The form's rows → the stored `{ G54: { x, y, z, a?, b? } }`. */
export function workOffsetsRecord(rows: WorkOffsetRow[]): Record<string, Record<string, number>> {
  const out: Record<string, Record<string, number>> = {};
  for (const r of rows) {
    const o: Record<string, number> = { x: r.x, y: r.y, z: r.z };
    if (r.a != null) o.a = r.a;
    if (r.b != null) o.b = r.b;
    out[r.code] = o;
  }
  return out;
}

/** The stored record → the form's rows, in G54…G59 order. */
export function workOffsetRows(record: Record<string, Record<string, number>>): WorkOffsetRow[] {
  return Object.entries(record)
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([code, v]) => ({ code: code as WorkOffsetRow["code"], x: v.x ?? 0, y: v.y ?? 0, z: v.z ?? 0, a: v.a ?? null, b: v.b ?? null }));
}

function clean(angle: { a?: number | null; b?: number | null }) {
  const o: { a?: number; b?: number } = {};
  if (angle.a != null) o.a = angle.a;
  if (angle.b != null) o.b = angle.b;
  return o;
}

function rowValues(v: PlateValues) {
  return {
    code: v.code,
    headTypeId: v.headTypeId,
    datumDescription: v.datumDescription,
    workOffsets: workOffsetsRecord(v.workOffsets),
    portAxisAngles: { intake: clean(v.portAxisAngles.intake), exhaust: clean(v.portAxisAngles.exhaust) },
    envelope: v.envelope,
    notes: v.notes,
  };
}

function checkHeadType(db: Db, id: number) {
  if (!db.select({ id: headTypes.id }).from(headTypes).where(eq(headTypes.id, id)).get()) {
    throw new AppError("invalid", "That head type does not exist.", { headTypeId: ["Choose a head type from the list."] });
  }
}

const CODE_TAKEN = { code: "Another plate already has this code." };

export function createPlate(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, PLATE_EDITORS);
  const values = parseInput(plateSchema, input);
  checkHeadType(db, values.headTypeId);
  return uniqueViolation(
    () =>
      db.transaction((tx) => {
        const row = tx.insert(fixturePlates).values({ ...rowValues(values), createdAt: now, updatedAt: now }).returning().get();
        recordAudit(tx, { actor: who, action: "plate.create", entity: "fixture_plate", entityId: row.id, after: row }, now);
        return row;
      }),
    CODE_TAKEN,
  );
}

export function updatePlate(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, PLATE_EDITORS);
  const values = parseInput(plateSchema, input);
  checkHeadType(db, values.headTypeId);
  return uniqueViolation(
    () =>
      db.transaction((tx) => {
        const before = tx.select().from(fixturePlates).where(eq(fixturePlates.id, id)).get();
        if (!before) throw new AppError("not_found", "That fixture plate was not found.");
        const row = tx.update(fixturePlates).set({ ...rowValues(values), updatedAt: now }).where(eq(fixturePlates.id, id)).returning().get();
        recordAudit(tx, { actor: who, action: "plate.update", entity: "fixture_plate", entityId: id, before, after: row }, now);
        return row;
      }),
    CODE_TAKEN,
  );
}
