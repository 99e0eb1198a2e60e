/**
 * Photos and setup sheets through our file router (app/api/uploadthing) and the local upload
 * stand-in, end to end: the browser's two steps replayed with fetch, the session and role
 * checked in the middleware, and the finished file copied into our bucket with its SHA-256.
 */
import crypto from "node:crypto";
import http from "node:http";
import type { AddressInfo } from "node:net";
import { eq } from "drizzle-orm";
import { NextRequest } from "next/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Db } from "@/db/client";
import { attachments, revisionFiles, storedFiles } from "@/db/schema";
import { storage } from "@/lib/storage";
import { freshAppDb, makeUser, sessionCookie, type TestUser } from "../support/app";
import { startTestS3, startTestUploadthing, type TestS3, type TestUploadthing } from "../support/fakes";
import { buildWorld } from "../programs/world";

let s3: TestS3;
let ut: TestUploadthing;
let db: Db;
let server: http.Server;
let appUrl: string;
let porter: TestUser, machinist: TestUser, auditor: TestUser, admin: TestUser;
let world: Awaited<ReturnType<typeof buildWorld>>;

const sha256 = (b: Uint8Array) => crypto.createHash("sha256").update(b).digest("hex");

function png(size: number): Buffer {
  const out = crypto.randomBytes(size);
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]).copy(out);
  return out;
}

beforeAll(async () => {
  s3 = await startTestS3();
  ut = await startTestUploadthing();
  // The app reaches both stand-ins through its ordinary configuration.
  let handler: (req: NextRequest) => Promise<Response> = async () => new Response(null, { status: 503 });
  server = http.createServer(async (req, res) => {
    const chunks: Buffer[] = [];
    for await (const c of req) chunks.push(c as Buffer);
    const headers = new Headers();
    for (const [k, v] of Object.entries(req.headers)) if (typeof v === "string") headers.set(k, v);
    const request = new NextRequest(`${appUrl}${req.url}`, { method: req.method, headers, body: req.method === "GET" || req.method === "HEAD" ? undefined : Buffer.concat(chunks) });
    const response = await handler(request);
    res.writeHead(response.status, Object.fromEntries(response.headers));
    res.end(Buffer.from(await response.arrayBuffer()));
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  appUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  Object.assign(process.env, {
    S3_ENDPOINT: s3.config.endpoint,
    S3_BUCKET: s3.config.bucket,
    UPLOADTHING_TOKEN: ut.token,
    UPLOADTHING_API_URL: ut.url,
    UPLOADTHING_INGEST_URL: ut.url,
    UPLOADTHING_CALLBACK_URL: `${appUrl}/api/uploadthing`,
    UPLOADTHING_IS_DEV: "false",
  });
  const route = await import("@/app/api/uploadthing/route");
  handler = (req) => (req.method === "GET" ? route.GET(req) : route.POST(req));
  db = freshAppDb();
  admin = makeUser(db, "admin");
  porter = makeUser(db, "porter");
  machinist = makeUser(db, "machinist");
  auditor = makeUser(db, "auditor");
  world = await buildWorld(db, { admin, porter, machinist });
});

afterAll(async () => {
  server?.closeAllConnections();
  await new Promise<void>((r) => server?.close(() => r()));
  await ut?.stop();
  await s3?.stop();
});

type Presigned = { url: string; key: string; name: string };

async function ask(as: TestUser, slug: string, files: File[], input: unknown) {
  return fetch(`${appUrl}/api/uploadthing?actionType=upload&slug=${slug}`, {
    method: "POST",
    headers: { "content-type": "application/json", cookie: await sessionCookie(as), "x-uploadthing-package": "@uploadthing/react", "x-uploadthing-version": "7.7.4" },
    body: JSON.stringify({ files: files.map((f) => ({ name: f.name, size: f.size, type: f.type, lastModified: f.lastModified })), input }),
  });
}

async function send(p: Presigned, file: File) {
  const form = new FormData();
  form.append("file", file);
  const res = await fetch(p.url, { method: "PUT", body: form, headers: { range: "bytes=0-", "x-uploadthing-version": "7.7.4" } });
  return { status: res.status, body: (await res.json()) as { serverData?: { ok: boolean; fileId?: number; sha256?: string; message?: string } } };
}

describe("photos through the upload service", () => {
  it("attaches a porter's photo to the master, kept in our bucket with its SHA-256", async () => {
    const bytes = png(120_000);
    const file = new File([new Uint8Array(bytes)], "bowl cyl 3.png", { type: "image/png" });
    const res = await ask(porter, "photo", [file], { entity: "master_head", entityId: world.master.id, caption: "bowl, cylinder 3" });
    expect(res.status).toBe(200);
    const [presigned] = (await res.json()) as Presigned[];
    const put = await send(presigned, file);
    expect(put.status).toBe(200);
    expect(put.body.serverData).toMatchObject({ ok: true, sha256: sha256(bytes) });
    const row = db.select().from(storedFiles).where(eq(storedFiles.id, put.body.serverData!.fileId!)).get()!;
    expect(row).toMatchObject({ kind: "photo", state: "stored", originalName: "bowl cyl 3.png", contentType: "image/png", sizeBytes: bytes.length, uploadedById: porter.id });
    expect(row.storageKey).toMatch(/^photo\//);
    const att = db.select().from(attachments).where(eq(attachments.fileId, row.id)).get()!;
    expect(att).toMatchObject({ entity: "master_head", entityId: world.master.id, caption: "bowl, cylinder 3" });
    expect((await storage().verifyObject(row.storageKey, row.sha256!)).sizeBytes).toBe(bytes.length);
  });

  it("refuses an auditor before any byte is sent, and a porter on a fixture plate", async () => {
    const file = new File([new Uint8Array(png(1000))], "x.png", { type: "image/png" });
    expect((await ask(auditor, "photo", [file], { entity: "master_head", entityId: world.master.id })).status).toBe(403);
    expect((await ask(porter, "photo", [file], { entity: "fixture_plate", entityId: world.plate.id })).status).toBe(403);
  });

  it("does not keep a file that claims to be an image but is not", async () => {
    const fake = new File([new TextEncoder().encode("G21 G90\nG0 X0\nM30\n".repeat(50))], "not-a-photo.png", { type: "image/png" });
    const res = await ask(porter, "photo", [fake], { entity: "master_head", entityId: world.master.id });
    const [presigned] = (await res.json()) as Presigned[];
    const put = await send(presigned, fake);
    expect(put.body.serverData?.ok).toBe(false);
    expect(put.body.serverData?.message).toMatch(/not a photo/);
    expect(db.select().from(storedFiles).where(eq(storedFiles.originalName, "not-a-photo.png")).get()).toBeUndefined();
  });

  it("links a machinist's setup sheet (PDF) to a draft revision", async () => {
    const pdf = new File([new TextEncoder().encode("%PDF-1.7\n% setup sheet for revision A\n%%EOF\n")], "setup A.pdf", { type: "application/pdf" });
    const res = await ask(machinist, "setupSheet", [pdf], { revisionId: world.revision.id });
    expect(res.status).toBe(200);
    const [presigned] = (await res.json()) as Presigned[];
    const put = await send(presigned, pdf);
    expect(put.body.serverData?.ok).toBe(true);
    const link = db.select().from(revisionFiles).where(eq(revisionFiles.fileId, put.body.serverData!.fileId!)).get()!;
    expect(link).toMatchObject({ revisionId: world.revision.id, role: "setup_sheet" });
  });
});
