/**
 * Runs one queued analysis: streams the file from storage (checked against its SHA-256 as it
 * passes), feeds the matching engine, writes progress into the row every ~250 ms, and stores
 * the report and the preview blob — or the engine's own message when it fails. The same
 * function runs in the analysis child process, the CLI and the demo seed.
 */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { analyses, fixturePlates, headTypes, machines, masterHeads, revisionFiles, revisions, scanFiles, scans, storedFiles } from "@/db/schema";
import { newObjectId, objectKey, type Storage } from "../storage";
import { claim, markFailed } from "./queue";
import { runGeometryEngine, runToolpathEngine, type EngineOutput } from "./engines";
import { machineProfileOf, plateEnvelopeOf } from "./profile";

export type RunOutcome = { id: number; state: "done" | "failed"; error?: string };

const PROGRESS_INTERVAL_MS = 250;

function toolpathContext(db: Db, fileId: number) {
  const link = db
    .select({ machineId: revisions.machineId, plateId: revisions.plateId })
    .from(revisionFiles)
    .innerJoin(revisions, eq(revisions.id, revisionFiles.revisionId))
    .where(eq(revisionFiles.fileId, fileId))
    .get();
  const machine = link?.machineId ? db.select().from(machines).where(eq(machines.id, link.machineId)).get() : undefined;
  const plate = link?.plateId ? db.select().from(fixturePlates).where(eq(fixturePlates.id, link.plateId)).get() : undefined;
  return { machine: machine ? machineProfileOf(machine) : undefined, plate: plate ? plateEnvelopeOf(plate) : undefined };
}

function geometryContext(db: Db, fileId: number) {
  const row = db
    .select({ port: scans.port, intake: headTypes.intakeValveMm, exhaust: headTypes.exhaustValveMm })
    .from(scanFiles)
    .innerJoin(scans, eq(scans.id, scanFiles.scanId))
    .innerJoin(masterHeads, eq(masterHeads.id, scans.masterId))
    .innerJoin(headTypes, eq(headTypes.id, masterHeads.headTypeId))
    .where(eq(scanFiles.fileId, fileId))
    .get();
  const portKind = row?.port ?? "intake";
  return { portKind, valveDiameterMm: row ? (portKind === "intake" ? row.intake : row.exhaust) : undefined };
}

/**
 * Runs analysis `id`. It claims the row unless the caller already did (`claimed`), so two
 * runners never work on the same analysis.
 */
export async function runAnalysis(db: Db, store: Storage, id: number, opts: { claimed?: boolean } = {}): Promise<RunOutcome> {
  if (!opts.claimed && !claim(db, id)) {
    const row = db.select({ state: analyses.state }).from(analyses).where(eq(analyses.id, id)).get();
    throw new Error(row ? `analysis ${id} is ${row.state}, not queued` : `analysis ${id} does not exist`);
  }
  const row = db.select().from(analyses).where(eq(analyses.id, id)).get()!;
  const file = db.select().from(storedFiles).where(eq(storedFiles.id, row.fileId)).get();
  let lastWrite = 0;
  const onProgress = (fraction: number) => {
    const now = Date.now();
    if (now - lastWrite < PROGRESS_INTERVAL_MS) return;
    lastWrite = now;
    db.update(analyses).set({ progress: Math.max(0, Math.min(1, fraction)) }).where(eq(analyses.id, id)).run();
  };
  try {
    if (!file || file.state !== "stored" || !file.sha256) throw new Error("the file is not stored (or has no checksum), so it cannot be analysed");
    const { body } = await store.getVerifiedStream(file.storageKey, file.sha256);
    let output: EngineOutput;
    try {
      output =
        row.engine === "toolpath"
          ? await runToolpathEngine({ source: body, sizeBytes: file.sizeBytes, ...toolpathContext(db, file.id), onProgress })
          : await runGeometryEngine({ source: body, sizeBytes: file.sizeBytes, fileName: file.originalName, ...geometryContext(db, file.id), onProgress });
    } finally {
      body.destroy();
    }
    let previewFileId: number | null = null;
    if (output.preview) {
      const kind = row.engine === "toolpath" ? "toolpath_preview" : "cloud_preview";
      const key = objectKey(kind, newObjectId());
      const put = await store.putStream(key, output.preview, { contentType: "application/octet-stream" });
      previewFileId = db
        .insert(storedFiles)
        .values({ kind, storageKey: key, originalName: `${file.originalName}.preview`, contentType: "application/octet-stream", sizeBytes: put.sizeBytes, sha256: put.sha256, state: "stored" })
        .returning({ id: storedFiles.id })
        .get().id;
    }
    db.update(analyses).set({ state: "done", progress: 1, result: output.result, previewFileId, error: null, finishedAt: Date.now() }).where(eq(analyses.id, id)).run();
    return { id, state: "done" };
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    markFailed(db, id, message);
    return { id, state: "failed", error: message };
  }
}
