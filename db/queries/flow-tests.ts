/**
 * Reads of flow tests: the list (server-side sort, filter, paging), one test with its points and
 * the names of what it links to, points of several tests for overlays, and the choices the entry
 * form offers. The computed columns are not here: they come from the flow math (lib/flowtests).
 */
import { and, asc, count, desc, eq, inArray, like, ne, or, sql, type SQL } from "drizzle-orm";
import type { SQLiteSelect } from "drizzle-orm/sqlite-core";
import type { Db } from "../client";
import { cuts, flowPoints, flowTests, headTypes, heads, masterHeads, programs, revisions, users } from "../schema";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { likePattern, offsetFor, orderFor } from "./paging";

type Subject = (typeof flowTests.$inferSelect)["subject"];
type Port = (typeof flowTests.$inferSelect)["port"];

/** "Street intake · rev B": a revision named the way the shop says it. */
const revisionLabel = sql<string>`${programs.name} || ' · rev ' || ${revisions.letter}`;

/** Words for what was tested, in one column so it sorts and filters like the rest. */
const subjectLabel = sql<string>`CASE ${flowTests.subject}
  WHEN 'master' THEN coalesce(${masterHeads.label}, 'master #' || ${flowTests.masterId})
  WHEN 'revision' THEN coalesce(${revisionLabel}, 'revision #' || ${flowTests.revisionId})
  WHEN 'head' THEN coalesce(${heads.serial}, 'head #' || ${flowTests.headId})
  ELSE 'Stock baseline' END`;

const pointCount = sql<number>`(SELECT count(*) FROM ${flowPoints} WHERE ${flowPoints.flowTestId} = ${flowTests.id})`;
const maxLiftMm = sql<number | null>`(SELECT max(${flowPoints.liftMm}) FROM ${flowPoints} WHERE ${flowPoints.flowTestId} = ${flowTests.id})`;

const listColumns = {
  id: flowTests.id,
  testedOn: flowTests.testedOn,
  subject: flowTests.subject,
  subjectLabel,
  port: flowTests.port,
  cylinder: flowTests.cylinder,
  portNumber: flowTests.portNumber,
  headTypeId: flowTests.headTypeId,
  castingNumber: headTypes.castingNumber,
  masterId: flowTests.masterId,
  revisionId: flowTests.revisionId,
  headId: flowTests.headId,
  depressionInH2O: flowTests.depressionInH2O,
  valveDiameterMm: flowTests.valveDiameterMm,
  seatIdMm: flowTests.seatIdMm,
  minSectionMm2: flowTests.minSectionMm2,
  tempC: flowTests.tempC,
  baroKpa: flowTests.baroKpa,
  rhPct: flowTests.rhPct,
  entryRadius: flowTests.entryRadius,
  exhaustPipe: flowTests.exhaustPipe,
  operatorName: users.name,
  pointCount,
  maxLiftMm,
};

export type FlowTestListRow = {
  id: number;
  testedOn: string;
  subject: Subject;
  subjectLabel: string;
  port: Port;
  cylinder: number | null;
  portNumber: number | null;
  headTypeId: number;
  castingNumber: string | null;
  masterId: number | null;
  revisionId: number | null;
  headId: number | null;
  depressionInH2O: number;
  valveDiameterMm: number;
  seatIdMm: number | null;
  minSectionMm2: number | null;
  tempC: number | null;
  baroKpa: number | null;
  rhPct: number | null;
  entryRadius: boolean;
  exhaustPipe: boolean;
  operatorName: string | null;
  pointCount: number;
  maxLiftMm: number | null;
};

export type FlowTestFilters = {
  headTypeId?: number;
  masterId?: number;
  revisionId?: number;
  headId?: number;
  subject?: Subject;
  port?: Port;
};

