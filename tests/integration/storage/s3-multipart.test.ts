/**
 * Browser-style multipart uploads against the S3 fake: the app hands out presigned part URLs,
 * plain fetch PUTs the slices (as a browser would, with an Origin), the ETags come back through
 * CORS, the app completes; abandoned uploads are listed and aborted.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createStorage, newObjectId, objectKey, planParts, type Storage } from "@/lib/storage";
import { startTestS3, type TestS3 } from "../support/fakes";
import { asBody, concat, pseudoRandomChunks, referenceSha256 } from "./bytes";

const ORIGIN = "http://localhost:3000";
let s3: TestS3;
let store: Storage;

beforeAll(async () => {
  s3 = await startTestS3({ origins: [ORIGIN, "http://127.0.0.1:3000"] });
  store = createStorage(s3.config);
});

afterAll(async () => {
  await s3?.stop();
});

async function putPart(url: string, body: Buffer): Promise<Response> {
  return fetch(url, { method: "PUT", body: asBody(body), headers: { origin: ORIGIN } });
}

describe("multipart upload from a browser", () => {
  it("uploads 12.5 MiB as presigned parts and completes with the ETags read through CORS", async () => {
    const file = concat(pseudoRandomChunks(12 * 1024 * 1024 + 512 * 1024, 17));
    const plan = planParts(file.length, 5 * 1024 * 1024);
    expect(plan.partCount).toBe(3);

    const key = objectKey("point_cloud", newObjectId());
    const upload = await store.createMultipartUpload(key, { contentType: "application/octet-stream" });
    const urls = await store.presignUploadParts({ ...upload, partNumbers: plan.parts.map((p) => p.partNumber) });

    const completed = [];
    // Sent out of order on purpose: browsers upload parts concurrently.
    for (const part of [...plan.parts].reverse()) {
      const res = await putPart(urls.find((u) => u.partNumber === part.partNumber)!.url, file.subarray(part.start, part.end));
      expect(res.status).toBe(200);
      // A browser can only read ETag when the bucket's CORS rule exposes it.
      expect(res.headers.get("access-control-expose-headers") ?? "").toMatch(/etag/i);
      const etag = res.headers.get("etag");
      expect(etag).toBeTruthy();
      completed.push({ partNumber: part.partNumber, etag: etag! });
    }
    await store.completeMultipartUpload({ ...upload, parts: completed });

    expect((await store.head(key))?.sizeBytes).toBe(file.length);
    expect(await store.sha256OfObject(key)).toEqual({ sha256: referenceSha256([file]), sizeBytes: file.length });
    // Completed uploads no longer count as in progress.
    const open = [];
    for await (const u of store.listMultipartUploads({ prefix: key })) open.push(u);
    expect(open).toEqual([]);
  });

  it("answers the browser's CORS preflight for a part PUT", async () => {
    const key = objectKey("point_cloud", newObjectId());
    const upload = await store.createMultipartUpload(key);
    const [part] = await store.presignUploadParts({ ...upload, partNumbers: [1] });
    const res = await fetch(part!.url, {
      method: "OPTIONS",
      headers: { origin: ORIGIN, "access-control-request-method": "PUT", "access-control-request-headers": "content-type" },
    });
    expect(res.status).toBe(200);
    expect(res.headers.get("access-control-allow-methods")).toContain("PUT");
    expect(res.headers.get("access-control-allow-headers")).toContain("content-type");
    await store.abortMultipartUpload(upload);
  });

  it("lists the parts that arrived, so an interrupted upload can resume", async () => {
    const key = objectKey("point_cloud", newObjectId());
    const upload = await store.createMultipartUpload(key);
    const [p1, , p3] = await store.presignUploadParts({ ...upload, partNumbers: [1, 2, 3] });
    const a = concat(pseudoRandomChunks(5 * 1024 * 1024, 1));
    const c = concat(pseudoRandomChunks(1000, 3));
    await putPart(p1!.url, a);
    await putPart(p3!.url, c);

    const parts = await store.listUploadedParts(upload);
    expect(parts.map((p) => [p.partNumber, p.sizeBytes])).toEqual([
      [1, a.length],
      [3, c.length],
    ]);
    expect(parts.every((p) => /^"?[0-9a-f]{32}"?$/.test(p.etag))).toBe(true);
    await store.abortMultipartUpload(upload);
  });

  it("refuses part numbers outside 1..10000 and duplicate parts", async () => {
    const ref = { key: objectKey("point_cloud", newObjectId()), uploadId: "x" };
    await expect(store.presignUploadParts({ ...ref, partNumbers: [0] })).rejects.toThrow(/part numbers/);
    await expect(
      store.completeMultipartUpload({ ...ref, parts: [{ partNumber: 2, etag: "a" }, { partNumber: 2, etag: "b" }] }),
    ).rejects.toThrow(/listed twice/);
  });
});

describe("abandoned uploads", () => {
  it("aborts uploads older than the cut-off and keeps recent ones", async () => {
    const prefix = `stale-${newObjectId()}/`;
    const older = await store.createMultipartUpload(`${prefix}a`);
    const alsoOld = await store.createMultipartUpload(`${prefix}b`);
    const [url] = await store.presignUploadParts({ ...alsoOld, partNumbers: [1] });
    await putPart(url!.url, Buffer.from("half a point cloud"));

    // Nothing here is a day old yet.
    const now = await store.abortStaleMultipartUploads({ olderThanHours: 24, prefix });
    expect(now.aborted).toEqual([]);
    expect(now.kept).toBe(2);

    // Seen from 25 hours later, both are abandoned.
    const later = new Date(Date.now() + 25 * 3600_000);
    const cleaned = await store.abortStaleMultipartUploads({ olderThanHours: 24, prefix, now: later });
    expect(cleaned.aborted.map((u) => u.uploadId).sort()).toEqual([older.uploadId, alsoOld.uploadId].sort());
    expect(cleaned.kept).toBe(0);

    const left = [];
    for await (const u of store.listMultipartUploads({ prefix })) left.push(u);
    expect(left).toEqual([]);
    // A late part for an aborted upload is refused, as S3 does.
    expect((await putPart(url!.url, Buffer.from("late"))).status).toBe(404);
    // Aborting again is harmless.
    await expect(store.abortMultipartUpload(older)).resolves.toBeUndefined();
  });

  it("lists more uploads than fit one page", async () => {
    const prefix = `many-${newObjectId()}/`;
    const made = [];
    for (let i = 0; i < 5; i++) made.push(await store.createMultipartUpload(`${prefix}${i}`));
    // The SDK pages with key and upload-id markers; the fake's page is 1000, so ask S3 directly
    // for small pages to exercise the markers.
    const { ListMultipartUploadsCommand } = await import("@aws-sdk/client-s3");
    const page1 = await store.target.client.send(new ListMultipartUploadsCommand({ Bucket: store.target.bucket, Prefix: prefix, MaxUploads: 2 }));
    expect(page1.IsTruncated).toBe(true);
    expect(page1.Uploads?.map((u) => u.Key)).toEqual([`${prefix}0`, `${prefix}1`]);
    const page2 = await store.target.client.send(
      new ListMultipartUploadsCommand({
        Bucket: store.target.bucket,
        Prefix: prefix,
        MaxUploads: 2,
        KeyMarker: page1.NextKeyMarker,
        UploadIdMarker: page1.NextUploadIdMarker,
      }),
    );
    expect(page2.Uploads?.map((u) => u.Key)).toEqual([`${prefix}2`, `${prefix}3`]);
    for (const u of made) await store.abortMultipartUpload(u);
  });
});
