/**
 * Local stand-in for the hosted upload service that `uploadthing` 7.7.4 talks to, so photos and
 * PDFs upload end to end offline. It speaks the SDK's (undocumented) wire protocol:
 *
 *   POST /route-metadata      the app announces file keys, metadata and where to call back;
 *                             in dev mode the reply is an NDJSON stream of signed callbacks
 *   HEAD /{key}?…signature    how many bytes have arrived (x-ut-range-start), for resuming
 *   PUT  /{key}?…signature    the browser's multipart/form-data upload (field `file`)
 *   POST /callback-result     the app's onUploadComplete result, returned to the uploader
 *   GET  /f/{key}, /a/{appId}/{key}   the stored file
 *   POST /v6/…                the server SDK (UTApi) calls
 *
 * Files live under `<dataDir>/files`. Run it as a program (`--port --host --data-dir
 * [--public-url]`, token from UPLOADTHING_TOKEN) or start it in-process with
 * startUploadthingStandIn(). It never imports the app's code.
 */
import { createReadStream } from "node:fs";
import http, { type IncomingMessage, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { parseArgs } from "node:util";
import { multipartFileBytes } from "./multipart-file";
import { FileStore, isValidFileKey, TooLargeError, type ContentDisposition, type FileAcl, type StoredFile } from "./uploadthing-files";
import { answerPreflight, HttpError, readJson, sendJson, setCors } from "./uploadthing-http";
import { signPayload, signUrl, utParam, verifySignedUrl } from "./uploadthing-signing";
import { decodeUploadthingToken } from "./uploadthing-token";

export type UploadthingStandInOptions = {
  /** The same UPLOADTHING_TOKEN the app uses (its apiKey signs and verifies everything). */
  token: string;
  dataDir: string;
  host?: string;
  /** 0 picks a free port. */
  port?: number;
  /** Base URL the app and browsers use for this service; default http://host:port. */
  publicUrl?: string;
  /** How long a PUT waits for the app's metadata and for onUploadComplete's result. */
  waitTimeoutMs?: number;
  log?: (line: string) => void;
};

export type UploadthingStandIn = {
  url: string;
  port: number;
  appId: string;
  files(): Promise<StoredFile[]>;
  stop(): Promise<void>;
};

type RouteRegistration = {
  metadata: unknown;
  isDev: boolean;
  callbackUrl: string;
  callbackSlug: string;
  awaitServerData: boolean;
  remaining: Set<string>;
  devStream?: ServerResponse;
};

type Waiter<T> = { promise: Promise<T>; resolve(value: T): void; reject(err: Error): void };

function waiter<T>(): Waiter<T> {
  let resolve!: (value: T) => void;
  let reject!: (err: Error) => void;
  const promise = new Promise<T>((res, rej) => {
    resolve = res;
    reject = rej;
  });
  promise.catch(() => undefined); // rejections are observed by whoever awaits
  return { promise, resolve, reject };
}

function withTimeout<T>(promise: Promise<T>, ms: number, what: string): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const timer = setTimeout(() => reject(new HttpError(504, `${what} did not arrive within ${ms} ms`)), ms);
    promise.then(
      (v) => {
        clearTimeout(timer);
        resolve(v);
      },
      (e: unknown) => {
        clearTimeout(timer);
        reject(e);
      },
    );
  });
}

