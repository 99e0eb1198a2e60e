/**
 * Files end to end against the S3 stand-in: the browser's multipart upload through the route
 * handlers, hashing and sniffing on completion, the analysis (in process and in its child
 * process), previews, cancel, the sweep of abandoned uploads, and a checksum mismatch caught on
 * download.
 */
import crypto from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DELETE as cancel } from "@/app/api/uploads/[id]/route";
import { GET as download } from "@/app/api/files/[id]/route";
import { GET as getAnalysisRoute } from "@/app/api/analyses/[id]/route";
import { GET as getPreview } from "@/app/api/analyses/[id]/preview/route";
import { POST as rerun } from "@/app/api/analyses/[id]/rerun/route";
import type { Db } from "@/db/client";
import { analyses, auditEvents, revisionFiles, scanFiles, storedFiles } from "@/db/schema";
import { runAnalysis } from "@/lib/analysis/runner";
import { kickAnalyses } from "@/lib/analysis/scheduler";
import { intakePortShape, sampleTubeCloud } from "@/lib/geometry/generate";
import { collectBytes, writePly } from "@/lib/geometry/writers";
import { storage } from "@/lib/storage";
import { decodePreviewCloud } from "@/lib/geometry";
import { decodePreview, generatePortProgram } from "@/lib/toolpath";
import { sweepAbandonedUploads } from "@/lib/uploads/sessions";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";
import { startTestS3, type TestS3 } from "../support/fakes";
import { buildWorld } from "../programs/world";
import { completeAs, putParts, startUploadAs, uploadAs } from "./browser-upload";

let s3: TestS3;
let db: Db;
let admin: TestUser, porter: TestUser, machinist: TestUser, auditor: TestUser;
let world: Awaited<ReturnType<typeof buildWorld>>;

const sha256 = (b: Uint8Array) => crypto.createHash("sha256").update(b).digest("hex");
const text = (s: string) => new TextEncoder().encode(s);

/** A multi-tool 5-axis program just over one 16 MiB part, so the upload has two parts. */
function bigProgram(): Uint8Array {
  return text([...generatePortProgram({ lines: 460_000, tools: 3, seed: 7 })].join(""));
}

beforeAll(async () => {
  s3 = await startTestS3();
  Object.assign(process.env, {
    S3_ENDPOINT: s3.config.endpoint,
    S3_BUCKET: s3.config.bucket,
    S3_ACCESS_KEY_ID: s3.config.accessKeyId,
    S3_SECRET_ACCESS_KEY: s3.config.secretAccessKey,
    S3_FORCE_PATH_STYLE: "true",
    // The routes kick the background runner; here the tests run analyses themselves until the
    // one test of the child process turns it on.
    PORTOLAN_ANALYSIS_CONCURRENCY: "0",
  });
  db = freshAppDb();
  admin = makeUser(db, "admin");
  porter = makeUser(db, "porter");
  machinist = makeUser(db, "machinist");
  auditor = makeUser(db, "auditor");
  world = await buildWorld(db, { admin, porter, machinist });
});

afterAll(async () => {
  await s3?.stop();
});

