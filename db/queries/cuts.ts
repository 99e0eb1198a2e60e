/** Reads for cuts: the cut log (by job, head, revision or machine) with the names a person reads. */
import { and, asc, count, eq, like, or, sql, type SQL } from "drizzle-orm";
import type { Db } from "../client";
import { customers, cuts, heads, jobs, machines, programs, revisions, users, type Port } from "../schema";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { likePattern, offsetFor, orderFor } from "./paging";

const columns = {
  id: cuts.id,
  headId: cuts.headId,
  headSerial: heads.serial,
  jobId: cuts.jobId,
  jobNumber: jobs.number,
  customerName: customers.name,
  port: cuts.port,
  cylinder: cuts.cylinder,
  revisionId: cuts.revisionId,
  revisionLabel: sql<string>`${programs.name} || ' ' || ${revisions.letter}`,
  revisionState: revisions.state,
  toolpathSha256: cuts.toolpathSha256,
  machineId: cuts.machineId,
  machineName: machines.name,
  operatorId: cuts.operatorId,
  operatorName: users.name,
  startedAt: cuts.startedAt,
  endedAt: cuts.endedAt,
  outcome: cuts.outcome,
  reason: cuts.reason,
  notes: cuts.notes,
  flowTestId: cuts.flowTestId,
};

export type CutRow = {
  id: number;
  headId: number;
  headSerial: string;
  jobId: number;
  jobNumber: string;
  customerName: string;
  port: Port;
  cylinder: number | null;
  revisionId: number;
  revisionLabel: string;
  revisionState: "draft" | "proving" | "released" | "superseded" | "withdrawn";
  toolpathSha256: string;
  machineId: number;
  machineName: string;
  operatorId: number;
  operatorName: string;
  startedAt: number;
  endedAt: number | null;
  outcome: "good" | "rework" | "scrap";
  reason: string | null;
  notes: string;
  flowTestId: number | null;
};

function base(db: Db) {
  return db
    .select(columns)
    .from(cuts)
    .innerJoin(heads, eq(heads.id, cuts.headId))
    .innerJoin(jobs, eq(jobs.id, cuts.jobId))
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(revisions, eq(revisions.id, cuts.revisionId))
    .innerJoin(programs, eq(programs.id, revisions.programId))
    .innerJoin(machines, eq(machines.id, cuts.machineId))
    .innerJoin(users, eq(users.id, cuts.operatorId));
}

const sortable = {
  startedAt: cuts.startedAt,
  headSerial: heads.serial,
  jobNumber: jobs.number,
  customerName: customers.name,
  port: cuts.port,
  revisionLabel: sql`${programs.name} || ' ' || ${revisions.letter}`,
  machineName: machines.name,
  operatorName: users.name,
  outcome: cuts.outcome,
};

export type CutListQuery = TableQuery & { jobId?: number; headId?: number; revisionId?: number; machineId?: number; outcome?: CutRow["outcome"] };

function whereOf(query: CutListQuery) {
  const conditions: Array<SQL | undefined> = [
    query.q
      ? or(like(heads.serial, likePattern(query.q)), like(jobs.number, likePattern(query.q)), like(customers.name, likePattern(query.q)), like(cuts.reason, likePattern(query.q)))
      : undefined,
    query.jobId ? eq(cuts.jobId, query.jobId) : undefined,
    query.headId ? eq(cuts.headId, query.headId) : undefined,
    query.revisionId ? eq(cuts.revisionId, query.revisionId) : undefined,
    query.machineId ? eq(cuts.machineId, query.machineId) : undefined,
    query.outcome ? eq(cuts.outcome, query.outcome) : undefined,
  ];
  return and(...conditions);
}

export function listCuts(db: Db, query: CutListQuery): Page<CutRow> {
  const where = whereOf(query);
  const rows = base(db)
    .where(where)
    .orderBy(...orderFor(query, sortable, "startedAt"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db
    .select({ n: count() })
    .from(cuts)
    .innerJoin(heads, eq(heads.id, cuts.headId))
    .innerJoin(jobs, eq(jobs.id, cuts.jobId))
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .where(where)
    .get()!.n;
  return pageOf(rows, total, query);
}

export function getCut(db: Db, id: number): CutRow | null {
  return base(db).where(eq(cuts.id, id)).get() ?? null;
}

/** All cuts of one head, oldest first (a head has a handful). */
export function cutsOfHead(db: Db, headId: number): CutRow[] {
  return base(db).where(eq(cuts.headId, headId)).orderBy(asc(cuts.startedAt), asc(cuts.id)).all();
}

/** All cuts of one job, oldest first, for the job page's per-head log. */
export function cutsOfJob(db: Db, jobId: number): CutRow[] {
  return base(db).where(eq(cuts.jobId, jobId)).orderBy(asc(cuts.startedAt), asc(cuts.id)).all();
}
