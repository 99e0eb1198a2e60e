/** Programs and revisions: the tables, the details with files, moves and links. */
import { aliasedTable, and, asc, count, desc, eq, like, or, sql, type SQL } from "drizzle-orm";
import type { Db } from "../client";
import { fixturePlates, flowTests, headTypes, machines, masterHeads, programs, revisionFiles, revisionMoves, revisions, scanFiles, scans, users, type Port, type RevisionState } from "../schema";
import { REVISION_STATES } from "../enums";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { filesWithAnalyses } from "./files";
import { likePattern, offsetFor, orderFor } from "./paging";

export type ProgramListRow = {
  id: number;
  name: string;
  port: Port;
  headTypeId: number;
  castingNumber: string;
  revisionCount: number;
  releasedLetter: string | null;
  latestLetter: string | null;
  latestState: RevisionState | null;
  createdAt: number;
};

const revisionCount = sql<number>`(SELECT count(*) FROM revisions r WHERE r.program_id = ${programs.id})`;
const releasedLetter = sql<string | null>`(SELECT r.letter FROM revisions r WHERE r.program_id = ${programs.id} AND r.state = 'released' LIMIT 1)`;
const latestLetter = sql<string | null>`(SELECT r.letter FROM revisions r WHERE r.program_id = ${programs.id} ORDER BY r.id DESC LIMIT 1)`;
const latestState = sql<RevisionState | null>`(SELECT r.state FROM revisions r WHERE r.program_id = ${programs.id} ORDER BY r.id DESC LIMIT 1)`;