const SORTABLE = {
  id: flowTests.id,
  testedOn: flowTests.testedOn,
  castingNumber: headTypes.castingNumber,
  subject: flowTests.subject,
  subjectLabel,
  port: flowTests.port,
  cylinder: flowTests.cylinder,
  depressionInH2O: flowTests.depressionInH2O,
  valveDiameterMm: flowTests.valveDiameterMm,
  operatorName: users.name,
  pointCount,
  maxLiftMm,
};
function filterWhere(query: TableQuery & FlowTestFilters): SQL | undefined {
  const text = query.q
    ? or(
        like(headTypes.castingNumber, likePattern(query.q)),
        like(masterHeads.label, likePattern(query.q)),
        like(heads.serial, likePattern(query.q)),
        like(programs.name, likePattern(query.q)),
        like(users.name, likePattern(query.q)),
        like(flowTests.notes, likePattern(query.q)),
        like(flowTests.testedOn, likePattern(query.q)),
      )
    : undefined;
  return and(
    text,
    query.headTypeId ? eq(flowTests.headTypeId, query.headTypeId) : undefined,
    query.masterId ? eq(flowTests.masterId, query.masterId) : undefined,
    query.revisionId ? eq(flowTests.revisionId, query.revisionId) : undefined,
    query.headId ? eq(flowTests.headId, query.headId) : undefined,
    query.subject ? eq(flowTests.subject, query.subject) : undefined,
    query.port ? eq(flowTests.port, query.port) : undefined,
  );
}

/** The tables the list shows and filters on, joined the same way for its rows and its count. */
function withListJoins<Q extends SQLiteSelect>(query: Q) {
  return query
    .leftJoin(headTypes, eq(headTypes.id, flowTests.headTypeId))
    .leftJoin(masterHeads, eq(masterHeads.id, flowTests.masterId))
    .leftJoin(revisions, eq(revisions.id, flowTests.revisionId))
    .leftJoin(programs, eq(programs.id, revisions.programId))
    .leftJoin(heads, eq(heads.id, flowTests.headId))
    .leftJoin(users, eq(users.id, flowTests.operatorId));
}

export function listFlowTests(db: Db, query: TableQuery & FlowTestFilters): Page<FlowTestListRow> {
  const where = filterWhere(query);
  const order = orderFor(query, SORTABLE, "testedOn");
  const rows = withListJoins(db.select(listColumns).from(flowTests).$dynamic())
    .where(where)
    // Ties (same day) show the latest recorded first, whatever the direction.
    .orderBy(...order, desc(flowTests.id))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = withListJoins(db.select({ n: count() }).from(flowTests).$dynamic()).where(where).get()!.n;
  return pageOf(rows as FlowTestListRow[], total, query);
}

export type FlowTestRow = typeof flowTests.$inferSelect;
export type FlowPointRow = { liftMm: number; flowCfm: number };

export type FlowTestDetail = FlowTestRow & {
  castingNumber: string | null;
  engineFamily: string | null;
  cylinders: number | null;
  boreMm: number | null;
  strokeMm: number | null;
  masterLabel: string | null;
  revisionLabel: string | null;
  revisionState: string | null;
  programId: number | null;
  headSerial: string | null;
  operatorName: string | null;
  subjectLabel: string;
  points: FlowPointRow[];
};

/** Points of several tests, by test id, in lift order. */
export function pointsOf(db: Db, ids: number[]): Map<number, FlowPointRow[]> {
  const out = new Map<number, FlowPointRow[]>(ids.map((id) => [id, []]));
  if (ids.length === 0) return out;
  const rows = db
    .select({ flowTestId: flowPoints.flowTestId, liftMm: flowPoints.liftMm, flowCfm: flowPoints.flowCfm })
    .from(flowPoints)
    .where(inArray(flowPoints.flowTestId, ids))
    .orderBy(asc(flowPoints.flowTestId), asc(flowPoints.liftMm))
    .all();
  for (const r of rows) out.get(r.flowTestId)?.push({ liftMm: r.liftMm, flowCfm: r.flowCfm });
  return out;
}

