/** Stored files with their latest analysis, as the revision and scan pages show them. */
import { desc, eq, inArray } from "drizzle-orm";
import type { Db } from "../client";
import { analyses, storedFiles } from "../schema";

export type AnalysisView = {
  id: number;
  engine: "toolpath" | "geometry";
  state: "queued" | "running" | "done" | "failed";
  progress: number;
  error: string | null;
  previewFileId: number | null;
  startedAt: number | null;
  finishedAt: number | null;
  result: unknown;
};

export type FileView = {
  id: number;
  kind: string;
  name: string;
  sizeBytes: number;
  sha256: string | null;
  state: "uploading" | "stored" | "failed";
  createdAt: number;
  analysis: AnalysisView | null;
};

const analysisColumns = {
  id: analyses.id,
  fileId: analyses.fileId,
  engine: analyses.engine,
  state: analyses.state,
  progress: analyses.progress,
  error: analyses.error,
  previewFileId: analyses.previewFileId,
  startedAt: analyses.startedAt,
  finishedAt: analyses.finishedAt,
  result: analyses.result,
};

/** Files by id, each with its newest analysis (results included only when `withResults`). */
export function filesWithAnalyses(db: Db, fileIds: number[], withResults = true): FileView[] {
  if (fileIds.length === 0) return [];
  const files = db.select().from(storedFiles).where(inArray(storedFiles.id, fileIds)).orderBy(storedFiles.id).all();
  const rows = db.select(analysisColumns).from(analyses).where(inArray(analyses.fileId, fileIds)).orderBy(desc(analyses.id)).all();
  const latest = new Map<number, (typeof rows)[number]>();
  for (const r of rows) if (!latest.has(r.fileId)) latest.set(r.fileId, r);
  return files.map((f) => {
    const a = latest.get(f.id);
    return {
      id: f.id,
      kind: f.kind,
      name: f.originalName,
      sizeBytes: f.sizeBytes,
      sha256: f.sha256,
      state: f.state,
      createdAt: f.createdAt,
      analysis: a ? { id: a.id, engine: a.engine, state: a.state, progress: a.progress, error: a.error, previewFileId: a.previewFileId, startedAt: a.startedAt, finishedAt: a.finishedAt, result: withResults ? a.result : null } : null,
    };
  });
}

export function getAnalysis(db: Db, id: number) {
  return db
    .select({ ...analysisColumns, fileName: storedFiles.originalName, fileKind: storedFiles.kind, fileSizeBytes: storedFiles.sizeBytes })
    .from(analyses)
    .innerJoin(storedFiles, eq(storedFiles.id, analyses.fileId))
    .where(eq(analyses.id, id))
    .get();
}
