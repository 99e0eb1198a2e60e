/**
 * Traceability reads for the auditor: from a revision to every head it cut (the recall list),
 * from a head back to the master it descends from, and from a customer to the revisions that
 * cut their heads. The recall list is read in id-ordered batches, so an export of any size runs
 * in constant memory.
 */
import { and, asc, eq, gt, inArray, or, sql } from "drizzle-orm";
import type { Db } from "../client";
import {
  customers,
  cuts,
  fixturePlates,
  flowPoints,
  flowTests,
  headTypes,
  heads,
  jobs,
  machines,
  masterHeads,
  programs,
  revisions,
  scans,
  users,
} from "../schema";
import { revisionSummary, toolpathOf, type RevisionSummary } from "./jobs";

// ─── By revision ────────────────────────────────────────────────────────────

export type RevisionTraceHeader = RevisionSummary & {
  castingNumber: string;
  releasedByName: string | null;
  parentLabel: string | null;
  sourceScanId: number | null;
};

export function revisionTraceHeader(db: Db, revisionId: number): RevisionTraceHeader | null {
  const summary = revisionSummary(db, revisionId);
  if (!summary) return null;
  const extra = db
    .select({ castingNumber: headTypes.castingNumber, releasedByName: users.name, parentId: revisions.parentId, sourceScanId: revisions.sourceScanId })
    .from(revisions)
    .innerJoin(programs, eq(programs.id, revisions.programId))
    .innerJoin(headTypes, eq(headTypes.id, programs.headTypeId))
    .leftJoin(users, eq(users.id, revisions.releasedById))
    .where(eq(revisions.id, revisionId))
    .get()!;
  const parent = extra.parentId ? revisionSummary(db, extra.parentId) : null;
  return { ...summary, castingNumber: extra.castingNumber, releasedByName: extra.releasedByName, parentLabel: parent?.label ?? null, sourceScanId: extra.sourceScanId };
}

/** One line of the recall list: a cut made with the revision, and whom to call about it. */
export type RecallRow = {
  cutId: number;
  cutAt: number;
  endedAt: number | null;
  port: "intake" | "exhaust";
  cylinder: number | null;
  outcome: "good" | "rework" | "scrap";
  reason: string | null;
  toolpathSha256: string;
  headId: number;
  headSerial: string;
  castingNumber: string;
  headState: string;
  headSource: string;
  jobId: number;
  jobNumber: string;
  jobState: string;
  customerId: number;
  customerName: string;
  contactName: string;
  customerEmail: string;
  customerPhone: string;
  machineName: string;
  operatorName: string;
};

const recallColumns = {
  cutId: cuts.id,
  cutAt: cuts.startedAt,
  endedAt: cuts.endedAt,
  port: cuts.port,
  cylinder: cuts.cylinder,
  outcome: cuts.outcome,
  reason: cuts.reason,
  toolpathSha256: cuts.toolpathSha256,
  headId: heads.id,
  headSerial: heads.serial,
  castingNumber: heads.castingNumber,
  headState: heads.state,
  headSource: heads.source,
  jobId: jobs.id,
  jobNumber: jobs.number,
  jobState: jobs.state,
  customerId: customers.id,
  customerName: customers.name,
  contactName: customers.contactName,
  customerEmail: customers.email,
  customerPhone: customers.phone,
  machineName: machines.name,
  operatorName: users.name,
};

function recallBase(db: Db) {
  return db
    .select(recallColumns)
    .from(cuts)
    .innerJoin(heads, eq(heads.id, cuts.headId))
    .innerJoin(jobs, eq(jobs.id, cuts.jobId))
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(machines, eq(machines.id, cuts.machineId))
    .innerJoin(users, eq(users.id, cuts.operatorId));
}

/** Every cut made with the revision, in cut order, fetched `batch` rows at a time. */
export function* recallRows(db: Db, revisionId: number, batch = 500): Generator<RecallRow> {
  let after = 0;
  for (;;) {
    const rows = recallBase(db)
      .where(and(eq(cuts.revisionId, revisionId), gt(cuts.id, after)))
      .orderBy(asc(cuts.id))
      .limit(batch)
      .all();
    yield* rows;
    if (rows.length < batch) return;
    after = rows[rows.length - 1]!.cutId;
  }
}

