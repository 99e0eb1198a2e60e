/**
 * The analysis queue is the `analyses` table: a row is queued when a file is stored, claimed
 * (queued → running) by whoever runs it, and ends done or failed. Re-running a failed one puts
 * it back in the queue.
 */
import { and, eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { analyses, storedFiles, type FileKind } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { MACHINISTS } from "../auth/roles";
import { AppError } from "../errors";

export type Engine = "toolpath" | "geometry";

export function engineFor(kind: FileKind): Engine | null {
  return kind === "toolpath" ? "toolpath" : kind === "point_cloud" ? "geometry" : null;
}

/** Adds a queued analysis for a stored file (inside the caller's transaction). */
export function enqueueAnalysis(db: Db, fileId: number, kind: FileKind, now = Date.now()): number {
  const engine = engineFor(kind);
  if (!engine) throw new Error(`no engine analyses ${kind} files`);
  return db.insert(analyses).values({ fileId, engine, state: "queued", progress: 0, createdAt: now }).returning({ id: analyses.id }).get().id;
}

/** Claims the oldest queued analysis (queued → running); null when none waits. */
export function claimNext(db: Db, now = Date.now()): number | null {
  const row = db.$client
    .prepare(
      `UPDATE analyses SET state = 'running', started_at = ?, progress = 0, error = NULL
       WHERE id = (SELECT id FROM analyses WHERE state = 'queued' ORDER BY id LIMIT 1) AND state = 'queued'
       RETURNING id`,
    )
    .get(now) as { id: number } | undefined;
  return row?.id ?? null;
}

/** Claims one given analysis if it is queued; false when someone else has it. */
export function claim(db: Db, id: number, now = Date.now()): boolean {
  const res = db
    .update(analyses)
    .set({ state: "running", startedAt: now, progress: 0, error: null })
    .where(and(eq(analyses.id, id), eq(analyses.state, "queued")))
    .run();
  return res.changes === 1;
}

/** After a crash: rows left `running` go back to the queue. */
export function requeueInterrupted(db: Db): number {
  return db.update(analyses).set({ state: "queued", progress: 0 }).where(eq(analyses.state, "running")).run().changes;
}

export function markFailed(db: Db, id: number, message: string, now = Date.now()): void {
  db.update(analyses).set({ state: "failed", error: message.slice(0, 2000), finishedAt: now }).where(eq(analyses.id, id)).run();
}

export function queuedCount(db: Db): number {
  return db.select({ n: sql<number>`count(*)` }).from(analyses).where(eq(analyses.state, "queued")).get()!.n;
}

/** Puts a failed (or finished) analysis back in the queue; refused once its revision is released. */
export function rerunAnalysis(db: Db, actor: Actor | null, id: number, now = Date.now()) {
  const who = requireRole(actor, MACHINISTS);
  return db.transaction((tx) => {
    const row = tx.select().from(analyses).where(eq(analyses.id, id)).get();
    if (!row) throw new AppError("not_found", "That analysis was not found.");
    if (row.state === "queued" || row.state === "running") throw new AppError("conflict", "This analysis is already queued or running.");
    const file = tx.select({ state: storedFiles.state }).from(storedFiles).where(eq(storedFiles.id, row.fileId)).get();
    if (file?.state !== "stored") throw new AppError("conflict", "The file is not stored, so it cannot be analysed.");
    try {
      tx.update(analyses).set({ state: "queued", progress: 0, error: null, result: null, startedAt: null, finishedAt: null }).where(eq(analyses.id, id)).run();
    } catch (err) {
      if (err instanceof Error && /immutable/.test(err.message)) throw new AppError("conflict", "The analysis of a released revision is frozen and cannot be re-run.");
      throw err;
    }
    recordAudit(tx, { actor: who, action: "analysis.rerun", entity: "analysis", entityId: id, before: { state: row.state, error: row.error } }, now);
    return { id, state: "queued" as const };
  });
}
