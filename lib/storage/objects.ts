/**
 * Whole objects: streamed in (multipart through lib-storage's Upload, hashed on the way),
 * streamed out, described, deleted and listed page by page.
 */
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
} from "@aws-sdk/client-s3";
import { Upload } from "@aws-sdk/lib-storage";
import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { hashingPassThrough } from "./checksum";
import type { StorageTarget } from "./client";
import { StorageChecksumMismatchError, translateError } from "./errors";

/** S3's smallest part (except the last); lib-storage refuses smaller ones. */
export const MIN_PART_BYTES = 5 * 1024 * 1024;
export const DEFAULT_PART_BYTES = 8 * 1024 * 1024;

export type PutBody = Readable | AsyncIterable<Uint8Array> | Uint8Array;

export type PutOptions = {
  contentType?: string;
  /** Stored with the object (x-amz-meta-*): keep to short ASCII values. */
  metadata?: Record<string, string>;
  /** Part size for the multipart upload (≥ 5 MiB). Memory in flight ≈ partSize × queueSize. */
  partSizeBytes?: number;
  queueSize?: number;
  /** When given, a different SHA-256 deletes the object again and throws. */
  expectedSha256?: string;
  onProgress?: (bytesSent: number) => void;
};

export type PutResult = { key: string; sha256: string; sizeBytes: number; etag?: string; partCount: number };

export type ObjectInfo = {
  key: string;
  sizeBytes: number;
  contentType?: string;
  etag?: string;
  lastModified?: Date;
  metadata: Record<string, string>;
};

export type ObjectSummary = { key: string; sizeBytes: number; etag?: string; lastModified?: Date };

function toReadable(body: PutBody): Readable {
  if (body instanceof Readable) return body;
  if (body instanceof Uint8Array) return Readable.from([body]);
  return Readable.from(body);
}

/** Streams `body` to `key` and returns its SHA-256 and size, computed from the bytes sent. */
export async function putStream(t: StorageTarget, key: string, body: PutBody, opts: PutOptions = {}): Promise<PutResult> {
  const partSize = opts.partSizeBytes ?? DEFAULT_PART_BYTES;
  if (partSize < MIN_PART_BYTES) throw new Error(`part size must be at least ${MIN_PART_BYTES} bytes`);
  const hashing = hashingPassThrough();
  const feeding = pipeline(toReadable(body), hashing);
  const upload = new Upload({
    client: t.client,
    params: { Bucket: t.bucket, Key: key, Body: hashing, ContentType: opts.contentType, Metadata: opts.metadata },
    partSize,
    queueSize: opts.queueSize ?? 4,
    leavePartsOnError: false,
  });
  let partCount = 0;
  upload.on("httpUploadProgress", (p) => {
    if (p.part) partCount = Math.max(partCount, p.part);
    if (p.loaded !== undefined) opts.onProgress?.(p.loaded);
  });

  let etag: string | undefined;
  try {
    const [done] = await Promise.all([
      upload.done().catch((err: unknown) => {
        // Unblock the source side, which would otherwise wait on a reader that is gone.
        hashing.destroy(err instanceof Error ? err : new Error(String(err)));
        throw err;
      }),
      feeding,
    ]);
    etag = done.ETag;
  } catch (err) {
    translateError(err);
  }
  const { sha256, sizeBytes } = hashing.digest();
  if (opts.expectedSha256 && opts.expectedSha256.toLowerCase() !== sha256) {
    await deleteObject(t, key);
    throw new StorageChecksumMismatchError(key, opts.expectedSha256.toLowerCase(), sha256, sizeBytes);
  }
  return { key, sha256, sizeBytes, etag, partCount: Math.max(partCount, 1) };
}

export type GetResult = ObjectInfo & { body: Readable };

/** The object's bytes as a Node stream (optionally a byte range, `end` inclusive). */
export async function getStream(t: StorageTarget, key: string, range?: { start: number; end?: number }): Promise<GetResult> {
  try {
    const out = await t.client.send(
      new GetObjectCommand({ Bucket: t.bucket, Key: key, Range: range ? `bytes=${range.start}-${range.end ?? ""}` : undefined }),
    );
    if (!(out.Body instanceof Readable)) throw new Error("expected a Node stream from the S3 client");
    return {
      key,
      body: out.Body,
      sizeBytes: out.ContentLength ?? 0,
      contentType: out.ContentType,
      etag: out.ETag,
      lastModified: out.LastModified,
      metadata: out.Metadata ?? {},
    };
  } catch (err) {
    translateError(err, key);
  }
}

/** What the store knows about `key`, or null when there is no such object. */
export async function headObject(t: StorageTarget, key: string): Promise<ObjectInfo | null> {
  try {
    const out = await t.client.send(new HeadObjectCommand({ Bucket: t.bucket, Key: key }));
    return { key, sizeBytes: out.ContentLength ?? 0, contentType: out.ContentType, etag: out.ETag, lastModified: out.LastModified, metadata: out.Metadata ?? {} };
  } catch (err) {
    if ((err as { name?: string }).name === "NotFound" || (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null;
    translateError(err);
  }
}

/** Removes `key`; removing an object that is not there is not an error (S3 semantics). */
export async function deleteObject(t: StorageTarget, key: string): Promise<void> {
  try {
    await t.client.send(new DeleteObjectCommand({ Bucket: t.bucket, Key: key }));
  } catch (err) {
    translateError(err);
  }
}

export type ListPage = { objects: ObjectSummary[]; nextToken?: string };

/** One page of keys under `prefix`, in key order; pass `nextToken` back for the next page. */
export async function listObjectsPage(
  t: StorageTarget,
  opts: { prefix?: string; pageSize?: number; token?: string } = {},
): Promise<ListPage> {
  try {
    const out = await t.client.send(
      new ListObjectsV2Command({ Bucket: t.bucket, Prefix: opts.prefix, MaxKeys: opts.pageSize ?? 1000, ContinuationToken: opts.token }),
    );
    return {
      objects: (out.Contents ?? []).map((o) => ({ key: o.Key!, sizeBytes: o.Size ?? 0, etag: o.ETag, lastModified: o.LastModified })),
      nextToken: out.IsTruncated ? out.NextContinuationToken : undefined,
    };
  } catch (err) {
    translateError(err);
  }
}

/** Every object under `prefix`, fetched a page at a time. */
export async function* listObjects(t: StorageTarget, opts: { prefix?: string; pageSize?: number } = {}): AsyncGenerator<ObjectSummary> {
  let token: string | undefined;
  do {
    const page = await listObjectsPage(t, { ...opts, token });
    yield* page.objects;
    token = page.nextToken;
  } while (token);
}
