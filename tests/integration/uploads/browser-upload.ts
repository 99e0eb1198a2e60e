/**
 * What the browser's uploader does, replayed with fetch: start the upload at the app, PUT each
 * part to its presigned URL (reading the ETag the bucket's CORS exposes), then complete.
 */
import { expect } from "vitest";
import { POST as start } from "@/app/api/uploads/route";
import { POST as complete } from "@/app/api/uploads/[id]/complete/route";
import { POST as moreParts } from "@/app/api/uploads/[id]/parts/route";
import { json, params, request, type TestUser } from "../support/app";

export type Started = { fileId: number; partSizeBytes: number; partCount: number; parts: Array<{ partNumber: number; url: string }> };

export async function startUploadAs(user: TestUser, body: Record<string, unknown>) {
  return json<Started & { error?: { code: string; message: string } }>(await start(await request("/api/uploads", { as: user, json: body }), params({})));
}

export async function putParts(user: TestUser, started: Started, bytes: Uint8Array): Promise<Array<{ partNumber: number; etag: string }>> {
  let urls = started.parts;
  if (urls.length < started.partCount) {
    const missing = Array.from({ length: started.partCount - urls.length }, (_, i) => urls.length + i + 1);
    const more = await json(await moreParts(await request(`/api/uploads/${started.fileId}/parts`, { as: user, json: { partNumbers: missing } }), params({ id: String(started.fileId) })));
    urls = [...urls, ...more.body.parts];
  }
  const out: Array<{ partNumber: number; etag: string }> = [];
  for (const { partNumber, url } of urls) {
    const begin = (partNumber - 1) * started.partSizeBytes;
    const res = await fetch(url, { method: "PUT", body: bytes.slice(begin, Math.min(bytes.length, begin + started.partSizeBytes)) });
    expect(res.status).toBe(200);
    out.push({ partNumber, etag: res.headers.get("etag")! });
  }
  return out;
}

export async function completeAs(user: TestUser, fileId: number, parts: Array<{ partNumber: number; etag: string }>) {
  return json(await complete(await request(`/api/uploads/${fileId}/complete`, { as: user, json: { parts } }), params({ id: String(fileId) })));
}

/** The whole browser sequence; returns the completion's answer. */
export async function uploadAs(user: TestUser, body: Record<string, unknown>, bytes: Uint8Array) {
  const started = await startUploadAs(user, { ...body, sizeBytes: bytes.length });
  expect(started.status).toBe(201);
  const parts = await putParts(user, started.body, bytes);
  return { fileId: started.body.fileId, partCount: started.body.partCount, ...(await completeAs(user, started.body.fileId, parts)) };
}
