/**
 * The uploadthing stand-in end to end with the real SDK (uploadthing 7.7.4): the app side is
 * `createRouteHandler` from `uploadthing/server` with a small file router, served over HTTP so
 * the stand-in can call it back; the browser side is replayed with fetch exactly as
 * @uploadthing/react's uploader does it (POST the file list to the app, HEAD then PUT
 * multipart/form-data to each presigned URL).
 */
import crypto from "node:crypto";
import http from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createRouteHandler, createUploadthing, UTApi, type FileRouter } from "uploadthing/server";
import { startTestUploadthing, type TestUploadthing } from "../support/fakes";
import { asBody } from "./bytes";

type Completion = { metadata: unknown; file: { key: string; name: string; size: number; type: string; fileHash: string; ufsUrl: string } };

let ut: TestUploadthing;
const apps: Array<{ url: string; completions: Completion[]; close(): Promise<void> }> = [];

/** The app: a file router served at /api/uploadthing over HTTP (the stand-in calls it back). */
async function startApp(isDev: boolean) {
  const f = createUploadthing();
  const completions: Completion[] = [];
  const router = {
    masterPhoto: f({ image: { maxFileSize: "4MB", maxFileCount: 4 }, pdf: { maxFileSize: "8MB" } })
      .middleware(() => ({ uploadedBy: "user-17", masterId: 3 }))
      .onUploadComplete(({ metadata, file }) => {
        completions.push({ metadata, file: { key: file.key, name: file.name, size: file.size, type: file.type, fileHash: file.fileHash, ufsUrl: file.ufsUrl } });
        return { recordId: `photo-${completions.length}`, sawKey: file.key };
      }),
    privateSheet: f({ pdf: { maxFileSize: "8MB", acl: "private" } }).onUploadComplete(() => ({ ok: true })),
  } satisfies FileRouter;

  // The port is known only once listening, and the handler needs it for the callback URL.
  let handler: (req: Request) => Promise<Response> = () => Promise.resolve(new Response(null, { status: 503 }));
  const server = http.createServer(async (req, res) => {
    const chunks: Buffer[] = [];
    for await (const c of req) chunks.push(c as Buffer);
    const headers = new Headers();
    for (const [k, v] of Object.entries(req.headers)) if (typeof v === "string") headers.set(k, v);
    const request = new Request(`${url}${req.url}`, {
      method: req.method,
      headers,
      body: req.method === "GET" || req.method === "HEAD" ? undefined : Buffer.concat(chunks),
    });
    const response = await handler(request);
    res.writeHead(response.status, Object.fromEntries(response.headers));
    res.end(Buffer.from(await response.arrayBuffer()));
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  handler = createRouteHandler({
    router,
    config: { token: ut.token, ingestUrl: ut.url, isDev, logLevel: "Error", callbackUrl: `${url}/api/uploadthing` },
  });
  const app = {
    url,
    completions,
    close: () =>
      new Promise<void>((r) => {
        server.closeAllConnections();
        server.close(() => r());
      }),
  };
  apps.push(app);
  return app;
}

type Presigned = { url: string; key: string; name: string; customId: string | null };

/** Step 1 of the browser's upload: ask the app for presigned URLs. */
async function requestUpload(appUrl: string, slug: string, files: File[]): Promise<Presigned[]> {
  const res = await fetch(`${appUrl}/api/uploadthing?actionType=upload&slug=${slug}`, {
    method: "POST",
    headers: { "content-type": "application/json", "x-uploadthing-package": "@uploadthing/react", "x-uploadthing-version": "7.7.4" },
    body: JSON.stringify({ files: files.map((f) => ({ name: f.name, size: f.size, type: f.type, lastModified: f.lastModified })), input: null }),
  });
  expect(res.status).toBe(200);
  return (await res.json()) as Presigned[];
}

/** Step 2: HEAD for the resume offset, then PUT the file as multipart/form-data. */
async function sendFile(presigned: Presigned, file: File): Promise<{ status: number; body: Record<string, unknown> }> {
  const head = await fetch(presigned.url, { method: "HEAD" });
  expect(head.status).toBe(200);
  expect(head.headers.get("x-ut-range-start")).toBe("0");
  const form = new FormData();
  form.append("file", file);
  const res = await fetch(presigned.url, { method: "PUT", body: form, headers: { range: "bytes=0-", "x-uploadthing-version": "7.7.4" } });
  return { status: res.status, body: (await res.json()) as Record<string, unknown> };
}

function pngBytes(size: number, seed: number): Buffer {
  const b = crypto.createHash("sha512").update(String(seed)).digest();
  const out = Buffer.alloc(size);
  for (let i = 0; i < size; i++) out[i] = b[i % b.length]! ^ (i & 0xff);
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]).copy(out);
  return out;
}