describe("toolpath upload and analysis", () => {
  let fileId: number;
  let analysisId: number;
  let program: Uint8Array;

  it("uploads a multi-part program straight to the bucket and records our key, size and SHA-256", async () => {
    program = bigProgram();
    expect(program.length).toBeGreaterThan(16 * 1024 * 1024);
    const up = await uploadAs(machinist, { kind: "toolpath", fileName: "street intake A.nc", revisionId: world.revision.id }, program);
    expect(up.partCount).toBe(2);
    expect(up.status).toBe(200);
    fileId = up.fileId;
    analysisId = up.body.analysisId;
    const row = db.select().from(storedFiles).where(eq(storedFiles.id, fileId)).get()!;
    // Reference: Node's crypto over the bytes we sent.
    expect(row.sha256).toBe(sha256(program));
    expect(row).toMatchObject({ state: "stored", sizeBytes: program.length, originalName: "street intake A.nc", uploadId: null });
    expect(row.storageKey).toMatch(/^toolpath\/[0-9a-f]{2}\/[0-9a-f]{32}$/);
    expect(row.storageKey).not.toContain("street");
    const link = db.select().from(revisionFiles).where(eq(revisionFiles.fileId, fileId)).get();
    expect(link).toMatchObject({ revisionId: world.revision.id, role: "toolpath" });
    expect(db.select().from(analyses).where(eq(analyses.id, analysisId)).get()).toMatchObject({ state: "queued", engine: "toolpath" });
  });

  it("runs the toolpath engine on the stored bytes and keeps its report and preview", async () => {
    const outcome = await runAnalysis(db, storage(), analysisId);
    expect(outcome).toEqual({ id: analysisId, state: "done" });
    const res = await json(await getAnalysisRoute(await request(`/api/analyses/${analysisId}`, { as: auditor }), params({ id: String(analysisId) })));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: "done", progress: 1, engine: "toolpath" });
    // The engine hashed the same bytes independently.
    expect(res.body.result.sha256).toBe(sha256(program));
    expect(res.body.result.tools.map((t: { number: number }) => t.number)).toEqual([1, 2, 3]);
    expect(res.body.result.machineProfile).toBe(world.machine.name);
    expect(res.body.result.checks.plateEnvelope).toBe(true);

    const preview = await getPreview(await request(`/api/analyses/${analysisId}/preview`, { as: auditor }), params({ id: String(analysisId) }));
    expect(preview.status).toBe(200);
    const decoded = decodePreview(new Uint8Array(await preview.arrayBuffer()));
    expect(decoded.flags.length).toBe(res.body.result.previewVertices);
    expect(decoded.toolNumbers).toEqual([1, 2, 3]);
  });

  it("serves the download verified, under the original name", async () => {
    const res = await download(await request(`/api/files/${fileId}`, { as: auditor }), params({ id: String(fileId) }));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toContain("street intake A.nc");
    expect(sha256(new Uint8Array(await res.arrayBuffer()))).toBe(sha256(program));
  });

  it("breaks the download and records it when the stored bytes no longer match", async () => {
    const row = db.select().from(storedFiles).where(eq(storedFiles.id, fileId)).get()!;
    // Someone replaces the object behind our back (same size, one byte changed).
    const tampered = program.slice();
    tampered[1000] ^= 0x20;
    await storage().putStream(row.storageKey, tampered);
    const res = await download(await request(`/api/files/${fileId}`, { as: auditor }), params({ id: String(fileId) }));
    expect(res.status).toBe(200); // headers go out before the last byte is checked
    await expect(res.arrayBuffer()).rejects.toThrow();
    await new Promise((r) => setTimeout(r, 50));
    const events = db.select().from(auditEvents).where(and(eq(auditEvents.action, "file.checksum_mismatch"), eq(auditEvents.entityId, String(fileId)))).all();
    expect(events).toHaveLength(1);
    expect((events[0].after as { actual: string }).actual).toBe(sha256(tampered));
    await storage().putStream(row.storageKey, program);
  });

  it("refuses a re-run by an auditor and lets a machinist queue it again", async () => {
    const refused = await rerun(await request(`/api/analyses/${analysisId}/rerun`, { as: auditor, method: "POST" }), params({ id: String(analysisId) }));
    expect(refused.status).toBe(403);
    const ok = await json(await rerun(await request(`/api/analyses/${analysisId}/rerun`, { as: machinist, method: "POST" }), params({ id: String(analysisId) })));
    expect(ok.body).toEqual({ id: analysisId, state: "queued" });
  });

  it("runs a queued analysis in its own child process when kicked", async () => {
    process.env.PORTOLAN_ANALYSIS_CONCURRENCY = "1";
    kickAnalyses(db);
    const deadline = Date.now() + 45_000;
    let row = db.select().from(analyses).where(eq(analyses.id, analysisId)).get()!;
    const seen = new Set<string>();
    while (Date.now() < deadline && (row.state === "queued" || row.state === "running")) {
      seen.add(row.state);
      await new Promise((r) => setTimeout(r, 100));
      row = db.select().from(analyses).where(eq(analyses.id, analysisId)).get()!;
    }
    expect(row.error).toBeNull();
    expect(row.state).toBe("done");
    expect(seen.has("running")).toBe(true);
    expect((row.result as { sha256: string }).sha256).toBe(sha256(program));
    process.env.PORTOLAN_ANALYSIS_CONCURRENCY = "0";
  });
});

describe("point-cloud upload and geometry", () => {
  it("stores a PLY cloud for the scan and computes its port profile", async () => {
    const shape = intakePortShape({ valveDiameterMm: 45, throatPercent: 87 });
    const cloud = sampleTubeCloud(shape, { points: 60_000, seed: 3 });
    const ply = collectBytes(writePly({ positions: cloud.positions, count: cloud.count }));
    const up = await uploadAs(machinist, { kind: "point_cloud", fileName: "intake scan.ply", scanId: world.scan.id }, ply);
    expect(up.status).toBe(200);
    expect(db.select().from(scanFiles).where(eq(scanFiles.fileId, up.fileId)).get()?.scanId).toBe(world.scan.id);
    const outcome = await runAnalysis(db, storage(), up.body.analysisId);
    expect(outcome.error).toBeUndefined();
    const row = db.select().from(analyses).where(eq(analyses.id, up.body.analysisId)).get()!;
    const report = row.result as { points: number; minSection: { percentOfValve: number } | null; valveDiameterMm: number };
    expect(report.points).toBe(60_000);
    expect(report.valveDiameterMm).toBe(45); // the casting's intake valve
    // The generated port's throat is 87 % of the valve; the profile should find about that.
    expect(report.minSection!.percentOfValve).toBeGreaterThan(82);
    expect(report.minSection!.percentOfValve).toBeLessThan(92);
    expect(row.previewFileId).not.toBeNull();
    const preview = await getPreview(await request(`/api/analyses/${row.id}/preview`, { as: auditor }), params({ id: String(row.id) }));
    expect(preview.headers.get("x-preview-format")).toBe("PPV1");
    const decoded = decodePreviewCloud(new Uint8Array(await preview.arrayBuffer()));
    expect(decoded.sourceCount).toBe(60_000);
    expect(decoded.count).toBeGreaterThan(0);
    expect(decoded.stations).not.toBeNull();
  });
});

