/**
 * Revisions of a program: created by machinists as drafts, sent to proving, released by a lead
 * or admin with a password signature, withdrawn with a reason. Every move writes a
 * revision_moves row and an audit event in the same transaction; notices go out after commit.
 */
import { and, count, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import {
  analyses,
  fixturePlates,
  flowTests,
  machines,
  masterHeads,
  programs,
  revisionFiles,
  revisionMoves,
  revisions,
  scans,
  storedFiles,
  users,
  type RevisionState,
} from "@/db/schema";
import { recordAudit } from "../audit/record";
import { notifyJobsOfRevisionChange, type RevisionChangeNotice } from "../jobs/notices";
import { requireRole, type Actor } from "../auth/guard";
import { checkPassword } from "../auth/passwords";
import { LEADS, MACHINISTS } from "../auth/roles";
import { AppError } from "../errors";
import type { Mailer } from "../mail";
import { parseInput } from "../validation";
import { nextLetter } from "./letters";
import { addressesOfRoles, addressesOfUsers, appLink, sendNotice, type NoticeResult } from "./notices";
import { releaseSchema, revisionMoveSchema, revisionSchema } from "./schema";
import { releaseSignature } from "./signature";
import { findRevisionMove, isEditable, REVISION_STATE_LABEL } from "./states";

export const REVISION_EDITORS = MACHINISTS;
export const RELEASERS = LEADS;

type RevisionRow = typeof revisions.$inferSelect;
type RevisionValues = ReturnType<typeof revisionSchema.parse>;

function loadRevision(db: Db, id: number): RevisionRow {
  const row = db.select().from(revisions).where(eq(revisions.id, id)).get();
  if (!row) throw new AppError("not_found", "That revision was not found.");
  return row;
}

/** Checks the links of a revision against its program; fills plate and machine from the scan. */
function resolveLinks(db: Db, program: typeof programs.$inferSelect, v: RevisionValues, selfId?: number) {
  let plateId = v.plateId ?? null;
  let machineId = v.machineId ?? null;
  if (v.parentId != null) {
    const parent = db.select({ programId: revisions.programId }).from(revisions).where(eq(revisions.id, v.parentId)).get();
    if (!parent || parent.programId !== program.id || parent.programId === undefined || v.parentId === selfId) {
      throw new AppError("invalid", "The parent must be another revision of the same program.", { parentId: ["Choose a revision of this program."] });
    }
  }
  if (v.sourceScanId != null) {
    const scan = db
      .select({ port: scans.port, plateId: scans.plateId, machineId: scans.machineId, headTypeId: masterHeads.headTypeId })
      .from(scans)
      .innerJoin(masterHeads, eq(masterHeads.id, scans.masterId))
      .where(eq(scans.id, v.sourceScanId))
      .get();
    if (!scan) throw new AppError("invalid", "That scan does not exist.", { sourceScanId: ["Choose a scan."] });
    if (scan.headTypeId !== program.headTypeId || scan.port !== program.port) {
      throw new AppError("invalid", "The scan is of another casting or port than the program.", { sourceScanId: ["Choose a scan of this casting and port."] });
    }
    plateId ??= scan.plateId;
    machineId ??= scan.machineId;
  }
  if (plateId != null) {
    const plate = db.select({ headTypeId: fixturePlates.headTypeId }).from(fixturePlates).where(eq(fixturePlates.id, plateId)).get();
    if (!plate || plate.headTypeId !== program.headTypeId) {
      throw new AppError("invalid", "The plate is not one for this casting.", { plateId: ["Choose a plate for this casting."] });
    }
  }
  if (machineId != null && !db.select({ id: machines.id }).from(machines).where(eq(machines.id, machineId)).get()) {
    throw new AppError("invalid", "That machine does not exist.", { machineId: ["Choose a machine."] });
  }
  return { parentId: v.parentId ?? null, sourceScanId: v.sourceScanId ?? null, plateId, machineId, changeNote: v.changeNote };
}

function writeMove(tx: Db, revisionId: number, from: RevisionState | null, to: RevisionState, byId: number, at: number, note: string) {
  tx.insert(revisionMoves).values({ revisionId, fromState: from, toState: to, byId, at, note }).run();
}

export function createRevision(db: Db, actor: Actor | null, programId: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, REVISION_EDITORS);
  const values = parseInput(revisionSchema, input);
  return db.transaction((tx) => {
    const t = tx as unknown as Db;
    const program = t.select().from(programs).where(eq(programs.id, programId)).get();
    if (!program) throw new AppError("not_found", "That program was not found.");
    const existing = t.select({ id: revisions.id, letter: revisions.letter }).from(revisions).where(eq(revisions.programId, programId)).all();
    const letter = nextLetter(existing.map((r) => r.letter));
    // Without an explicit parent, a new revision continues from the latest one.
    const latest = existing.length ? existing.reduce((a, b) => (b.id > a.id ? b : a)) : null;
    const links = resolveLinks(t, program, { ...values, parentId: values.parentId ?? latest?.id ?? null });
    const row = t
      .insert(revisions)
      .values({ programId, letter, ...links, state: "draft", createdById: who.id, createdAt: now, updatedAt: now })
      .returning()
      .get();
    writeMove(t, row.id, null, "draft", who.id, now, "created");
    recordAudit(t, { actor: who, action: "revision.create", entity: "revision", entityId: row.id, after: row }, now);
    return row;
  });
}