export type RevisionJobRow = { id: number; number: string; state: string; customerName: string; ports: string; heads: number; cutsWithRevision: number };

/** Jobs that chose the revision or cut a head with it. */
export function jobsOfRevision(db: Db, revisionId: number): RevisionJobRow[] {
  const cutsWith = sql<number>`(select count(*) from cuts c where c.job_id = "jobs"."id" and c.revision_id = ${revisionId})`;
  return db
    .select({
      id: jobs.id,
      number: jobs.number,
      state: jobs.state,
      customerName: customers.name,
      ports: sql<string>`trim((case when ${jobs.intakeRevisionId} = ${revisionId} then 'intake ' else '' end) || (case when ${jobs.exhaustRevisionId} = ${revisionId} then 'exhaust' else '' end))`,
      heads: sql<number>`(select count(*) from heads h where h.job_id = "jobs"."id")`,
      cutsWithRevision: cutsWith,
    })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .where(or(eq(jobs.intakeRevisionId, revisionId), eq(jobs.exhaustRevisionId, revisionId), sql`${cutsWith} > 0`))
    .orderBy(asc(jobs.number))
    .all();
}

export type RevisionOption = { id: number; label: string; state: string; castingNumber: string; port: string; cuts: number };

/** Revisions that were released at some point (the ones that can have cut heads), for the trace picker. */
export function traceableRevisions(db: Db): RevisionOption[] {
  return db
    .select({
      id: revisions.id,
      label: sql<string>`${programs.name} || ' ' || ${revisions.letter}`,
      state: revisions.state,
      castingNumber: headTypes.castingNumber,
      port: programs.port,
      cuts: sql<number>`(select count(*) from cuts c where c.revision_id = "revisions"."id")`,
    })
    .from(revisions)
    .innerJoin(programs, eq(programs.id, revisions.programId))
    .innerJoin(headTypes, eq(headTypes.id, programs.headTypeId))
    .where(inArray(revisions.state, ["released", "superseded", "withdrawn"]))
    .orderBy(asc(headTypes.castingNumber), asc(programs.name), asc(revisions.letter))
    .all();
}

// ─── By head ────────────────────────────────────────────────────────────────

export type FlowTestTrace = {
  id: number;
  subject: string;
  port: "intake" | "exhaust";
  testedOn: string;
  depressionInH2O: number;
  valveDiameterMm: number;
  tempC: number | null;
  baroKpa: number | null;
  rhPct: number | null;
  masterId: number | null;
  revisionId: number | null;
  headId: number | null;
  points: Array<{ lift: number; flow: number }>;
};

export function flowTestsFor(db: Db, by: { headId?: number; revisionIds?: number[]; masterIds?: number[] }): FlowTestTrace[] {
  const conditions = [
    by.headId ? eq(flowTests.headId, by.headId) : undefined,
    by.revisionIds?.length ? inArray(flowTests.revisionId, by.revisionIds) : undefined,
    by.masterIds?.length ? inArray(flowTests.masterId, by.masterIds) : undefined,
  ].filter(Boolean);
  if (conditions.length === 0) return [];
  const tests = db
    .select({
      id: flowTests.id,
      subject: flowTests.subject,
      port: flowTests.port,
      testedOn: flowTests.testedOn,
      depressionInH2O: flowTests.depressionInH2O,
      valveDiameterMm: flowTests.valveDiameterMm,
      tempC: flowTests.tempC,
      baroKpa: flowTests.baroKpa,
      rhPct: flowTests.rhPct,
      masterId: flowTests.masterId,
      revisionId: flowTests.revisionId,
      headId: flowTests.headId,
    })
    .from(flowTests)
    .where(or(...conditions))
    .orderBy(asc(flowTests.testedOn), asc(flowTests.id))
    .all();
  return tests.map((t) => ({
    ...t,
    points: db.select({ lift: flowPoints.liftMm, flow: flowPoints.flowCfm }).from(flowPoints).where(eq(flowPoints.flowTestId, t.id)).orderBy(asc(flowPoints.liftMm)).all(),
  }));
}