function detailsWhere(db: Db, where: SQL | undefined, limit?: number, newestFirst = false): Array<Omit<FlowTestDetail, "points">> {
  const query = db
    .select({
      test: flowTests,
      castingNumber: headTypes.castingNumber,
      engineFamily: headTypes.engineFamily,
      cylinders: headTypes.cylinders,
      boreMm: headTypes.boreMm,
      strokeMm: headTypes.strokeMm,
      masterLabel: masterHeads.label,
      revisionLabel,
      revisionState: revisions.state,
      programId: revisions.programId,
      headSerial: heads.serial,
      operatorName: users.name,
      subjectLabel,
    })
    .from(flowTests)
    .leftJoin(headTypes, eq(headTypes.id, flowTests.headTypeId))
    .leftJoin(masterHeads, eq(masterHeads.id, flowTests.masterId))
    .leftJoin(revisions, eq(revisions.id, flowTests.revisionId))
    .leftJoin(programs, eq(programs.id, revisions.programId))
    .leftJoin(heads, eq(heads.id, flowTests.headId))
    .leftJoin(users, eq(users.id, flowTests.operatorId))
    .where(where)
    .orderBy(newestFirst ? desc(flowTests.testedOn) : asc(flowTests.id), desc(flowTests.id));
  const rows = limit ? query.limit(limit).all() : query.all();
  return rows.map(({ test, ...rest }) => ({ ...test, ...rest, revisionLabel: rest.revisionLabel ?? null }));
}

export function getFlowTest(db: Db, id: number): FlowTestDetail | undefined {
  const [row] = detailsWhere(db, eq(flowTests.id, id));
  if (!row) return undefined;
  return { ...row, points: pointsOf(db, [id]).get(id) ?? [] };
}

/** Several tests with their points, in the order the ids were given (unknown ids are skipped). */
export function getFlowTests(db: Db, ids: number[]): FlowTestDetail[] {
  if (ids.length === 0) return [];
  const rows = detailsWhere(db, inArray(flowTests.id, ids));
  const points = pointsOf(db, ids);
  const byId = new Map(rows.map((r) => [r.id, { ...r, points: points.get(r.id) ?? [] }]));
  return ids.map((id) => byId.get(id)).filter((r): r is FlowTestDetail => r !== undefined);
}

/** Other tests of the same casting and port, newest first: what a test page offers to overlay. */
export function relatedFlowTests(db: Db, test: { id: number; headTypeId: number; port: Port }, limit = 12): FlowTestDetail[] {
  const rows = detailsWhere(db, and(eq(flowTests.headTypeId, test.headTypeId), eq(flowTests.port, test.port), ne(flowTests.id, test.id)), limit, true);
  const points = pointsOf(
    db,
    rows.map((r) => r.id),
  );
  return rows.map((r) => ({ ...r, points: points.get(r.id) ?? [] }));
}

/** Cuts that name this test as their post-cut flow test. */
export function cutsLinkedTo(db: Db, flowTestId: number): number {
  return db.select({ n: count() }).from(cuts).where(eq(cuts.flowTestId, flowTestId)).get()!.n;
}

// ─── Choices for the entry form ─────────────────────────────────────────────

export type SubjectOptions = {
  headTypes: Array<{
    id: number;
    castingNumber: string;
    engineFamily: string;
    cylinders: number;
    intakeValveMm: number;
    exhaustValveMm: number;
    intakeSeatIdMm: number | null;
    exhaustSeatIdMm: number | null;
  }>;
  masters: Array<{ id: number; label: string; stage: string }>;
  revisions: Array<{ id: number; label: string; port: Port; state: string }>;
  heads: Array<{ id: number; serial: string }>;
  operators: Array<{ id: number; name: string; role: string }>;
};

