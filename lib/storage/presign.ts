/**
 * Presigned URLs let the browser move bytes straight to and from storage, so the app server
 * never carries a file. Note: the local fake does not check signatures, so scoping mistakes
 * (wrong key, wrong method) only show against a real S3.
 */
import { GetObjectCommand, PutObjectCommand } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import type { StorageTarget } from "./client";

export const DEFAULT_PUT_TTL_SECONDS = 15 * 60;
export const DEFAULT_GET_TTL_SECONDS = 5 * 60;
/** SigV4 presigned URLs cannot live longer than seven days. */
export const MAX_PRESIGN_TTL_SECONDS = 7 * 24 * 3600;

export type PresignedRequest = {
  url: string;
  method: "PUT" | "GET";
  /** Headers the browser must send exactly as given (they are part of the signature). */
  headers: Record<string, string>;
  expiresAt: Date;
};

function ttl(seconds: number | undefined, fallback: number): number {
  const value = seconds ?? fallback;
  if (!Number.isInteger(value) || value < 1 || value > MAX_PRESIGN_TTL_SECONDS) {
    throw new Error(`presigned URL lifetime must be 1..${MAX_PRESIGN_TTL_SECONDS} seconds`);
  }
  return value;
}

/** `attachment` with an ASCII fallback and the exact UTF-8 name (RFC 6266 / RFC 5987). */
export function attachmentDisposition(fileName: string): string {
  const fallback = fileName.replace(/[^\x20-\x7e]|["\\%;]/g, "_") || "download";
  const encoded = encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${fallback}"; filename*=UTF-8''${encoded}`;
}

/** A URL the browser can PUT one whole object to (files up to 5 GB; larger ones go multipart). */
export async function presignPut(
  t: StorageTarget,
  key: string,
  opts: { expiresInSeconds?: number; contentType?: string } = {},
): Promise<PresignedRequest> {
  const expiresIn = ttl(opts.expiresInSeconds, DEFAULT_PUT_TTL_SECONDS);
  const url = await getSignedUrl(t.client, new PutObjectCommand({ Bucket: t.bucket, Key: key, ContentType: opts.contentType }), { expiresIn });
  return {
    url,
    method: "PUT",
    headers: opts.contentType ? { "content-type": opts.contentType } : {},
    expiresAt: new Date(Date.now() + expiresIn * 1000),
  };
}

/** A URL to read one object; with `downloadName` the browser saves it under that name. */
export async function presignGet(
  t: StorageTarget,
  key: string,
  opts: { expiresInSeconds?: number; downloadName?: string; contentType?: string } = {},
): Promise<PresignedRequest> {
  const expiresIn = ttl(opts.expiresInSeconds, DEFAULT_GET_TTL_SECONDS);
  const url = await getSignedUrl(
    t.client,
    new GetObjectCommand({
      Bucket: t.bucket,
      Key: key,
      ResponseContentDisposition: opts.downloadName ? attachmentDisposition(opts.downloadName) : undefined,
      ResponseContentType: opts.contentType,
    }),
    { expiresIn },
  );
  return { url, method: "GET", headers: {}, expiresAt: new Date(Date.now() + expiresIn * 1000) };
}
