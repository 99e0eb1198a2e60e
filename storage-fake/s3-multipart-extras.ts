/**
 * S3 operations that s3rver 3.7.1 lacks but the app needs to clean up and resume browser
 * multipart uploads: ListMultipartUploads, ListParts and AbortMultipartUpload, plus the
 * NoSuchUpload answer to a part sent for an upload that no longer exists.
 *
 * They work on s3rver's own on-disk layout of an upload in progress:
 *   <dir>/<bucket>/._S3rver_uploads/<uploadId>/{key, metadata, 1, 1.md5, 2, ...}
 * and are installed as a Koa middleware in front of s3rver's router. Signatures are not
 * checked here, exactly as s3rver does not check them elsewhere.
 */
import { promises as fs } from "node:fs";
import path from "node:path";

/** The part of a Koa context this middleware touches (s3rver ships no types). */
export type KoaLikeContext = {
  method: string;
  path: string;
  query: Record<string, string | string[] | undefined>;
  status: number;
  body: unknown;
  type: string;
  set(name: string, value: string): void;
};
export type KoaLikeMiddleware = (ctx: KoaLikeContext, next: () => Promise<unknown>) => Promise<unknown>;

const UPLOADS_DIR = "._S3rver_uploads";
const DEFAULT_PAGE = 1000;

type UploadInProgress = { key: string; uploadId: string; initiated: Date };

function escapeXml(text: string): string {
  return text.replace(/[<>&'"]/g, (ch) => `&#${ch.charCodeAt(0)};`);
}

function xml(root: string, inner: string): string {
  return `<?xml version="1.0" encoding="UTF-8"?>\n<${root} xmlns="http://s3.amazonaws.com/doc/2006-03-01/">${inner}</${root}>`;
}

function tag(name: string, value: string | number | boolean): string {
  return `<${name}>${escapeXml(String(value))}</${name}>`;
}

function one(value: string | string[] | undefined): string | undefined {
  return Array.isArray(value) ? value[0] : value;
}

function sendError(ctx: KoaLikeContext, status: number, code: string, message: string, extra = ""): void {
  ctx.status = status;
  ctx.type = "application/xml";
  ctx.body = `<?xml version="1.0" encoding="UTF-8"?>\n<Error>${tag("Code", code)}${tag("Message", message)}${extra}</Error>`;
}

/** Splits a path-style request path into bucket and (decoded) key. */
function parsePath(requestPath: string): { bucket: string; key: string } {
  const trimmed = requestPath.replace(/^\/+/, "");
  const slash = trimmed.indexOf("/");
  if (slash < 0) return { bucket: decodeURIComponent(trimmed), key: "" };
  return {
    bucket: decodeURIComponent(trimmed.slice(0, slash)),
    key: trimmed
      .slice(slash + 1)
      .split("/")
      .map((segment) => decodeURIComponent(segment))
      .join("/"),
  };
}

async function readUpload(dir: string, bucket: string, uploadId: string): Promise<UploadInProgress | null> {
  if (!/^[0-9a-f]{8,64}$/i.test(uploadId)) return null;
  const keyFile = path.join(dir, bucket, UPLOADS_DIR, uploadId, "key");
  try {
    const [key, stat] = await Promise.all([fs.readFile(keyFile, "utf8"), fs.stat(keyFile)]);
    return { key, uploadId, initiated: stat.mtime };
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === "ENOENT") return null;
    throw err;
  }
}

async function listUploads(dir: string, bucket: string): Promise<UploadInProgress[]> {
  let ids: string[];
  try {
    ids = await fs.readdir(path.join(dir, bucket, UPLOADS_DIR));
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === "ENOENT") return [];
    throw err;
  }
  const uploads = await Promise.all(ids.map((id) => readUpload(dir, bucket, id)));
  // S3 orders by key, then by initiation time; the id breaks remaining ties deterministically.
  return uploads
    .filter((u): u is UploadInProgress => u !== null)
    .sort((a, b) =>
      a.key < b.key ? -1 : a.key > b.key ? 1 : a.initiated.getTime() - b.initiated.getTime() || (a.uploadId < b.uploadId ? -1 : 1),
    );
}

async function bucketExists(dir: string, bucket: string): Promise<boolean> {
  try {
    return (await fs.stat(path.join(dir, bucket))).isDirectory();
  } catch {
    return false;
  }
}

