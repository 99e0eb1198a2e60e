/** Machine tokens as the admin page lists them: never the hash. */
import { asc, desc, eq } from "drizzle-orm";
import type { Db } from "../client";
import { machines, machineTokens, users } from "../schema";

export type MachineTokenRow = {
  id: number;
  machineId: number;
  machineName: string;
  label: string;
  createdByName: string | null;
  createdAt: number;
  lastUsedAt: number | null;
  revokedAt: number | null;
};

export function listMachineTokens(db: Db): MachineTokenRow[] {
  return db
    .select({
      id: machineTokens.id,
      machineId: machineTokens.machineId,
      machineName: machines.name,
      label: machineTokens.label,
      createdByName: users.name,
      createdAt: machineTokens.createdAt,
      lastUsedAt: machineTokens.lastUsedAt,
      revokedAt: machineTokens.revokedAt,
    })
    .from(machineTokens)
    .innerJoin(machines, eq(machines.id, machineTokens.machineId))
    .leftJoin(users, eq(users.id, machineTokens.createdById))
    .orderBy(asc(machines.name), desc(machineTokens.createdAt))
    .all();
}

export function machineOptions(db: Db) {
  return db.select({ id: machines.id, name: machines.name, active: machines.active }).from(machines).orderBy(asc(machines.name)).all();
}