/** Files' names go into Content-Disposition both as an ASCII fallback and RFC 5987 UTF-8. */
function dispositionHeader(kind: ContentDisposition, name: string): string {
  const fallback = name.replace(/[^\x20-\x7e]|["\\]/g, "_");
  return `${kind}; filename="${fallback}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

export async function startUploadthingStandIn(opts: UploadthingStandInOptions): Promise<UploadthingStandIn> {
  const { apiKey, appId } = decodeUploadthingToken(opts.token);
  const store = new FileStore(opts.dataDir);
  await store.init();
  const host = opts.host ?? "127.0.0.1";
  const waitMs = opts.waitTimeoutMs ?? 30_000;
  const log = opts.log ?? (() => undefined);

  const registrations = new Map<string, RouteRegistration>();
  const registrationWaiters = new Map<string, Waiter<RouteRegistration>>();
  const serverDataWaiters = new Map<string, Waiter<unknown>>();
  let publicUrl = opts.publicUrl?.replace(/\/$/, "") ?? "";

  const registrationFor = (key: string): Promise<RouteRegistration> => {
    const known = registrations.get(key);
    if (known) return Promise.resolve(known);
    let w = registrationWaiters.get(key);
    if (!w) {
      w = waiter<RouteRegistration>();
      registrationWaiters.set(key, w);
    }
    return withTimeout(w.promise, waitMs, "the app's route metadata");
  };

  const fileUrls = (file: StoredFile) => ({
    url: `${publicUrl}/f/${file.key}`,
    appUrl: `${publicUrl}/a/${appId}/${file.key}`,
    ufsUrl: `${publicUrl}/a/${appId}/${file.key}`,
  });

  const requireApiKey = (req: IncomingMessage) => {
    if (req.headers["x-uploadthing-api-key"] !== apiKey) throw new HttpError(401, "missing or wrong x-uploadthing-api-key");
  };

  const signedOrigins = (req: IncomingMessage) => [`http://${req.headers.host ?? ""}`, publicUrl];

  async function routeMetadata(req: IncomingMessage, res: ServerResponse): Promise<void> {
    requireApiKey(req);
    const body = await readJson<{
      fileKeys?: string[];
      metadata?: unknown;
      isDev?: boolean;
      callbackUrl?: string;
      callbackSlug?: string;
      awaitServerData?: boolean;
    }>(req);
    if (!Array.isArray(body.fileKeys) || !body.fileKeys.every((k) => typeof k === "string" && isValidFileKey(k))) {
      throw new HttpError(400, "fileKeys must be a list of file keys");
    }
    if (typeof body.callbackUrl !== "string" || typeof body.callbackSlug !== "string") throw new HttpError(400, "callbackUrl and callbackSlug are required");
    const registration: RouteRegistration = {
      metadata: body.metadata ?? {},
      isDev: body.isDev === true,
      callbackUrl: body.callbackUrl,
      callbackSlug: body.callbackSlug,
      awaitServerData: body.awaitServerData !== false,
      remaining: new Set(body.fileKeys),
    };
    if (registration.isDev) {
      // Dev mode: the app cannot be called back, so callbacks travel down this open response.
      registration.devStream = res;
      res.writeHead(200, { "content-type": "application/x-ndjson", "cache-control": "no-cache" });
      res.flushHeaders();
      res.on("close", () => {
        for (const key of registration.remaining) if (registrations.get(key) === registration) registrations.delete(key);
      });
    }
    for (const key of body.fileKeys) {
      registrations.set(key, registration);
      registrationWaiters.get(key)?.resolve(registration);
      registrationWaiters.delete(key);
    }
    if (!registration.isDev) sendJson(res, 200, { ok: true });
  }

  async function callbackResult(req: IncomingMessage, res: ServerResponse): Promise<void> {
    requireApiKey(req);
    const body = await readJson<{ fileKey?: string; callbackData?: unknown; error?: string }>(req);
    if (typeof body.fileKey !== "string") throw new HttpError(400, "fileKey is required");
    const w = serverDataWaiters.get(body.fileKey);
    if (w) {
      if (typeof body.error === "string") w.reject(new HttpError(502, body.error));
      else w.resolve(body.callbackData ?? null);
      serverDataWaiters.delete(body.fileKey);
    }
    sendJson(res, 200, { ok: true });
  }

  async function deliverCallback(registration: RouteRegistration, file: StoredFile): Promise<void> {
    const payload = JSON.stringify({
      status: "uploaded",
      file: {
        name: file.name,
        size: file.size,
        type: file.type,
        customId: file.customId,
        lastModified: file.uploadedAt,
        key: file.key,
        ...fileUrls(file),
        fileHash: file.fileHash,
      },
      origin: publicUrl,
      metadata: registration.metadata,
    });
    const signature = signPayload(payload, apiKey);
    if (registration.isDev) {
      registration.devStream?.write(`${JSON.stringify({ payload, signature, hook: "callback" })}\n`);
      return;
    }
    const target = new URL(registration.callbackUrl);
    target.searchParams.set("slug", registration.callbackSlug);
    const res = await fetch(target, {
      method: "POST",
      headers: { "content-type": "application/json", "uploadthing-hook": "callback", "x-uploadthing-signature": signature },
      body: payload,
      signal: AbortSignal.timeout(waitMs),
    });
    await res.body?.cancel();
    if (!res.ok) throw new HttpError(502, `the app's upload callback answered ${res.status}`);
  }

  function settle(registration: RouteRegistration, key: string): void {
    registration.remaining.delete(key);
    registrations.delete(key);
    if (registration.isDev && registration.remaining.size === 0) registration.devStream?.end();
  }

  async function head(req: IncomingMessage, res: ServerResponse, key: string): Promise<void> {
    const check = verifySignedUrl(req.url ?? "", signedOrigins(req), apiKey);
    if (!check.ok) throw new HttpError(403, check.reason);
    res.writeHead(200, { "x-ut-range-start": String(await store.partialSize(key)) }).end();
  }

  async function put(req: IncomingMessage, res: ServerResponse, key: string): Promise<void> {
    const check = verifySignedUrl(req.url ?? "", signedOrigins(req), apiKey);
    if (!check.ok) throw new HttpError(403, check.reason);
    const p = check.params;
    if (utParam(p, "x-ut-identifier") !== appId) throw new HttpError(403, "URL was signed for another app");
    const declaredSize = Number(utParam(p, "x-ut-file-size"));
    if (!Number.isSafeInteger(declaredSize) || declaredSize < 0) throw new HttpError(400, "x-ut-file-size is missing");
    const slug = utParam(p, "x-ut-slug");
    const acl: FileAcl = utParam(p, "x-ut-acl") === "private" ? "private" : "public-read";
    const disposition: ContentDisposition = utParam(p, "x-ut-content-disposition") === "attachment" ? "attachment" : "inline";

    // The SDK resumes with `Range: bytes=N-` after asking HEAD how much arrived.
    const startAt = Number(/^bytes=(\d+)-$/.exec(req.headers.range ?? "")?.[1] ?? 0);
    const have = await store.partialSize(key);
    if (startAt > have) throw new HttpError(416, `upload resumes at ${startAt} but only ${have} bytes arrived`);

    // Registered before the callback goes out, so a fast onUploadComplete is not missed.
    const serverData = slug ? waiter<unknown>() : undefined;
    try {
      const received = await store.receive(key, multipartFileBytes(req, req.headers["content-type"], "file"), startAt, declaredSize);
      if (received !== declaredSize) {
        await store.discardPartial(key);
        throw new HttpError(400, `received ${received} bytes, the URL was signed for ${declaredSize}`);
      }
      const file = await store.finish(key, {
        name: utParam(p, "x-ut-file-name") ?? key,
        type: utParam(p, "x-ut-file-type") || "application/octet-stream",
        customId: utParam(p, "x-ut-custom-id") ?? null,
        acl,
        contentDisposition: disposition,
      });
      log(`stored ${file.key} (${file.size} bytes, ${file.type})`);

      let data: unknown = null;
      if (slug && serverData) {
        const registration = await registrationFor(key);
        if (registration.awaitServerData) serverDataWaiters.set(key, serverData);
        try {
          await deliverCallback(registration, file);
          if (registration.awaitServerData) data = await withTimeout(serverData.promise, waitMs, "onUploadComplete's result");
        } finally {
          serverDataWaiters.delete(key);
          settle(registration, key);
        }
      }
      sendJson(res, 200, { ...fileUrls(file), fileHash: file.fileHash, serverData: data });
    } catch (err) {
      if (err instanceof TooLargeError) throw new HttpError(413, err.message);
      if (err instanceof Error && err.name === "MultipartError") throw new HttpError(400, err.message);
      throw err;
    }
  }

  async function serveFile(req: IncomingMessage, res: ServerResponse, key: string): Promise<void> {
    const file = await store.get(key);
    if (!file) throw new HttpError(404, "no such file");
    if (file.acl === "private") {
      const check = verifySignedUrl(req.url ?? "", signedOrigins(req), apiKey);
      if (!check.ok) throw new HttpError(403, `private file: ${check.reason}`);
    }
    res.writeHead(200, {
      "content-type": file.type,
      "content-length": String(file.size),
      "content-disposition": dispositionHeader(file.contentDisposition, file.name),
      etag: `"${file.fileHash}"`,
      "cache-control": file.acl === "private" ? "private, no-store" : "public, max-age=3600",
    });
    if (req.method === "HEAD") return void res.end();
    await new Promise<void>((resolve, reject) => {
      createReadStream(store.contentPath(key)).on("error", reject).pipe(res).on("finish", resolve).on("error", reject);
    });
  }

  async function resolveKeys(body: { fileKeys?: unknown; customIds?: unknown }): Promise<StoredFile[]> {
    const keys = Array.isArray(body.fileKeys) ? (body.fileKeys as string[]) : [];
    const customIds = Array.isArray(body.customIds) ? (body.customIds as string[]) : [];
    const byKey = await Promise.all(keys.map((k) => store.get(k)));
    const byCustomId = await Promise.all(customIds.map((c) => store.findByCustomId(c)));
    return [...byKey, ...byCustomId].filter((f): f is StoredFile => f !== null);
  }

  async function fileFor(ref: { fileKey?: string; customId?: string }): Promise<StoredFile | null> {
    if (typeof ref.fileKey === "string") return store.get(ref.fileKey);
    if (typeof ref.customId === "string") return store.findByCustomId(ref.customId);
    return null;
  }

  /** The UTApi calls (server side only: authenticated by the API key header). */
  async function serverApi(req: IncomingMessage, res: ServerResponse, call: string): Promise<void> {
    requireApiKey(req);
    const body = await readJson<Record<string, unknown>>(req);
    switch (call) {
      case "listFiles": {
        const all = await store.list();
        const offset = Math.max(0, Number(body.offset ?? 0) || 0);
        const limit = Math.max(1, Number(body.limit ?? 500) || 500);
        const page = all.slice(offset, offset + limit);
        return sendJson(res, 200, {
          hasMore: offset + page.length < all.length,
          files: page.map((f) => ({ id: f.key, customId: f.customId, key: f.key, name: f.name, size: f.size, status: "Uploaded", uploadedAt: f.uploadedAt })),
        });
      }
      case "deleteFiles": {
        const files = await resolveKeys(body);
        for (const f of files) await store.delete(f.key);
        return sendJson(res, 200, { success: true, deletedCount: files.length });
      }
      case "getFileUrl": {
        const files = await resolveKeys(body);
        return sendJson(res, 200, { data: files.map((f) => ({ key: f.key, url: fileUrls(f).ufsUrl })) });
      }
      case "renameFiles": {
        for (const u of (body.updates as Array<{ fileKey?: string; customId?: string; newName?: string }>) ?? []) {
          const f = await fileFor(u);
          if (f && typeof u.newName === "string") await store.update(f.key, { name: u.newName });
        }
        return sendJson(res, 200, { success: true });
      }
      case "updateACL": {
        for (const u of (body.updates as Array<{ fileKey?: string; customId?: string; acl?: string }>) ?? []) {
          const f = await fileFor(u);
          if (f && (u.acl === "private" || u.acl === "public-read")) await store.update(f.key, { acl: u.acl });
        }
        return sendJson(res, 200, { success: true });
      }
      case "getUsageInfo": {
        const files = await store.list();
        const total = files.reduce((sum, f) => sum + f.size, 0);
        return sendJson(res, 200, { totalBytes: total, appTotalBytes: total, filesUploaded: files.length, limitBytes: 1024 ** 4 });
      }
      case "requestFileAccess": {
        const f = await fileFor(body as { fileKey?: string; customId?: string });
        if (!f) throw new HttpError(404, "no such file");
        const ttl = Math.min(7 * 86400, Math.max(1, Number(body.expiresIn ?? 3600) || 3600));
        const signed = signUrl(fileUrls(f).ufsUrl, apiKey, ttl);
        return sendJson(res, 200, { url: signed, ufsUrl: signed });
      }
      default:
        throw new HttpError(404, `the stand-in does not implement /v6/${call}`);
    }
  }

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const method = req.method ?? "GET";
    if (method === "OPTIONS") return answerPreflight(req, res);
    setCors(req, res);
    const { pathname } = new URL(req.url ?? "/", "http://x");
    const segments = pathname.split("/").filter(Boolean).map(decodeURIComponent);

    if (method === "GET" && segments.length === 0) return sendJson(res, 200, { ok: true, service: "uploadthing stand-in", appId });
    if (method === "POST" && pathname === "/route-metadata") return routeMetadata(req, res);
    if (method === "POST" && pathname === "/callback-result") return callbackResult(req, res);
    if (method === "POST" && segments[0] === "v6" && segments.length === 2) return serverApi(req, res, segments[1]!);
    if ((method === "GET" || method === "HEAD") && segments[0] === "f" && segments.length === 2) return serveFile(req, res, segments[1]!);
    if ((method === "GET" || method === "HEAD") && segments[0] === "a" && segments.length === 3) {
      if (segments[1] !== appId) throw new HttpError(404, "no such app");
      return serveFile(req, res, segments[2]!);
    }
    if (segments.length === 1 && isValidFileKey(segments[0]!)) {
      if (method === "HEAD") return head(req, res, segments[0]!);
      if (method === "PUT") return put(req, res, segments[0]!);
    }
    throw new HttpError(404, `no route for ${method} ${pathname}`);
  }

  const server = http.createServer((req, res) => {
    handle(req, res).catch((err: unknown) => {
      const status = err instanceof HttpError ? err.status : 500;
      const message = err instanceof Error ? err.message : String(err);
      if (status >= 500) log(`error on ${req.method} ${req.url?.split("?")[0]}: ${message}`);
      if (res.headersSent) return void res.destroy();
      // The SDK's uploader treats any `error` key in the answer as a failed upload.
      sendJson(res, status, { error: message });
      // Unread upload bytes would otherwise keep the connection busy.
      if (!req.complete) req.resume();
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port ?? 9320, host, () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  publicUrl ||= `http://${host}:${port}`;

  return {
    url: publicUrl,
    port,
    appId,
    files: () => store.list(),
    async stop() {
      for (const w of registrationWaiters.values()) w.reject(new Error("stand-in stopped"));
      for (const w of serverDataWaiters.values()) w.reject(new Error("stand-in stopped"));
      for (const r of new Set(registrations.values())) r.devStream?.end();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: {
      port: { type: "string", default: "9320" },
      host: { type: "string", default: "127.0.0.1" },
      "data-dir": { type: "string" },
      "public-url": { type: "string" },
    },
  });
  const token = process.env.UPLOADTHING_TOKEN;
  if (!token) throw new Error("UPLOADTHING_TOKEN is required (the same token the app uses)");
  const dataDir = values["data-dir"] ?? path.join(process.env.DATA_DIR ?? "data", "uploadthing");
  const standIn = await startUploadthingStandIn({
    token,
    dataDir,
    host: values.host,
    port: Number(values.port),
    publicUrl: values["public-url"],
    log: (line) => process.stdout.write(`${line}\n`),
  });
  process.stdout.write(`${JSON.stringify({ event: "ready", service: "uploadthing", port: standIn.port })}\n`);
  const shutdown = () => {
    standIn.stop().finally(() => process.exit(0));
    setTimeout(() => process.exit(0), 2000).unref();
  };
  process.once("SIGTERM", shutdown);
  process.once("SIGINT", shutdown);
}

if (process.argv[1] && /storage-fake[\\/]uploadthing\.ts$/.test(process.argv[1])) {
  main().catch((err: unknown) => {
    process.stderr.write(`uploadthing stand-in: ${err instanceof Error ? err.message : String(err)}\n`);
    process.exit(1);
  });
}