export function updateRevision(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, REVISION_EDITORS);
  const values = parseInput(revisionSchema, input);
  return db.transaction((tx) => {
    const t = tx as unknown as Db;
    const before = loadRevision(t, id);
    if (!isEditable(before.state)) throw new AppError("conflict", `Revision ${before.letter} is ${REVISION_STATE_LABEL[before.state].toLowerCase()}: only drafts can be edited.`);
    const program = t.select().from(programs).where(eq(programs.id, before.programId)).get()!;
    const links = resolveLinks(t, program, values, id);
    const row = t.update(revisions).set({ ...links, updatedAt: now }).where(eq(revisions.id, id)).returning().get();
    recordAudit(t, { actor: who, action: "revision.update", entity: "revision", entityId: id, before, after: row }, now);
    return row;
  });
}

/**
 * Takes a file off a draft revision (a wrong or superseded upload). The stored copy and its
 * analysis stay for the audit trail; the revision no longer lists, proves or delivers it.
 */
export function removeRevisionFile(db: Db, actor: Actor | null, revisionId: number, fileId: number, now = Date.now()) {
  const who = requireRole(actor, REVISION_EDITORS);
  return db.transaction((tx) => {
    const t = tx as unknown as Db;
    const revision = loadRevision(t, revisionId);
    if (!isEditable(revision.state)) {
      throw new AppError("conflict", `Revision ${revision.letter} is ${REVISION_STATE_LABEL[revision.state].toLowerCase()}: its files are fixed.`);
    }
    const link = t
      .select({ id: revisionFiles.id, role: revisionFiles.role, name: storedFiles.originalName, sha256: storedFiles.sha256 })
      .from(revisionFiles)
      .innerJoin(storedFiles, eq(storedFiles.id, revisionFiles.fileId))
      .where(and(eq(revisionFiles.revisionId, revisionId), eq(revisionFiles.fileId, fileId)))
      .get();
    if (!link) throw new AppError("not_found", "That file is not part of this revision.");
    t.delete(revisionFiles).where(eq(revisionFiles.id, link.id)).run();
    const before = { fileId, role: link.role, name: link.name, sha256: link.sha256 };
    recordAudit(t, { actor: who, action: "revision.file_remove", entity: "revision", entityId: revisionId, before, after: null }, now);
    t.update(revisions).set({ updatedAt: now }).where(eq(revisions.id, revisionId)).run();
    return { removed: before };
  });
}

/** Toolpath files of a revision that finished uploading, with their analyses' states. */
export function toolpathFilesOf(db: Db, revisionId: number) {
  return db
    .select({ fileId: storedFiles.id, state: storedFiles.state, sha256: storedFiles.sha256, name: storedFiles.originalName })
    .from(revisionFiles)
    .innerJoin(storedFiles, eq(storedFiles.id, revisionFiles.fileId))
    .where(and(eq(revisionFiles.revisionId, revisionId), eq(revisionFiles.role, "toolpath")))
    .all();
}

/** `jobNotice`: the leads' e-mail about open jobs still using a revision that just ended (lib/jobs). */
export type MoveResult = { revision: RevisionRow; notice: NoticeResult | null; jobNotice?: RevisionChangeNotice | null };

