/** Lists and details of the shop library: master heads, fixture plates, machines. */
import { and, count, desc, eq, like, or, sql, type SQL } from "drizzle-orm";
import type { Db } from "../client";
import { attachments, fixturePlates, flowTests, headTypes, machines, masterHeads, programs, scans, storedFiles, users, type MasterStage } from "../schema";
import { MASTER_STAGES } from "../enums";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { likePattern, offsetFor, orderFor } from "./paging";

// ─── Master heads ───────────────────────────────────────────────────────────

export type MasterListRow = {
  id: number;
  label: string;
  headTypeId: number;
  castingNumber: string;
  porterName: string | null;
  stage: MasterStage;
  startedOn: string | null;
  finishedOn: string | null;
  updatedAt: number;
  scanCount: number;
};

const scanCount = sql<number>`(SELECT count(*) FROM scans s WHERE s.master_id = ${masterHeads.id})`;

export function listMasters(db: Db, query: TableQuery & { stage?: string; headTypeId?: number }): Page<MasterListRow> {
  const conds: SQL[] = [];
  if (query.q) conds.push(or(like(masterHeads.label, likePattern(query.q)), like(headTypes.castingNumber, likePattern(query.q)))!);
  if (query.stage && (MASTER_STAGES as readonly string[]).includes(query.stage)) conds.push(eq(masterHeads.stage, query.stage as MasterStage));
  if (query.headTypeId) conds.push(eq(masterHeads.headTypeId, query.headTypeId));
  const where = conds.length ? and(...conds) : undefined;
  const sortable = { label: masterHeads.label, castingNumber: headTypes.castingNumber, porterName: users.name, stage: masterHeads.stage, startedOn: masterHeads.startedOn, finishedOn: masterHeads.finishedOn, updatedAt: masterHeads.updatedAt, scanCount };
  const rows = db
    .select({ id: masterHeads.id, label: masterHeads.label, headTypeId: masterHeads.headTypeId, castingNumber: headTypes.castingNumber, porterName: users.name, stage: masterHeads.stage, startedOn: masterHeads.startedOn, finishedOn: masterHeads.finishedOn, updatedAt: masterHeads.updatedAt, scanCount })
    .from(masterHeads)
    .innerJoin(headTypes, eq(headTypes.id, masterHeads.headTypeId))
    .leftJoin(users, eq(users.id, masterHeads.porterId))
    .where(where)
    .orderBy(...orderFor(query, sortable, "label"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db.select({ n: count() }).from(masterHeads).innerJoin(headTypes, eq(headTypes.id, masterHeads.headTypeId)).where(where).get()!.n;
  return pageOf(rows, total, query);
}

export function getMaster(db: Db, id: number) {
  const row = db
    .select({ master: masterHeads, headType: headTypes, porterName: users.name })
    .from(masterHeads)
    .innerJoin(headTypes, eq(headTypes.id, masterHeads.headTypeId))
    .leftJoin(users, eq(users.id, masterHeads.porterId))
    .where(eq(masterHeads.id, id))
    .get();
  if (!row) return undefined;
  const masterScans = db
    .select({ id: scans.id, port: scans.port, scannedOn: scans.scannedOn, plateCode: fixturePlates.code, machineName: machines.name })
    .from(scans)
    .innerJoin(fixturePlates, eq(fixturePlates.id, scans.plateId))
    .innerJoin(machines, eq(machines.id, scans.machineId))
    .where(eq(scans.masterId, id))
    .orderBy(desc(scans.scannedOn))
    .all();
  const flowTestCount = db.select({ n: count() }).from(flowTests).where(eq(flowTests.masterId, id)).get()!.n;
  return { ...row, scans: masterScans, photos: attachmentsOf(db, "master_head", id), flowTestCount };
}

export function masterOptions(db: Db, opts: { digitizable?: boolean } = {}) {
  return db
    .select({ id: masterHeads.id, label: masterHeads.label, headTypeId: masterHeads.headTypeId, stage: masterHeads.stage, castingNumber: headTypes.castingNumber })
    .from(masterHeads)
    .innerJoin(headTypes, eq(headTypes.id, masterHeads.headTypeId))
    .where(opts.digitizable ? sql`${masterHeads.stage} IN ('ready_to_digitize', 'digitized')` : undefined)
    .orderBy(masterHeads.label)
    .all();
}

export function peopleOptions(db: Db, role?: "porter" | "machinist") {
  return db
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(and(eq(users.active, true), role ? sql`${users.role} IN (${role}, 'lead', 'admin')` : undefined))
    .orderBy(users.name)
    .all();
}

// ─── Attachments ────────────────────────────────────────────────────────────

export type AttachmentRow = { id: number; fileId: number; caption: string; name: string; kind: string; sizeBytes: number; createdAt: number };

export function attachmentsOf(db: Db, entity: string, entityId: number): AttachmentRow[] {
  return db
    .select({ id: attachments.id, fileId: attachments.fileId, caption: attachments.caption, name: storedFiles.originalName, kind: storedFiles.kind, sizeBytes: storedFiles.sizeBytes, createdAt: attachments.createdAt })
    .from(attachments)
    .innerJoin(storedFiles, eq(storedFiles.id, attachments.fileId))
    .where(and(eq(attachments.entity, entity), eq(attachments.entityId, entityId), eq(storedFiles.state, "stored")))
    .orderBy(attachments.id)
    .all();
}

// ─── Fixture plates ─────────────────────────────────────────────────────────

export type PlateListRow = { id: number; code: string; headTypeId: number; castingNumber: string; datumDescription: string; envelope: unknown; updatedAt: number; scanCount: number };

export function listPlates(db: Db, query: TableQuery): Page<PlateListRow> {
  const where = query.q ? or(like(fixturePlates.code, likePattern(query.q)), like(headTypes.castingNumber, likePattern(query.q))) : undefined;
  const plateScans = sql<number>`(SELECT count(*) FROM scans s WHERE s.plate_id = ${fixturePlates.id})`;
  const sortable = { code: fixturePlates.code, castingNumber: headTypes.castingNumber, updatedAt: fixturePlates.updatedAt, scanCount: plateScans };
  const rows = db
    .select({ id: fixturePlates.id, code: fixturePlates.code, headTypeId: fixturePlates.headTypeId, castingNumber: headTypes.castingNumber, datumDescription: fixturePlates.datumDescription, envelope: fixturePlates.envelope, updatedAt: fixturePlates.updatedAt, scanCount: plateScans })
    .from(fixturePlates)
    .innerJoin(headTypes, eq(headTypes.id, fixturePlates.headTypeId))
    .where(where)
    .orderBy(...orderFor(query, sortable, "code"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db.select({ n: count() }).from(fixturePlates).innerJoin(headTypes, eq(headTypes.id, fixturePlates.headTypeId)).where(where).get()!.n;
  return pageOf(rows, total, query);
}

export function getPlate(db: Db, id: number) {
  const row = db.select({ plate: fixturePlates, headType: headTypes }).from(fixturePlates).innerJoin(headTypes, eq(headTypes.id, fixturePlates.headTypeId)).where(eq(fixturePlates.id, id)).get();
  if (!row) return undefined;
  return { ...row, photos: attachmentsOf(db, "fixture_plate", id) };
}

export function plateOptions(db: Db) {
  return db
    .select({ id: fixturePlates.id, code: fixturePlates.code, headTypeId: fixturePlates.headTypeId })
    .from(fixturePlates)
    .orderBy(fixturePlates.code)
    .all();
}

// ─── Machines ───────────────────────────────────────────────────────────────

export type MachineListRow = { id: number; name: string; axes: string; maxFeedMmMin: number; maxSpindleRpm: number; toolChangeS: number; active: boolean; updatedAt: number };

export function listMachines(db: Db, query: TableQuery): Page<MachineListRow> {
  const where = query.q ? or(like(machines.name, likePattern(query.q)), like(machines.description, likePattern(query.q))) : undefined;
  const sortable = { name: machines.name, axes: machines.axes, maxFeedMmMin: machines.maxFeedMmMin, maxSpindleRpm: machines.maxSpindleRpm, toolChangeS: machines.toolChangeS, active: machines.active };
  const rows = db
    .select({ id: machines.id, name: machines.name, axes: machines.axes, maxFeedMmMin: machines.maxFeedMmMin, maxSpindleRpm: machines.maxSpindleRpm, toolChangeS: machines.toolChangeS, active: machines.active, updatedAt: machines.updatedAt })
    .from(machines)
    .where(where)
    .orderBy(...orderFor(query, sortable, "name"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db.select({ n: count() }).from(machines).where(where).get()!.n;
  return pageOf(rows, total, query);
}

export function getMachine(db: Db, id: number) {
  return db.select().from(machines).where(eq(machines.id, id)).get();
}

export function machineOptions(db: Db) {
  return db.select({ id: machines.id, name: machines.name, active: machines.active }).from(machines).orderBy(machines.name).all();
}

// ─── Head type detail ───────────────────────────────────────────────────────

export function headTypeRelations(db: Db, headTypeId: number) {
  return {
    plates: db.select({ id: fixturePlates.id, code: fixturePlates.code }).from(fixturePlates).where(eq(fixturePlates.headTypeId, headTypeId)).orderBy(fixturePlates.code).all(),
    masters: db.select({ id: masterHeads.id, label: masterHeads.label, stage: masterHeads.stage }).from(masterHeads).where(eq(masterHeads.headTypeId, headTypeId)).orderBy(masterHeads.label).all(),
    programs: db.select({ id: programs.id, name: programs.name, port: programs.port }).from(programs).where(eq(programs.headTypeId, headTypeId)).orderBy(programs.port, programs.name).all(),
  };
}
