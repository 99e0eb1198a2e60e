/** Health check of the storage: is the bucket reachable with our credentials, and how fast. */
import { HeadBucketCommand } from "@aws-sdk/client-s3";
import type { StorageTarget } from "./client";
import { httpStatusOf, networkCodeOf } from "./errors";

/** Same shape as the health route's checks: ok, or not ok with the reason. */
export type StorageCheck = { ok: boolean; message?: string };

export const STORAGE_CHECK_TIMEOUT_MS = 3_000;

export async function checkStorage(t: StorageTarget, timeoutMs = STORAGE_CHECK_TIMEOUT_MS): Promise<StorageCheck> {
  const { endpoint } = t.config;
  const started = Date.now();
  try {
    await t.probeClient.send(new HeadBucketCommand({ Bucket: t.bucket }), { abortSignal: AbortSignal.timeout(timeoutMs) });
    return { ok: true, message: `bucket ${t.bucket} at ${endpoint} answered in ${Date.now() - started} ms` };
  } catch (err) {
    const status = httpStatusOf(err);
    const name = (err as { name?: string }).name;
    const code = networkCodeOf(err);
    let reason: string;
    if (name === "AbortError" || name === "TimeoutError" || code === "ETIMEDOUT") reason = `no answer from ${endpoint} within ${timeoutMs} ms`;
    else if (code === "ECONNREFUSED") reason = `cannot reach ${endpoint} (connection refused)`;
    else if (code === "ENOTFOUND" || code === "EAI_AGAIN") reason = `cannot resolve the host of ${endpoint}`;
    else if (code) reason = `cannot reach ${endpoint} (${code})`;
    else if (status === 404 || name === "NotFound" || name === "NoSuchBucket") reason = `bucket ${t.bucket} does not exist at ${endpoint}`;
    else if (status === 403 || status === 401) reason = `access to bucket ${t.bucket} was refused (check the S3 access key and secret)`;
    else reason = `${endpoint}: ${status ? `HTTP ${status} ` : ""}${(err as Error).message || name || "unknown error"}`;
    return { ok: false, message: `storage: ${reason}` };
  }
}
