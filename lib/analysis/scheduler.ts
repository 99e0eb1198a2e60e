/**
 * Runs queued analyses in child processes, a few at a time, so a 2 GB program never blocks the
 * web server. Per process: on the first kick it re-queues rows a crash left `running` and sweeps
 * abandoned uploads; each kick claims queued rows while a slot is free; a child that dies
 * without finishing its row marks it failed with the exit reason.
 */
import { spawn } from "node:child_process";
import path from "node:path";
import { eq } from "drizzle-orm";
import { db as defaultDb, type Db } from "@/db/client";
import { analyses } from "@/db/schema";
import { storage } from "../storage";
import { sweepAbandonedUploads } from "../uploads/sessions";
import { claimNext, markFailed, requeueInterrupted } from "./queue";

/**
 * Two shared cores: one analysis at a time leaves the other for the web server.
 * PORTOLAN_ANALYSIS_CONCURRENCY overrides it; 0 leaves the queue to another runner (tests, CLI).
 */
export function maxConcurrent(): number {
  const n = Number(process.env.PORTOLAN_ANALYSIS_CONCURRENCY ?? 1);
  return Number.isInteger(n) && n >= 0 ? Math.min(n, 8) : 1;
}

type SchedulerState = { started: boolean; running: Map<number, number>; projectRoot: string };

const g = globalThis as unknown as { portolanScheduler?: SchedulerState };

function state(): SchedulerState {
  g.portolanScheduler ??= { started: false, running: new Map(), projectRoot: process.cwd() };
  return g.portolanScheduler;
}

export function runningAnalyses(): number[] {
  return [...state().running.keys()];
}

/** Once per process: crash recovery and the sweep of abandoned uploads. */
function startOnce(db: Db) {
  const s = state();
  if (s.started) return;
  s.started = true;
  const requeued = requeueInterrupted(db);
  if (requeued > 0) console.warn(`[analysis] re-queued ${requeued} analyses interrupted by a restart`);
  sweepAbandonedUploads(db, storage()).catch((err: unknown) => console.error(`[uploads] sweep failed: ${err instanceof Error ? err.message : String(err)}`));
}

/** Starts queued analyses while slots are free. Cheap to call from any request. */
export function kickAnalyses(db: Db = defaultDb()): void {
  startOnce(db);
  const s = state();
  while (s.running.size < maxConcurrent()) {
    const id = claimNext(db);
    if (id === null) return;
    spawnRunner(db, id);
  }
}

function spawnRunner(db: Db, id: number) {
  const s = state();
  const script = path.join(s.projectRoot, "lib", "analysis", "run.ts");
  const args = ["--import", "tsx", script, "--analysis-id", String(id), "--claimed", "--database", db.$client.name];
  const child = spawn(process.execPath, args, { cwd: s.projectRoot, env: process.env, stdio: ["ignore", "ignore", "pipe"] });
  s.running.set(id, child.pid ?? 0);
  let stderr = "";
  child.stderr?.on("data", (b: Buffer) => (stderr = (stderr + b.toString()).slice(-2000)));
  const finish = (reason: string | null) => {
    if (!s.running.delete(id)) return;
    const row = db.select({ state: analyses.state }).from(analyses).where(eq(analyses.id, id)).get();
    if (row?.state === "running") {
      markFailed(db, id, `the analysis process stopped before finishing (${reason ?? "no reason"})${stderr ? `: ${stderr.trim().split("\n").pop()}` : ""}`);
    }
    kickAnalyses(db);
  };
  child.once("error", (err) => finish(err.message));
  child.once("exit", (code, signal) => finish(signal ? `signal ${signal}` : `exit code ${code}`));
}