describe("an engine failure", () => {
  it("keeps the engine's own message, and a re-run queues it again", async () => {
    // A flat sheet of points: a valid XYZ file, but no port wall for the geometry engine.
    const lines: string[] = [];
    for (let i = 0; i < 60; i++) for (let j = 0; j < 60; j++) lines.push(`${i} ${j} 0`);
    const up = await uploadAs(machinist, { kind: "point_cloud", fileName: "flat.xyz", scanId: world.scan.id }, text(lines.join("\n") + "\n"));
    expect(up.status).toBe(200);
    const outcome = await runAnalysis(db, storage(), up.body.analysisId);
    expect(outcome.state).toBe("failed");
    const res = await json(await getAnalysisRoute(await request(`/api/analyses/${up.body.analysisId}`, { as: auditor }), params({ id: String(up.body.analysisId) })));
    expect(res.body.state).toBe("failed");
    expect(res.body.error).toMatch(/plane|line|wall|tube/);
    const again = await json(await rerun(await request(`/api/analyses/${up.body.analysisId}/rerun`, { as: machinist, method: "POST" }), params({ id: String(up.body.analysisId) })));
    expect(again.body.state).toBe("queued");
  });
});

describe("refusals, cancel and cleanup", () => {
  it("refuses a PNG named .nc with a clear message and keeps nothing", async () => {
    const png = new Uint8Array(4096);
    png.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const started = await startUploadAs(machinist, { kind: "toolpath", fileName: "program.nc", sizeBytes: png.length, revisionId: world.revision.id });
    const parts = await putParts(machinist, started.body, png);
    const res = await completeAs(machinist, started.body.fileId, parts);
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/PNG image, not a G-code program/);
    expect(db.select().from(storedFiles).where(eq(storedFiles.id, started.body.fileId)).get()).toBeUndefined();
    const keys = [];
    for await (const o of storage().list({ prefix: "toolpath/" })) keys.push(o.key);
    expect(keys).toHaveLength(1); // only the real program from above
  });

  it("refuses an oversized or wrongly named file before any byte is sent", async () => {
    const big = await startUploadAs(machinist, { kind: "toolpath", fileName: "huge.nc", sizeBytes: 3 * 1024 ** 3, revisionId: world.revision.id });
    expect(big.status).toBe(413);
    const named = await startUploadAs(machinist, { kind: "point_cloud", fileName: "scan.docx", sizeBytes: 100, scanId: world.scan.id });
    expect(named.status).toBe(415);
    const porterTry = await startUploadAs(porter, { kind: "point_cloud", fileName: "scan.ply", sizeBytes: 100, scanId: world.scan.id });
    expect(porterTry.status).toBe(403);
  });

  it("cancels an upload half-way: the parts and the record are gone", async () => {
    const bytes = text("G21 G90\nG0 X0 Y0\nM30\n".repeat(10));
    const started = await startUploadAs(machinist, { kind: "toolpath", fileName: "half.nc", sizeBytes: bytes.length, revisionId: world.revision.id });
    const res = await json(await cancel(await request(`/api/uploads/${started.body.fileId}`, { as: machinist, method: "DELETE" }), params({ id: String(started.body.fileId) })));
    expect(res.body).toEqual({ fileId: started.body.fileId, aborted: true });
    expect(db.select().from(storedFiles).where(eq(storedFiles.id, started.body.fileId)).get()).toBeUndefined();
    const open = [];
    for await (const u of storage().listMultipartUploads()) open.push(u);
    expect(open.find((u) => u.key.includes("toolpath"))).toBeUndefined();
  });

  it("sweeps uploads abandoned for longer than the limit, and keeps recent ones", async () => {
    const bytes = text("G21 G90\nG0 X0 Y0\nM30\n");
    const old = await startUploadAs(machinist, { kind: "toolpath", fileName: "old.nc", sizeBytes: bytes.length, revisionId: world.revision.id });
    const recent = await startUploadAs(machinist, { kind: "toolpath", fileName: "recent.nc", sizeBytes: bytes.length, revisionId: world.revision.id });
    db.update(storedFiles).set({ createdAt: Date.now() - 30 * 3600_000 }).where(eq(storedFiles.id, old.body.fileId)).run();
    const result = await sweepAbandonedUploads(db, storage(), { olderThanHours: 24 });
    expect(result.rowsRemoved).toBe(1);
    expect(result.uploadsAborted).toBe(1);
    expect(db.select().from(storedFiles).where(eq(storedFiles.id, old.body.fileId)).get()).toBeUndefined();
    expect(db.select().from(storedFiles).where(eq(storedFiles.id, recent.body.fileId)).get()?.state).toBe("uploading");
  });
});