async function listMultipartUploads(ctx: KoaLikeContext, dir: string, bucket: string): Promise<void> {
  if (!(await bucketExists(dir, bucket))) return sendError(ctx, 404, "NoSuchBucket", "The specified bucket does not exist");
  const prefix = one(ctx.query.prefix) ?? "";
  const keyMarker = one(ctx.query["key-marker"]) ?? "";
  const idMarker = one(ctx.query["upload-id-marker"]) ?? "";
  const maxUploads = Math.min(DEFAULT_PAGE, Math.max(1, Number(one(ctx.query["max-uploads"]) ?? DEFAULT_PAGE) || DEFAULT_PAGE));

  const all = (await listUploads(dir, bucket)).filter((u) => u.key.startsWith(prefix));
  let start = 0;
  if (keyMarker) {
    // Resume after the marker: same key with a later upload id (when given), or a later key.
    const markerIndex = idMarker ? all.findIndex((u) => u.key === keyMarker && u.uploadId === idMarker) : -1;
    start = markerIndex >= 0 ? markerIndex + 1 : all.findIndex((u) => u.key > keyMarker);
    if (start < 0) start = all.length;
  }
  const page = all.slice(start, start + maxUploads);
  const truncated = start + page.length < all.length;
  const last = page[page.length - 1];

  const uploadsXml = page
    .map(
      (u) =>
        `<Upload>${tag("Key", u.key)}${tag("UploadId", u.uploadId)}<Initiator>${tag("ID", "local")}${tag("DisplayName", "local")}</Initiator>` +
        `<Owner>${tag("ID", "local")}${tag("DisplayName", "local")}</Owner>${tag("StorageClass", "STANDARD")}${tag("Initiated", u.initiated.toISOString())}</Upload>`,
    )
    .join("");
  ctx.status = 200;
  ctx.type = "application/xml";
  ctx.body = xml(
    "ListMultipartUploadsResult",
    tag("Bucket", bucket) +
      tag("KeyMarker", keyMarker) +
      tag("UploadIdMarker", idMarker) +
      (truncated && last ? tag("NextKeyMarker", last.key) + tag("NextUploadIdMarker", last.uploadId) : "") +
      tag("Prefix", prefix) +
      tag("MaxUploads", maxUploads) +
      tag("IsTruncated", truncated) +
      uploadsXml,
  );
}

async function listParts(ctx: KoaLikeContext, dir: string, bucket: string, key: string, uploadId: string): Promise<void> {
  const upload = await readUpload(dir, bucket, uploadId);
  if (!upload || upload.key !== key) return noSuchUpload(ctx, uploadId);
  const uploadDir = path.join(dir, bucket, UPLOADS_DIR, uploadId);
  const marker = Number(one(ctx.query["part-number-marker"]) ?? 0) || 0;
  const maxParts = Math.min(DEFAULT_PAGE, Math.max(1, Number(one(ctx.query["max-parts"]) ?? DEFAULT_PAGE) || DEFAULT_PAGE));
  const numbers = (await fs.readdir(uploadDir))
    .filter((name) => /^\d+$/.test(name))
    .map(Number)
    .filter((n) => n > marker)
    .sort((a, b) => a - b);
  const page = numbers.slice(0, maxParts);
  const parts = await Promise.all(
    page.map(async (n) => {
      const file = path.join(uploadDir, String(n));
      const [stat, md5] = await Promise.all([fs.stat(file), fs.readFile(`${file}.md5`, "utf8").catch(() => "")]);
      return `<Part>${tag("PartNumber", n)}${tag("LastModified", stat.mtime.toISOString())}${tag("ETag", `"${md5}"`)}${tag("Size", stat.size)}</Part>`;
    }),
  );
  const truncated = numbers.length > page.length;
  ctx.status = 200;
  ctx.type = "application/xml";
  ctx.body = xml(
    "ListPartsResult",
    tag("Bucket", bucket) +
      tag("Key", key) +
      tag("UploadId", uploadId) +
      tag("PartNumberMarker", marker) +
      (page.length ? tag("NextPartNumberMarker", page[page.length - 1]) : "") +
      tag("MaxParts", maxParts) +
      tag("IsTruncated", truncated) +
      tag("StorageClass", "STANDARD") +
      parts.join(""),
  );
}

function noSuchUpload(ctx: KoaLikeContext, uploadId: string): void {
  sendError(
    ctx,
    404,
    "NoSuchUpload",
    "The specified upload does not exist. The upload ID may be invalid, or the upload may have been aborted or completed.",
    tag("UploadId", uploadId),
  );
}

async function abortUpload(ctx: KoaLikeContext, dir: string, bucket: string, key: string, uploadId: string): Promise<void> {
  const upload = await readUpload(dir, bucket, uploadId);
  if (!upload || upload.key !== key) return noSuchUpload(ctx, uploadId);
  await fs.rm(path.join(dir, bucket, UPLOADS_DIR, uploadId), { recursive: true, force: true });
  ctx.status = 204;
  ctx.body = null;
}

/** Koa middleware adding the missing multipart operations for the store rooted at `dir`. */
export function multipartExtras(dir: string): KoaLikeMiddleware {
  return async (ctx, next) => {
    const { bucket, key } = parsePath(ctx.path);
    if (!bucket) return next();
    const uploadId = one(ctx.query.uploadId);

    if (ctx.method === "GET" && !key && ctx.query.uploads !== undefined) return listMultipartUploads(ctx, dir, bucket);
    if (key && uploadId !== undefined) {
      if (ctx.method === "GET") return listParts(ctx, dir, bucket, key, uploadId);
      if (ctx.method === "DELETE") return abortUpload(ctx, dir, bucket, key, uploadId);
      if ((ctx.method === "PUT" || ctx.method === "POST") && !(await readUpload(dir, bucket, uploadId))) {
        // s3rver would silently recreate the folder for a part of an aborted upload, and fail
        // with a 500 on completing one.
        return noSuchUpload(ctx, uploadId);
      }
    }
    return next();
  };
}