const md5 = (b: Buffer) => crypto.createHash("md5").update(b).digest("hex");

beforeAll(async () => {
  ut = await startTestUploadthing();
});

afterAll(async () => {
  for (const app of apps) await app.close();
  await ut?.stop();
});

describe.each([
  ["production mode: the stand-in calls the app back", false],
  ["dev mode: callbacks travel over the NDJSON stream", true],
])("upload through the SDK (%s)", (_label, isDev) => {
  it("stores the file, runs onUploadComplete with the middleware's metadata, and serves the same bytes", async () => {
    const app = await startApp(isDev);
    const bytes = pngBytes(200_000, isDev ? 2 : 1);
    const file = new File([asBody(bytes)], "bowl, short side – cyl 2.png", { type: "image/png", lastModified: 1_700_000_000_000 });

    const [presigned] = await requestUpload(app.url, "masterPhoto", [file]);
    expect(presigned!.name).toBe(file.name);
    const put = await sendFile(presigned!, file);
    expect(put.status).toBe(200);
    expect(put.body).not.toHaveProperty("error");

    // The upload's answer carries what onUploadComplete returned (awaitServerData is the default).
    expect(put.body.serverData).toEqual({ recordId: "photo-1", sawKey: presigned!.key });
    // fileHash is an MD5 of the content; reference: Node's crypto.
    expect(put.body.fileHash).toBe(md5(bytes));

    expect(app.completions).toHaveLength(1);
    const done = app.completions[0]!;
    expect(done.metadata).toEqual({ uploadedBy: "user-17", masterId: 3 });
    expect(done.file).toMatchObject({ key: presigned!.key, name: file.name, size: bytes.length, type: "image/png", fileHash: md5(bytes) });

    const served = await fetch(put.body.ufsUrl as string);
    expect(served.status).toBe(200);
    expect(served.headers.get("content-type")).toBe("image/png");
    expect(Buffer.from(await served.arrayBuffer()).equals(bytes)).toBe(true);
    const byKey = await fetch(`${ut.url}/f/${presigned!.key}`);
    expect(Buffer.from(await byKey.arrayBuffer()).equals(bytes)).toBe(true);
  });
});