export function listPrograms(db: Db, query: TableQuery & { headTypeId?: number }): Page<ProgramListRow> {
  const conds: SQL[] = [];
  if (query.q) conds.push(or(like(programs.name, likePattern(query.q)), like(headTypes.castingNumber, likePattern(query.q)), like(programs.port, likePattern(query.q)))!);
  if (query.headTypeId) conds.push(eq(programs.headTypeId, query.headTypeId));
  const where = conds.length ? and(...conds) : undefined;
  const sortable = { name: programs.name, port: programs.port, castingNumber: headTypes.castingNumber, revisionCount, releasedLetter, createdAt: programs.createdAt };
  const rows = db
    .select({ id: programs.id, name: programs.name, port: programs.port, headTypeId: programs.headTypeId, castingNumber: headTypes.castingNumber, revisionCount, releasedLetter, latestLetter, latestState, createdAt: programs.createdAt })
    .from(programs)
    .innerJoin(headTypes, eq(headTypes.id, programs.headTypeId))
    .where(where)
    .orderBy(...orderFor(query, sortable, "castingNumber"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db.select({ n: count() }).from(programs).innerJoin(headTypes, eq(headTypes.id, programs.headTypeId)).where(where).get()!.n;
  return pageOf(rows, total, query);
}

export type RevisionListRow = {
  id: number;
  programId: number;
  programName: string;
  port: Port;
  castingNumber: string;
  letter: string;
  state: RevisionState;
  changeNote: string;
  createdByName: string | null;
  createdAt: number;
  releasedAt: number | null;
  cycleTimeS: number | null;
};

/** Cycle time of the revision's toolpaths (sum of their newest finished analyses). */
const cycleTime = sql<number | null>`(SELECT sum(json_extract(a.result, '$.cycleTimeS')) FROM revision_files rf JOIN analyses a ON a.file_id = rf.file_id
  WHERE rf.revision_id = ${revisions.id} AND rf.role = 'toolpath' AND a.state = 'done'
  AND a.id = (SELECT max(a2.id) FROM analyses a2 WHERE a2.file_id = rf.file_id))`;

export function listRevisions(db: Db, query: TableQuery & { state?: string; programId?: number }): Page<RevisionListRow> {
  const creator = aliasedTable(users, "creator");
  const conds: SQL[] = [];
  if (query.q) conds.push(or(like(programs.name, likePattern(query.q)), like(headTypes.castingNumber, likePattern(query.q)), like(revisions.changeNote, likePattern(query.q)))!);
  if (query.state && (REVISION_STATES as readonly string[]).includes(query.state)) conds.push(eq(revisions.state, query.state as RevisionState));
  if (query.programId) conds.push(eq(revisions.programId, query.programId));
  const where = conds.length ? and(...conds) : undefined;
  const sortable = { letter: sql`length(${revisions.letter}), ${revisions.letter}`, programName: programs.name, castingNumber: headTypes.castingNumber, port: programs.port, state: revisions.state, createdAt: revisions.createdAt, releasedAt: revisions.releasedAt, createdByName: creator.name, cycleTimeS: cycleTime, id: revisions.id };
  const rows = db
    .select({
      id: revisions.id,
      programId: revisions.programId,
      programName: programs.name,
      port: programs.port,
      castingNumber: headTypes.castingNumber,
      letter: revisions.letter,
      state: revisions.state,
      changeNote: revisions.changeNote,
      createdByName: creator.name,
      createdAt: revisions.createdAt,
      releasedAt: revisions.releasedAt,
      cycleTimeS: cycleTime,
    })
    .from(revisions)
    .innerJoin(programs, eq(programs.id, revisions.programId))
    .innerJoin(headTypes, eq(headTypes.id, programs.headTypeId))
    .leftJoin(creator, eq(creator.id, revisions.createdById))
    .where(where)
    .orderBy(...orderFor(query, sortable, "createdAt"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db
    .select({ n: count() })
    .from(revisions)
    .innerJoin(programs, eq(programs.id, revisions.programId))
    .innerJoin(headTypes, eq(headTypes.id, programs.headTypeId))
    .where(where)
    .get()!.n;
  return pageOf(rows, total, query);
}

export function getProgram(db: Db, id: number) {
  const row = db.select({ program: programs, headType: headTypes }).from(programs).innerJoin(headTypes, eq(headTypes.id, programs.headTypeId)).where(eq(programs.id, id)).get();
  if (!row) return undefined;
  const creator = aliasedTable(users, "creator");
  const revs = db
    .select({ id: revisions.id, letter: revisions.letter, state: revisions.state, parentId: revisions.parentId, changeNote: revisions.changeNote, createdAt: revisions.createdAt, releasedAt: revisions.releasedAt, createdByName: creator.name })
    .from(revisions)
    .leftJoin(creator, eq(creator.id, revisions.createdById))
    .where(eq(revisions.programId, id))
    .orderBy(asc(revisions.id))
    .all();
  return { ...row, revisions: revs };
}

export function getRevision(db: Db, id: number) {
  const creator = aliasedTable(users, "creator");
  const releaser = aliasedTable(users, "releaser");
  const row = db
    .select({
      revision: revisions,
      program: programs,
      headType: headTypes,
      parentLetter: sql<string | null>`(SELECT p.letter FROM revisions p WHERE p.id = ${revisions.parentId})`,
      plateCode: fixturePlates.code,
      machineName: machines.name,
      createdByName: creator.name,
      releasedByName: releaser.name,
    })
    .from(revisions)
    .innerJoin(programs, eq(programs.id, revisions.programId))
    .innerJoin(headTypes, eq(headTypes.id, programs.headTypeId))
    .leftJoin(fixturePlates, eq(fixturePlates.id, revisions.plateId))
    .leftJoin(machines, eq(machines.id, revisions.machineId))
    .leftJoin(creator, eq(creator.id, revisions.createdById))
    .leftJoin(releaser, eq(releaser.id, revisions.releasedById))
    .where(eq(revisions.id, id))
    .get();
  if (!row) return undefined;
  const source = row.revision.sourceScanId
    ? db
        .select({ id: scans.id, port: scans.port, scannedOn: scans.scannedOn, masterId: masterHeads.id, masterLabel: masterHeads.label })
        .from(scans)
        .innerJoin(masterHeads, eq(masterHeads.id, scans.masterId))
        .where(eq(scans.id, row.revision.sourceScanId))
        .get()
    : undefined;
  const links = db.select({ fileId: revisionFiles.fileId, role: revisionFiles.role }).from(revisionFiles).where(eq(revisionFiles.revisionId, id)).all();
  const files = filesWithAnalyses(db, links.map((l) => l.fileId)).map((f) => ({ ...f, role: links.find((l) => l.fileId === f.id)!.role }));
  const mover = aliasedTable(users, "mover");
  const moves = db
    .select({ id: revisionMoves.id, fromState: revisionMoves.fromState, toState: revisionMoves.toState, at: revisionMoves.at, note: revisionMoves.note, byName: mover.name })
    .from(revisionMoves)
    .leftJoin(mover, eq(mover.id, revisionMoves.byId))
    .where(eq(revisionMoves.revisionId, id))
    .orderBy(asc(revisionMoves.id))
    .all();
  const flowTestCount = db.select({ n: count() }).from(flowTests).where(eq(flowTests.revisionId, id)).get()!.n;
  return { ...row, source: source ?? null, files, moves, flowTestCount };
}

export function revisionOptions(db: Db, programId: number) {
  return db.select({ id: revisions.id, letter: revisions.letter, state: revisions.state }).from(revisions).where(eq(revisions.programId, programId)).orderBy(desc(revisions.id)).all();
}

/** The stored analyses of a revision, for the comparison: toolpath reports and its scan's report. */
export function revisionAnalyses(db: Db, id: number) {
  const rev = getRevision(db, id);
  if (!rev) return undefined;
  const toolpaths = rev.files.filter((f) => f.role === "toolpath" && f.analysis?.state === "done").map((f) => f.analysis!.result);
  let scan: unknown = null;
  if (rev.revision.sourceScanId) {
    const fileIds = db.select({ fileId: scanFiles.fileId }).from(scanFiles).where(eq(scanFiles.scanId, rev.revision.sourceScanId)).all().map((r) => r.fileId);
    const done = filesWithAnalyses(db, fileIds).filter((f) => f.analysis?.state === "done");
    scan = done.at(-1)?.analysis?.result ?? null;
  }
  return { revision: rev, toolpaths, scan };
}
