/**
 * Reads for jobs: the list (with the revision flag computed from each chosen revision's current
 * state, so nothing has to remember to set it), one job in full, the revisions a job may choose,
 * and the jobs that use a revision.
 */
import { and, asc, count, eq, inArray, like, or, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/sqlite-core";
import type { Db, Tx } from "../client";
import {
  analyses,
  customers,
  headTypes,
  jobs,
  machines,
  programs,
  revisionFiles,
  revisions,
  storedFiles,
  type JobState,
  type Port,
  type RevisionState,
} from "../schema";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { likePattern, offsetFor, orderFor } from "./paging";

type Reader = Db | Tx;

const OPEN = ["quoted", "scheduled", "on_machine", "in_inspection"] as const;
const ENDED = ["superseded", "withdrawn"] as const;

// ─── Revisions as a job sees them ───────────────────────────────────────────

export type ToolpathFile = {
  fileId: number;
  storageKey: string;
  sha256: string | null;
  sizeBytes: number;
  originalName: string;
  contentType: string;
  state: string;
};

export type RevisionSummary = {
  id: number;
  letter: string;
  state: RevisionState;
  programId: number;
  programName: string;
  port: Port;
  headTypeId: number;
  releasedAt: number | null;
  endReason: string | null;
  /** "Street intake B" */
  label: string;
  toolpath: ToolpathFile | null;
  /** From the toolpath file's finished analysis; null while not analysed. */
  cycleTimeS: number | null;
};

/** The revision's toolpath: its first toolpath file (a revision normally carries one). */
export function toolpathOf(db: Reader, revisionId: number): ToolpathFile | null {
  return (
    db
      .select({
        fileId: storedFiles.id,
        storageKey: storedFiles.storageKey,
        sha256: storedFiles.sha256,
        sizeBytes: storedFiles.sizeBytes,
        originalName: storedFiles.originalName,
        contentType: storedFiles.contentType,
        state: storedFiles.state,
      })
      .from(revisionFiles)
      .innerJoin(storedFiles, eq(storedFiles.id, revisionFiles.fileId))
      .where(and(eq(revisionFiles.revisionId, revisionId), eq(revisionFiles.role, "toolpath")))
      .orderBy(asc(revisionFiles.id))
      .limit(1)
      .get() ?? null
  );
}

/** Cycle time (s) of a file's latest finished toolpath analysis. */
export function cycleTimeOf(db: Reader, fileId: number): number | null {
  const row = db
    .select({ s: sql<number | null>`json_extract(${analyses.result}, '$.cycleTimeS')` })
    .from(analyses)
    .where(and(eq(analyses.fileId, fileId), eq(analyses.engine, "toolpath"), eq(analyses.state, "done")))
    .orderBy(sql`${analyses.id} desc`)
    .limit(1)
    .get();
  const s = row?.s;
  return typeof s === "number" && Number.isFinite(s) && s >= 0 ? s : null;
}

export function revisionSummary(db: Reader, revisionId: number): RevisionSummary | null {
  const row = db
    .select({
      id: revisions.id,
      letter: revisions.letter,
      state: revisions.state,
      programId: programs.id,
      programName: programs.name,
      port: programs.port,
      headTypeId: programs.headTypeId,
      releasedAt: revisions.releasedAt,
      endReason: revisions.endReason,
    })
    .from(revisions)
    .innerJoin(programs, eq(programs.id, revisions.programId))
    .where(eq(revisions.id, revisionId))
    .get();
  if (!row) return null;
  const toolpath = toolpathOf(db, row.id);
  return { ...row, label: `${row.programName} ${row.letter}`, toolpath, cycleTimeS: toolpath ? cycleTimeOf(db, toolpath.fileId) : null };
}

export type RevisionChoice = { id: number; label: string; letter: string; programName: string; state: RevisionState; releasedAt: number | null };

/** Every revision of the head type's programs for a port, released first; the form disables the rest. */
export function revisionChoices(db: Reader, headTypeId: number, port: Port): RevisionChoice[] {
  return db
    .select({ id: revisions.id, letter: revisions.letter, programName: programs.name, state: revisions.state, releasedAt: revisions.releasedAt })
    .from(revisions)
    .innerJoin(programs, eq(programs.id, revisions.programId))
    .where(and(eq(programs.headTypeId, headTypeId), eq(programs.port, port)))
    .orderBy(sql`${revisions.state} = 'released' desc`, asc(programs.name), asc(revisions.letter))
    .all()
    .map((r) => ({ ...r, label: `${r.programName} ${r.letter}` }));
}

// ─── The job list ───────────────────────────────────────────────────────────

const ir = alias(revisions, "ir");
const er = alias(revisions, "er");
const ip = alias(programs, "ip");
const ep = alias(programs, "ep");

/** True when a port the open job cuts uses a revision that has since been superseded or withdrawn. */
const flaggedSql = sql<number>`(${jobs.state} in ('quoted','scheduled','on_machine','in_inspection') and (
  (${jobs.cutIntake} = 1 and ${ir.state} in ('superseded','withdrawn')) or
  (${jobs.cutExhaust} = 1 and ${er.state} in ('superseded','withdrawn'))))`;

const headCountSql = sql<number>`(select count(*) from heads h where h.job_id = "jobs"."id" and h.state != 'scrapped')`;

const listColumns = {
  id: jobs.id,
  number: jobs.number,
  state: jobs.state,
  customerId: jobs.customerId,
  customerName: customers.name,
  headTypeId: jobs.headTypeId,
  castingNumber: headTypes.castingNumber,
  quantity: jobs.quantity,
  cutIntake: jobs.cutIntake,
  cutExhaust: jobs.cutExhaust,
  intakeRevisionId: jobs.intakeRevisionId,
  intakeRevisionLabel: sql<string | null>`case when ${ir.id} is null then null else ${ip.name} || ' ' || ${ir.letter} end`,
  intakeRevisionState: ir.state,
  exhaustRevisionId: jobs.exhaustRevisionId,
  exhaustRevisionLabel: sql<string | null>`case when ${er.id} is null then null else ${ep.name} || ' ' || ${er.letter} end`,
  exhaustRevisionState: er.state,
  machineId: jobs.machineId,
  machineName: machines.name,
  dueOn: jobs.dueOn,
  setupMinutes: jobs.setupMinutes,
  portsPerHead: jobs.portsPerHead,
  notes: jobs.notes,
  heads: headCountSql,
  flagged: flaggedSql,
  createdAt: jobs.createdAt,
  updatedAt: jobs.updatedAt,
};

export type JobRow = {
  id: number;
  number: string;
  state: JobState;
  customerId: number;
  customerName: string;
  headTypeId: number;
  castingNumber: string;
  quantity: number;
  cutIntake: boolean;
  cutExhaust: boolean;
  intakeRevisionId: number | null;
  intakeRevisionLabel: string | null;
  intakeRevisionState: RevisionState | null;
  exhaustRevisionId: number | null;
  exhaustRevisionLabel: string | null;
  exhaustRevisionState: RevisionState | null;
  machineId: number | null;
  machineName: string | null;
  dueOn: string | null;
  setupMinutes: number;
  portsPerHead: number | null;
  notes: string;
  heads: number;
  flagged: boolean;
  createdAt: number;
  updatedAt: number;
};

function jobSelect(db: Reader) {
  return db
    .select(listColumns)
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(headTypes, eq(headTypes.id, jobs.headTypeId))
    .leftJoin(machines, eq(machines.id, jobs.machineId))
    .leftJoin(ir, eq(ir.id, jobs.intakeRevisionId))
    .leftJoin(ip, eq(ip.id, ir.programId))
    .leftJoin(er, eq(er.id, jobs.exhaustRevisionId))
    .leftJoin(ep, eq(ep.id, er.programId));
}

const toRow = (r: Omit<JobRow, "flagged"> & { flagged: number | boolean }): JobRow => ({ ...r, flagged: Boolean(r.flagged), heads: Number(r.heads) });

const sortable = {
  number: jobs.number,
  state: jobs.state,
  customerName: customers.name,
  castingNumber: headTypes.castingNumber,
  quantity: jobs.quantity,
  machineName: machines.name,
  dueOn: jobs.dueOn,
  heads: headCountSql,
  flagged: flaggedSql,
  createdAt: jobs.createdAt,
};

export type JobListQuery = TableQuery & {
  state?: JobState | "open";
  customerId?: number;
  revisionId?: number;
  flagged?: boolean;
};

export function listJobs(db: Db, query: JobListQuery): Page<JobRow> {
  const conditions: Array<SQL | undefined> = [
    query.q
      ? or(like(jobs.number, likePattern(query.q)), like(customers.name, likePattern(query.q)), like(headTypes.castingNumber, likePattern(query.q)))
      : undefined,
    query.state === "open" ? inArray(jobs.state, [...OPEN]) : query.state ? eq(jobs.state, query.state) : undefined,
    query.customerId ? eq(jobs.customerId, query.customerId) : undefined,
    query.revisionId ? or(eq(jobs.intakeRevisionId, query.revisionId), eq(jobs.exhaustRevisionId, query.revisionId)) : undefined,
    query.flagged ? sql`${flaggedSql} = 1` : undefined,
  ];
  const where = and(...conditions);
  const rows = jobSelect(db)
    .where(where)
    .orderBy(...orderFor(query, sortable, "number"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db
    .select({ n: count() })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(headTypes, eq(headTypes.id, jobs.headTypeId))
    .leftJoin(ir, eq(ir.id, jobs.intakeRevisionId))
    .leftJoin(er, eq(er.id, jobs.exhaustRevisionId))
    .where(where)
    .get()!.n;
  return pageOf(rows.map(toRow), total, query);
}

export function getJobRow(db: Reader, id: number): JobRow | null {
  const row = jobSelect(db).where(eq(jobs.id, id)).get();
  return row ? toRow(row) : null;
}

export function getJobRowByNumber(db: Reader, number: string): JobRow | null {
  const row = jobSelect(db).where(eq(jobs.number, number.trim().toUpperCase())).get();
  return row ? toRow(row) : null;
}

/** Open jobs whose intake or exhaust port (one they cut) uses the revision. */
export function openJobsUsingRevision(db: Reader, revisionId: number): JobRow[] {
  return jobSelect(db)
    .where(
      and(
        inArray(jobs.state, [...OPEN]),
        or(and(eq(jobs.intakeRevisionId, revisionId), eq(jobs.cutIntake, true)), and(eq(jobs.exhaustRevisionId, revisionId), eq(jobs.cutExhaust, true))),
      ),
    )
    .orderBy(asc(jobs.number))
    .all()
    .map(toRow);
}

/** Every open job, for the schedule (a shop has tens to hundreds of these, not thousands). */
export function openJobs(db: Reader): JobRow[] {
  return jobSelect(db).where(inArray(jobs.state, [...OPEN])).orderBy(asc(jobs.dueOn), asc(jobs.number)).all().map(toRow);
}

export const ENDED_REVISION_STATES: readonly RevisionState[] = ENDED;

/** The next free number of the form J-<year>-<nnn>. */
export function nextJobNumber(db: Reader, now = Date.now()): string {
  const year = new Date(now).getUTCFullYear();
  const prefix = `J-${year}-`;
  const rows = db.select({ number: jobs.number }).from(jobs).where(like(jobs.number, `${prefix}%`)).all();
  const max = rows.reduce((m, r) => Math.max(m, Number(r.number.slice(prefix.length)) || 0), 0);
  return `${prefix}${String(max + 1).padStart(3, "0")}`;
}

/** Small lists for the job form's selects. */
export function jobFormOptions(db: Reader) {
  return {
    customers: db.select({ id: customers.id, name: customers.name }).from(customers).orderBy(asc(customers.name)).all(),
    headTypes: db
      .select({ id: headTypes.id, castingNumber: headTypes.castingNumber, engineFamily: headTypes.engineFamily, cylinders: headTypes.cylinders })
      .from(headTypes)
      .orderBy(asc(headTypes.castingNumber))
      .all(),
    machines: db.select({ id: machines.id, name: machines.name }).from(machines).where(eq(machines.active, true)).orderBy(asc(machines.name)).all(),
  };
}