/** Head types always; masters, revisions and heads of the chosen head type (empty lists when none exist yet). */
export function flowSubjectOptions(db: Db, headTypeId?: number): SubjectOptions {
  const types = db
    .select({
      id: headTypes.id,
      castingNumber: headTypes.castingNumber,
      engineFamily: headTypes.engineFamily,
      cylinders: headTypes.cylinders,
      intakeValveMm: headTypes.intakeValveMm,
      exhaustValveMm: headTypes.exhaustValveMm,
      intakeSeatIdMm: headTypes.intakeSeatIdMm,
      exhaustSeatIdMm: headTypes.exhaustSeatIdMm,
    })
    .from(headTypes)
    .orderBy(asc(headTypes.castingNumber))
    .all();
  const operators = db
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(and(eq(users.active, true), inArray(users.role, ["porter", "machinist", "lead", "admin"])))
    .orderBy(asc(users.name))
    .all();
  if (!headTypeId) return { headTypes: types, masters: [], revisions: [], heads: [], operators };
  const masters = db
    .select({ id: masterHeads.id, label: masterHeads.label, stage: masterHeads.stage })
    .from(masterHeads)
    .where(eq(masterHeads.headTypeId, headTypeId))
    .orderBy(asc(masterHeads.label))
    .all();
  const revs = db
    .select({ id: revisions.id, label: revisionLabel, port: programs.port, state: revisions.state })
    .from(revisions)
    .innerJoin(programs, eq(programs.id, revisions.programId))
    .where(eq(programs.headTypeId, headTypeId))
    .orderBy(asc(programs.name), asc(revisions.letter))
    .all();
  const headRows = db
    .select({ id: heads.id, serial: heads.serial })
    .from(heads)
    .where(eq(heads.headTypeId, headTypeId))
    .orderBy(desc(heads.id))
    .limit(500)
    .all();
  return { headTypes: types, masters, revisions: revs, heads: headRows, operators };
}

/** Names of what a filtered list is about ("revision Street intake · rev B"), for the page heading. */
export function filterLabels(db: Db, filters: FlowTestFilters): string[] {
  const out: string[] = [];
  if (filters.headTypeId) {
    const t = db.select({ c: headTypes.castingNumber }).from(headTypes).where(eq(headTypes.id, filters.headTypeId)).get();
    out.push(`casting ${t?.c ?? `#${filters.headTypeId}`}`);
  }
  if (filters.masterId) {
    const m = db.select({ l: masterHeads.label }).from(masterHeads).where(eq(masterHeads.id, filters.masterId)).get();
    out.push(`master ${m?.l ?? `#${filters.masterId}`}`);
  }
  if (filters.revisionId) {
    const r = db.select({ l: revisionLabel }).from(revisions).innerJoin(programs, eq(programs.id, revisions.programId)).where(eq(revisions.id, filters.revisionId)).get();
    out.push(`revision ${r?.l ?? `#${filters.revisionId}`}`);
  }
  if (filters.headId) {
    const h = db.select({ s: heads.serial }).from(heads).where(eq(heads.id, filters.headId)).get();
    out.push(`head ${h?.s ?? `#${filters.headId}`}`);
  }
  if (filters.subject) out.push(`subject ${filters.subject}`);
  if (filters.port) out.push(`${filters.port} ports`);
  return out;
}

/** The casting (and for a revision, the port) a linked record belongs to, to pre-fill a new test. */
export function linkedHeadType(db: Db, link: { masterId?: number; revisionId?: number; headId?: number }): { headTypeId: number; port?: Port } | undefined {
  if (link.revisionId) {
    return db
      .select({ headTypeId: programs.headTypeId, port: programs.port })
      .from(revisions)
      .innerJoin(programs, eq(programs.id, revisions.programId))
      .where(eq(revisions.id, link.revisionId))
      .get();
  }
  if (link.masterId) return db.select({ headTypeId: masterHeads.headTypeId }).from(masterHeads).where(eq(masterHeads.id, link.masterId)).get();
  if (link.headId) return db.select({ headTypeId: heads.headTypeId }).from(heads).where(eq(heads.id, link.headId)).get();
  return undefined;
}