/** Moves other than release: to proving, back to draft, withdrawn. */
export async function moveRevision(db: Db, actor: Actor | null, id: number, input: unknown, opts: { now?: number; mailer?: Mailer } = {}): Promise<MoveResult> {
  const now = opts.now ?? Date.now();
  const who = requireRole(actor, [...new Set([...MACHINISTS, ...LEADS])]);
  const { to, note } = parseInput(revisionMoveSchema, input);
  const moved = db.transaction((tx) => {
    const t = tx as unknown as Db;
    const before = loadRevision(t, id);
    const move = findRevisionMove(before.state, to);
    if (!move || move.special) {
      throw new AppError("conflict", `Revision ${before.letter} cannot go from ${REVISION_STATE_LABEL[before.state].toLowerCase()} to ${REVISION_STATE_LABEL[to].toLowerCase()} this way.`);
    }
    requireRole(who, move.roles);
    if (move.needsNote && note.length < 3) throw new AppError("invalid", "Write the reason for this move.", { note: ["Write the reason."] });
    if (to === "proving") {
      const files = toolpathFilesOf(t, id);
      if (!files.some((f) => f.state === "stored")) {
        throw new AppError("conflict", `Revision ${before.letter} has no uploaded toolpath yet: upload the program before proving it.`);
      }
    }
    const row = t
      .update(revisions)
      .set({ state: to, endReason: to === "withdrawn" ? note : before.endReason, updatedAt: now })
      .where(eq(revisions.id, id))
      .returning()
      .get();
    writeMove(t, id, before.state, to, who.id, now, note);
    recordAudit(t, { actor: who, action: `revision.${to === "withdrawn" ? "withdraw" : "move"}`, entity: "revision", entityId: id, before: { state: before.state }, after: { state: to, note } }, now);
    return row;
  });
  const notice = to === "proving" ? await provingNotice(db, moved, opts.mailer) : to === "withdrawn" ? await endNotice(db, moved, "withdrawn", opts.mailer) : null;
  const jobNotice = to === "withdrawn" ? await notifyJobsOfRevisionChange(db, id, { mailer: opts.mailer }) : null;
  return { revision: moved, notice, jobNotice };
}

export type ReleaseResult = MoveResult & { superseded: RevisionRow | null };

/**
 * Release: the lead re-enters their password (the signature), the revision needs at least one
 * linked flow test or a written override, its toolpaths must be analysed, and the program's
 * previously released revision is superseded in the same transaction.
 */