describe("the stand-in's checks", () => {
  it("uploads a PDF and an image in one request", async () => {
    const app = await startApp(false);
    const pdf = new File([asBody(Buffer.from("%PDF-1.7\n% setup sheet\n%%EOF\n"))], "setup sheet.pdf", { type: "application/pdf" });
    const img = new File([asBody(pngBytes(5000, 9))], "plate.png", { type: "image/png" });
    const presigned = await requestUpload(app.url, "masterPhoto", [pdf, img]);
    expect(presigned).toHaveLength(2);
    const results = await Promise.all(presigned.map((p, i) => sendFile(p, [pdf, img][i]!)));
    expect(results.map((r) => r.status)).toEqual([200, 200]);
    expect(app.completions.map((c) => c.file.type).sort()).toEqual(["application/pdf", "image/png"]);
  });

  it("refuses a presigned URL whose parameters were changed", async () => {
    const app = await startApp(false);
    const file = new File([asBody(pngBytes(1000, 4))], "a.png", { type: "image/png" });
    const [presigned] = await requestUpload(app.url, "masterPhoto", [file]);
    const tampered = presigned!.url.replace(/x-ut-file-size=\d+/, "x-ut-file-size=999999");
    const form = new FormData();
    form.append("file", file);
    const res = await fetch(tampered, { method: "PUT", body: form });
    expect(res.status).toBe(403);
    expect(await res.json()).toEqual({ error: "invalid signature" });
    expect(app.completions).toHaveLength(0);
  });

  it("refuses more bytes than the URL was signed for", async () => {
    const app = await startApp(false);
    const declared = new File([asBody(pngBytes(1000, 5))], "b.png", { type: "image/png" });
    const [presigned] = await requestUpload(app.url, "masterPhoto", [declared]);
    const form = new FormData();
    form.append("file", new File([asBody(pngBytes(5000, 5))], "b.png", { type: "image/png" }));
    const res = await fetch(presigned!.url, { method: "PUT", body: form });
    expect(res.status).toBe(413);
    expect((await res.json()).error).toMatch(/larger than the declared 1000 bytes/);
  });

  it("answers the browser's CORS preflight and exposes the resume header", async () => {
    const res = await fetch(`${ut.url}/somekey123`, {
      method: "OPTIONS",
      headers: { origin: "http://localhost:3000", "access-control-request-method": "PUT", "access-control-request-headers": "range,x-uploadthing-version,b3,traceparent" },
    });
    expect(res.status).toBe(204);
    expect(res.headers.get("access-control-allow-origin")).toBe("http://localhost:3000");
    expect(res.headers.get("access-control-allow-headers")).toBe("range,x-uploadthing-version,b3,traceparent");
    expect(res.headers.get("access-control-expose-headers")).toContain("x-ut-range-start");
  });

  it("serves private files only through a signed link made by the server SDK", async () => {
    const app = await startApp(false);
    const pdf = new File([asBody(Buffer.from("%PDF-1.7\nprivate\n"))], "offsets.pdf", { type: "application/pdf" });
    const [presigned] = await requestUpload(app.url, "privateSheet", [pdf]);
    const put = await sendFile(presigned!, pdf);
    expect(put.status).toBe(200);
    expect((await fetch(put.body.ufsUrl as string)).status).toBe(403);

    const utapi = new UTApi({ token: ut.token, apiUrl: ut.url, ufsHost: `localhost:${ut.port}`, ufsAppIdLocation: "path", logLevel: "Error" });
    const { ufsUrl } = await utapi.generateSignedURL(presigned!.key, { expiresIn: 60 });
    const signed = await fetch(ufsUrl);
    expect(signed.status).toBe(200);
    expect(await signed.text()).toBe("%PDF-1.7\nprivate\n");
  });

  it("answers the server SDK's file calls", async () => {
    const utapi = new UTApi({ token: ut.token, apiUrl: ut.url, logLevel: "Error" });
    const listed = await utapi.listFiles({ limit: 500 });
    const stored = await ut.files();
    expect(listed.files.map((f) => f.key).sort()).toEqual(stored.map((f) => f.key).sort());
    expect(listed.files.every((f) => f.status === "Uploaded")).toBe(true);

    const victim = stored[0]!;
    await utapi.renameFiles({ fileKey: victim.key, newName: "renamed.png" });
    expect((await ut.files()).find((f) => f.key === victim.key)?.name).toBe("renamed.png");

    const usage = await utapi.getUsageInfo();
    expect(usage.filesUploaded).toBe(stored.length);
    expect(usage.totalBytes).toBe(stored.reduce((s, f) => s + f.size, 0));

    const deleted = await utapi.deleteFiles(victim.key);
    expect(deleted).toEqual({ success: true, deletedCount: 1 });
    expect((await fetch(`${ut.url}/f/${victim.key}`)).status).toBe(404);
  });

  it("refuses server SDK calls with another key", async () => {
    const res = await fetch(`${ut.url}/v6/listFiles`, { method: "POST", headers: { "x-uploadthing-api-key": "sk_wrong" }, body: "{}" });
    expect(res.status).toBe(401);
  });
});
