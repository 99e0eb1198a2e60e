/** Machines: admins keep them; their limits are the toolpath engine's machine profile. */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { machines, type MachineLimits } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { ADMINS } from "../auth/roles";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { machineSchema } from "./schema";
import { uniqueViolation } from "./unique";

export const MACHINE_EDITORS = ADMINS;

type MachineValues = ReturnType<typeof machineSchema.parse>;

/** Keeps only the axes the machine has, and drops empty optional limits. */
export function limitsOf(v: MachineValues): MachineLimits {
  const rotaryDeg: MachineLimits["rotaryDeg"] = {};
  const rapidPerMin: MachineLimits["rapidPerMin"] = { X: v.limits.rapidPerMin.X, Y: v.limits.rapidPerMin.Y, Z: v.limits.rapidPerMin.Z };
  for (const axis of ["A", "B", "C"] as const) {
    if (!v.axes.includes(axis)) continue;
    const r = v.limits.rotaryDeg[axis];
    if (r) rotaryDeg[axis] = r;
    const rate = v.limits.rapidPerMin[axis];
    if (rate != null) rapidPerMin[axis] = rate;
  }
  return { travelMm: v.limits.travelMm, rotaryDeg, rapidPerMin };
}

function rowValues(v: MachineValues) {
  return {
    name: v.name,
    description: v.description,
    axes: v.axes,
    limits: limitsOf(v),
    maxFeedMmMin: v.maxFeedMmMin,
    maxSpindleRpm: v.maxSpindleRpm,
    toolChangeS: v.toolChangeS,
    active: v.active,
    notes: v.notes,
  };
}

const NAME_TAKEN = { name: "Another machine already has this name." };

export function createMachine(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, MACHINE_EDITORS);
  const values = parseInput(machineSchema, input);
  return uniqueViolation(
    () =>
      db.transaction((tx) => {
        const row = tx.insert(machines).values({ ...rowValues(values), createdAt: now, updatedAt: now }).returning().get();
        recordAudit(tx, { actor: who, action: "machine.create", entity: "machine", entityId: row.id, after: row }, now);
        return row;
      }),
    NAME_TAKEN,
  );
}

export function updateMachine(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, MACHINE_EDITORS);
  const values = parseInput(machineSchema, input);
  return uniqueViolation(
    () =>
      db.transaction((tx) => {
        const before = tx.select().from(machines).where(eq(machines.id, id)).get();
        if (!before) throw new AppError("not_found", "That machine was not found.");
        const row = tx.update(machines).set({ ...rowValues(values), updatedAt: now }).where(eq(machines.id, id)).returning().get();
        recordAudit(tx, { actor: who, action: "machine.update", entity: "machine", entityId: id, before, after: row }, now);
        return row;
      }),
    NAME_TAKEN,
  );
}