export async function releaseRevision(db: Db, actor: Actor | null, id: number, input: unknown, opts: { now?: number; mailer?: Mailer } = {}): Promise<ReleaseResult> {
  const who = requireRole(actor, RELEASERS);
  const { password, overrideReason } = parseInput(releaseSchema, input);
  const account = db.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, who.id)).get();
  if (!(await checkPassword(password, account?.passwordHash))) {
    recordAudit(db, { actor: who, action: "revision.release_refused", entity: "revision", entityId: id, after: { reason: "password did not match" } });
    throw new AppError("invalid", "That password does not match your account; the release was not signed.", { password: ["The password does not match."] });
  }
  const now = opts.now ?? Date.now();
  const result = db.transaction((tx) => {
    const t = tx as unknown as Db;
    const before = loadRevision(t, id);
    if (before.state !== "proving") {
      throw new AppError("conflict", `Only a revision in proving can be released; ${before.letter} is ${REVISION_STATE_LABEL[before.state].toLowerCase()}.`);
    }
    const files = toolpathFilesOf(t, id).filter((f) => f.state === "stored" && f.sha256);
    if (files.length === 0) throw new AppError("conflict", "The revision has no stored toolpath to release.");
    const rows = t
      .select({ fileId: analyses.fileId, id: analyses.id, state: analyses.state })
      .from(analyses)
      .where(inArray(analyses.fileId, files.map((f) => f.fileId)))
      .all();
    const latest = new Map<number, { id: number; state: string }>();
    for (const a of rows) if ((latest.get(a.fileId)?.id ?? 0) < a.id) latest.set(a.fileId, a);
    if (files.some((f) => latest.get(f.fileId)?.state !== "done")) {
      throw new AppError("conflict", "Every toolpath must be analysed without error before release; wait for the analysis or re-run it.");
    }
    const flowCount = t.select({ n: count() }).from(flowTests).where(eq(flowTests.revisionId, id)).get()!.n;
    if (flowCount === 0 && !overrideReason) {
      throw new AppError("invalid", "No flow test is linked to this revision: link one, or write why it may be released without.", {
        overrideReason: ["Write why this revision may be released without a flow test."],
      });
    }
    const previous = t.select().from(revisions).where(and(eq(revisions.programId, before.programId), eq(revisions.state, "released"))).get() ?? null;
    let superseded: RevisionRow | null = null;
    if (previous) {
      const reason = `superseded by revision ${before.letter}`;
      superseded = t.update(revisions).set({ state: "superseded", endReason: reason, updatedAt: now }).where(eq(revisions.id, previous.id)).returning().get();
      writeMove(t, previous.id, "released", "superseded", who.id, now, reason);
      recordAudit(t, { actor: who, action: "revision.supersede", entity: "revision", entityId: previous.id, before: { state: "released" }, after: { state: "superseded", by: id } }, now);
    }
    const signature = releaseSignature({ userId: who.id, at: now, revisionId: id, fileSha256s: files.map((f) => f.sha256!) });
    const row = t
      .update(revisions)
      .set({ state: "released", releasedById: who.id, releasedAt: now, releaseSignature: signature, releaseOverrideReason: flowCount === 0 ? overrideReason! : null, updatedAt: now })
      .where(eq(revisions.id, id))
      .returning()
      .get();
    const note = flowCount > 0 ? `signed; ${flowCount} flow test${flowCount === 1 ? "" : "s"} linked` : `signed; released without a flow test: ${overrideReason}`;
    writeMove(t, id, "proving", "released", who.id, now, note);
    recordAudit(
      t,
      {
        actor: who,
        action: "revision.release",
        entity: "revision",
        entityId: id,
        before: { state: "proving" },
        after: { state: "released", signature, files: files.map((f) => f.sha256), flowTests: flowCount, overrideReason: row.releaseOverrideReason },
      },
      now,
    );
    return { revision: row, superseded };
  });
  const notice = await endNotice(db, result.revision, "released", opts.mailer);
  const jobNotice = result.superseded ? await notifyJobsOfRevisionChange(db, result.superseded.id, { mailer: opts.mailer }) : null;
  return { ...result, notice, jobNotice };
}

function describe(db: Db, rev: RevisionRow) {
  const program = db.select({ name: programs.name, port: programs.port }).from(programs).where(eq(programs.id, rev.programId)).get();
  return { title: `${program?.name ?? "program"} (${program?.port ?? "?"}) revision ${rev.letter}`, link: appLink(`/programs/${rev.programId}/revisions/${rev.id}`) };
}

async function provingNotice(db: Db, rev: RevisionRow, mailer?: Mailer) {
  const { title, link } = describe(db, rev);
  return sendNotice(
    addressesOfRoles(db, ["lead"]),
    {
      subject: `${title} is in proving`,
      lines: [`${title} was sent to proving and waits for its first-article cut, inspection and flow test.`, "Release it once the bench and the inspection agree."],
      link,
    },
    mailer,
  );
}

/** Release and withdrawal concern the people who made it and everyone who cuts with it. */
async function endNotice(db: Db, rev: RevisionRow, what: "released" | "withdrawn", mailer?: Mailer) {
  const { title, link } = describe(db, rev);
  const scan = rev.sourceScanId
    ? db
        .select({ operatorId: scans.operatorId, porterId: masterHeads.porterId })
        .from(scans)
        .innerJoin(masterHeads, eq(masterHeads.id, scans.masterId))
        .where(eq(scans.id, rev.sourceScanId))
        .get()
    : undefined;
  const to = [...addressesOfRoles(db, ["lead", "machinist"]), ...addressesOfUsers(db, [rev.createdById, rev.releasedById, scan?.operatorId, scan?.porterId])];
  const lines =
    what === "released"
      ? [`${title} is released for production.`, "Jobs can now cut with it. Do the first-article check of every new revision before running a batch."]
      : [`${title} was withdrawn: ${rev.endReason ?? "no reason given"}.`, "Do not cut with it. Check the jobs and heads that used it."];
  return sendNotice(to, { subject: `${title} ${what}`, lines, link }, mailer);
}
