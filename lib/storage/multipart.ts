/**
 * Browser multipart uploads straight to storage: the app opens the upload, hands out one
 * presigned URL per part, and completes it with the ETags the browser read back (the bucket's
 * CORS rule exposes ETag). Uploads nobody completes keep their parts (and cost) until aborted,
 * so abortStaleMultipartUploads is meant to run on a schedule.
 */
import {
  AbortMultipartUploadCommand,
  CompleteMultipartUploadCommand,
  CreateMultipartUploadCommand,
  ListMultipartUploadsCommand,
  ListPartsCommand,
  UploadPartCommand,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import type { StorageTarget } from "./client";
import { isNotFound, translateError } from "./errors";
import { S3_MAX_PARTS } from "./parts";
import { DEFAULT_PUT_TTL_SECONDS, MAX_PRESIGN_TTL_SECONDS } from "./presign";

export type MultipartRef = { key: string; uploadId: string };
export type CompletedPart = { partNumber: number; etag: string };
export type UploadedPart = CompletedPart & { sizeBytes: number };
export type MultipartUploadInfo = MultipartRef & { initiated: Date };

export async function createMultipartUpload(t: StorageTarget, key: string, opts: { contentType?: string } = {}): Promise<MultipartRef> {
  try {
    const out = await t.client.send(new CreateMultipartUploadCommand({ Bucket: t.bucket, Key: key, ContentType: opts.contentType }));
    if (!out.UploadId) throw new Error("storage did not return an upload id");
    return { key, uploadId: out.UploadId };
  } catch (err) {
    translateError(err);
  }
}

function checkPartNumber(n: number): void {
  if (!Number.isInteger(n) || n < 1 || n > S3_MAX_PARTS) throw new Error(`part numbers run from 1 to ${S3_MAX_PARTS}, got ${n}`);
}

/** One presigned PUT URL per requested part (hand out a batch at a time for big files). */
export async function presignUploadParts(
  t: StorageTarget,
  ref: MultipartRef & { partNumbers: number[]; expiresInSeconds?: number },
): Promise<Array<{ partNumber: number; url: string }>> {
  const expiresIn = ref.expiresInSeconds ?? DEFAULT_PUT_TTL_SECONDS;
  if (expiresIn < 1 || expiresIn > MAX_PRESIGN_TTL_SECONDS) throw new Error("presigned URL lifetime out of range");
  ref.partNumbers.forEach(checkPartNumber);
  return Promise.all(
    ref.partNumbers.map(async (partNumber) => ({
      partNumber,
      url: await getSignedUrl(t.client, new UploadPartCommand({ Bucket: t.bucket, Key: ref.key, UploadId: ref.uploadId, PartNumber: partNumber }), {
        expiresIn,
      }),
    })),
  );
}

/** Joins the parts into the object. Parts may come in any order; each number at most once. */
export async function completeMultipartUpload(t: StorageTarget, ref: MultipartRef & { parts: CompletedPart[] }): Promise<{ key: string; etag?: string }> {
  if (ref.parts.length === 0) throw new Error("a multipart upload needs at least one part");
  const sorted = [...ref.parts].sort((a, b) => a.partNumber - b.partNumber);
  sorted.forEach((p, i) => {
    checkPartNumber(p.partNumber);
    if (i > 0 && sorted[i - 1]!.partNumber === p.partNumber) throw new Error(`part ${p.partNumber} listed twice`);
    if (!p.etag) throw new Error(`part ${p.partNumber} has no ETag`);
  });
  try {
    const out = await t.client.send(
      new CompleteMultipartUploadCommand({
        Bucket: t.bucket,
        Key: ref.key,
        UploadId: ref.uploadId,
        MultipartUpload: { Parts: sorted.map((p) => ({ PartNumber: p.partNumber, ETag: p.etag })) },
      }),
    );
    return { key: ref.key, etag: out.ETag };
  } catch (err) {
    translateError(err, ref.key);
  }
}

/** Drops an upload and its parts; an upload that is already gone counts as dropped. */
export async function abortMultipartUpload(t: StorageTarget, ref: MultipartRef): Promise<void> {
  try {
    await t.client.send(new AbortMultipartUploadCommand({ Bucket: t.bucket, Key: ref.key, UploadId: ref.uploadId }));
  } catch (err) {
    if (isNotFound(err)) return;
    translateError(err);
  }
}

/** The parts that have arrived so far, to resume an interrupted upload. */
export async function listUploadedParts(t: StorageTarget, ref: MultipartRef): Promise<UploadedPart[]> {
  const parts: UploadedPart[] = [];
  let marker: string | undefined;
  try {
    for (;;) {
      const out = await t.client.send(new ListPartsCommand({ Bucket: t.bucket, Key: ref.key, UploadId: ref.uploadId, PartNumberMarker: marker }));
      for (const p of out.Parts ?? []) parts.push({ partNumber: p.PartNumber!, etag: p.ETag ?? "", sizeBytes: p.Size ?? 0 });
      if (!out.IsTruncated || !out.NextPartNumberMarker) break;
      marker = out.NextPartNumberMarker;
    }
  } catch (err) {
    translateError(err, ref.key);
  }
  return parts;
}

/** Multipart uploads begun and neither completed nor aborted, in key order. */
export async function* listMultipartUploads(t: StorageTarget, opts: { prefix?: string } = {}): AsyncGenerator<MultipartUploadInfo> {
  let keyMarker: string | undefined;
  let uploadIdMarker: string | undefined;
  for (;;) {
    let out;
    try {
      out = await t.client.send(
        new ListMultipartUploadsCommand({ Bucket: t.bucket, Prefix: opts.prefix, KeyMarker: keyMarker, UploadIdMarker: uploadIdMarker }),
      );
    } catch (err) {
      translateError(err);
    }
    for (const u of out.Uploads ?? []) {
      if (u.Key && u.UploadId) yield { key: u.Key, uploadId: u.UploadId, initiated: u.Initiated ?? new Date(0) };
    }
    if (!out.IsTruncated) return;
    keyMarker = out.NextKeyMarker;
    uploadIdMarker = out.NextUploadIdMarker;
  }
}

export type StaleCleanup = { aborted: MultipartUploadInfo[]; kept: number };

/** Aborts uploads begun more than `olderThanHours` before `now`: abandoned browser uploads. */
export async function abortStaleMultipartUploads(
  t: StorageTarget,
  opts: { olderThanHours: number; prefix?: string; now?: Date },
): Promise<StaleCleanup> {
  if (!(opts.olderThanHours > 0)) throw new Error("olderThanHours must be positive");
  const cutoff = (opts.now ?? new Date()).getTime() - opts.olderThanHours * 3600_000;
  // Listed first, aborted after: aborting while paging would shift the listing's markers.
  const stale: MultipartUploadInfo[] = [];
  let kept = 0;
  for await (const upload of listMultipartUploads(t, { prefix: opts.prefix })) {
    if (upload.initiated.getTime() < cutoff) stale.push(upload);
    else kept++;
  }
  for (const upload of stale) await abortMultipartUpload(t, upload);
  return { aborted: stale, kept };
}