export type RevisionLineage = {
  revision: RevisionSummary;
  /** The toolpath's checksum now (a released file never changes, so it should equal every cut's). */
  currentSha256: string | null;
  scan: { id: number; scannedOn: string; port: string; plateCode: string; machineName: string; stylusDiameterMm: number; pointSpacingMm: number } | null;
  master: { id: number; label: string; stage: string; porterName: string | null } | null;
};

export function revisionLineage(db: Db, revisionId: number): RevisionLineage | null {
  const revision = revisionSummary(db, revisionId);
  if (!revision) return null;
  const link = db.select({ sourceScanId: revisions.sourceScanId }).from(revisions).where(eq(revisions.id, revisionId)).get()!;
  const scanRow = link.sourceScanId
    ? db
        .select({
          id: scans.id,
          scannedOn: scans.scannedOn,
          port: scans.port,
          plateCode: fixturePlates.code,
          machineName: machines.name,
          stylusDiameterMm: scans.stylusDiameterMm,
          pointSpacingMm: scans.pointSpacingMm,
          masterId: scans.masterId,
        })
        .from(scans)
        .innerJoin(fixturePlates, eq(fixturePlates.id, scans.plateId))
        .innerJoin(machines, eq(machines.id, scans.machineId))
        .where(eq(scans.id, link.sourceScanId))
        .get()
    : undefined;
  const master = scanRow
    ? (db
        .select({ id: masterHeads.id, label: masterHeads.label, stage: masterHeads.stage, porterName: users.name })
        .from(masterHeads)
        .leftJoin(users, eq(users.id, masterHeads.porterId))
        .where(eq(masterHeads.id, scanRow.masterId))
        .get() ?? null)
    : null;
  const scan = scanRow
    ? { id: scanRow.id, scannedOn: scanRow.scannedOn, port: scanRow.port, plateCode: scanRow.plateCode, machineName: scanRow.machineName, stylusDiameterMm: scanRow.stylusDiameterMm, pointSpacingMm: scanRow.pointSpacingMm }
    : null;
  return { revision, currentSha256: toolpathOf(db, revisionId)?.sha256 ?? null, scan, master };
}

// ─── By customer ────────────────────────────────────────────────────────────

export type CustomerTraceRow = {
  headId: number;
  headSerial: string;
  castingNumber: string;
  headState: string;
  jobId: number;
  jobNumber: string;
  revisionId: number | null;
  revisionLabel: string | null;
  revisionState: string | null;
  port: string | null;
  cuts: number;
  lastCutAt: number | null;
  outcomes: string | null;
};

/** Each head of the customer with each revision that cut it (a head without cuts appears once). */
export function customerTrace(db: Db, customerId: number): CustomerTraceRow[] {
  return db
    .select({
      headId: heads.id,
      headSerial: heads.serial,
      castingNumber: heads.castingNumber,
      headState: heads.state,
      jobId: jobs.id,
      jobNumber: jobs.number,
      revisionId: cuts.revisionId,
      revisionLabel: sql<string | null>`case when ${revisions.id} is null then null else ${programs.name} || ' ' || ${revisions.letter} end`,
      revisionState: revisions.state,
      port: cuts.port,
      cuts: sql<number>`count(${cuts.id})`,
      lastCutAt: sql<number | null>`max(${cuts.startedAt})`,
      outcomes: sql<string | null>`group_concat(distinct ${cuts.outcome})`,
    })
    .from(heads)
    .innerJoin(jobs, eq(jobs.id, heads.jobId))
    .leftJoin(cuts, eq(cuts.headId, heads.id))
    .leftJoin(revisions, eq(revisions.id, cuts.revisionId))
    .leftJoin(programs, eq(programs.id, revisions.programId))
    .where(eq(jobs.customerId, customerId))
    .groupBy(heads.id, cuts.revisionId, cuts.port)
    .orderBy(asc(heads.serial), asc(cuts.port))
    .all();
}

