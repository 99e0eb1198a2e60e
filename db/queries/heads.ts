/** Reads for production heads: the list across jobs and one head with its job and cuts. */
import { and, count, eq, inArray, like, or, sql, type SQL } from "drizzle-orm";
import type { Db } from "../client";
import { customers, flowTests, headTypes, heads, jobs } from "../schema";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { likePattern, offsetFor, orderFor } from "./paging";

const cutsSql = sql<number>`(select count(*) from cuts c where c.head_id = "heads"."id")`;
const lastCutSql = sql<number | null>`(select max(c.started_at) from cuts c where c.head_id = "heads"."id")`;

const columns = {
  id: heads.id,
  serial: heads.serial,
  castingNumber: heads.castingNumber,
  headTypeId: heads.headTypeId,
  engineFamily: headTypes.engineFamily,
  source: heads.source,
  state: heads.state,
  incomingNotes: heads.incomingNotes,
  jobId: heads.jobId,
  jobNumber: jobs.number,
  customerId: customers.id,
  customerName: customers.name,
  cuts: cutsSql,
  lastCutAt: lastCutSql,
  createdAt: heads.createdAt,
};

export type HeadRow = {
  id: number;
  serial: string;
  castingNumber: string;
  headTypeId: number;
  engineFamily: string;
  source: "customer_core" | "shop_stock";
  state: "received" | "cutting" | "cut" | "scrapped" | "shipped";
  incomingNotes: string;
  jobId: number | null;
  jobNumber: string | null;
  customerId: number | null;
  customerName: string | null;
  cuts: number;
  lastCutAt: number | null;
  createdAt: number;
};

const sortable = {
  serial: heads.serial,
  castingNumber: heads.castingNumber,
  source: heads.source,
  state: heads.state,
  jobNumber: jobs.number,
  customerName: customers.name,
  cuts: cutsSql,
  lastCutAt: lastCutSql,
  createdAt: heads.createdAt,
};

function base(db: Db) {
  return db
    .select(columns)
    .from(heads)
    .innerJoin(headTypes, eq(headTypes.id, heads.headTypeId))
    .leftJoin(jobs, eq(jobs.id, heads.jobId))
    .leftJoin(customers, eq(customers.id, jobs.customerId));
}

export type HeadListQuery = TableQuery & { jobId?: number; customerId?: number; state?: HeadRow["state"] };

export function listHeads(db: Db, query: HeadListQuery): Page<HeadRow> {
  const conditions: Array<SQL | undefined> = [
    query.q
      ? or(like(heads.serial, likePattern(query.q)), like(heads.castingNumber, likePattern(query.q)), like(jobs.number, likePattern(query.q)), like(customers.name, likePattern(query.q)))
      : undefined,
    query.jobId ? eq(heads.jobId, query.jobId) : undefined,
    query.customerId ? eq(jobs.customerId, query.customerId) : undefined,
    query.state ? eq(heads.state, query.state) : undefined,
  ];
  const where = and(...conditions);
  const rows = base(db)
    .where(where)
    .orderBy(...orderFor(query, sortable, "serial"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db
    .select({ n: count() })
    .from(heads)
    .leftJoin(jobs, eq(jobs.id, heads.jobId))
    .leftJoin(customers, eq(customers.id, jobs.customerId))
    .where(where)
    .get()!.n;
  return pageOf(rows.map((r) => ({ ...r, cuts: Number(r.cuts) })), total, query);
}

export function getHead(db: Db, id: number): HeadRow | null {
  return base(db).where(eq(heads.id, id)).get() ?? null;
}

export function getHeadBySerial(db: Db, serial: string): HeadRow | null {
  return base(db).where(eq(heads.serial, serial.trim())).get() ?? null;
}

/** Heads of one job, in serial order, for the job page's cut log. */
export function headsOfJob(db: Db, jobId: number): HeadRow[] {
  return base(db).where(eq(heads.jobId, jobId)).orderBy(heads.serial).all();
}

/** Flow tests recorded on these heads, for linking a cut to its post-cut test. */
export function flowTestsOfHeads(db: Db, headIds: number[]) {
  if (headIds.length === 0) return [];
  return db
    .select({ id: flowTests.id, headId: flowTests.headId, port: flowTests.port, testedOn: flowTests.testedOn })
    .from(flowTests)
    .where(inArray(flowTests.headId, headIds))
    .orderBy(flowTests.testedOn)
    .all()
    .map((t) => ({ id: t.id, headId: t.headId!, label: `#${t.id} ${t.port}, ${t.testedOn}` }));
}
