/**
 * The S3 client for one bucket. Checksums are only computed and validated WHEN_REQUIRED: with
 * the SDK's default, a streamed PutObject goes out `aws-chunked` with a CRC32 trailer, and
 * S3-compatible servers that do not speak that encoding (the local fake among them) store the
 * chunk framing inside the object and still answer 200. Presigned PUT URLs made with the
 * default also carry an empty-body CRC32 that a browser's upload then fails. Our own SHA-256,
 * computed while streaming, is what proves a file's integrity.
 */
import { S3Client } from "@aws-sdk/client-s3";
import type { StorageConfig } from "./config";

export type StorageTarget = {
  readonly config: StorageConfig;
  readonly bucket: string;
  readonly client: S3Client;
  /** One attempt, no retries: a health check must answer quickly. */
  readonly probeClient: S3Client;
};

function makeClient(config: StorageConfig, maxAttempts: number): S3Client {
  return new S3Client({
    endpoint: config.endpoint,
    region: config.region,
    forcePathStyle: config.forcePathStyle,
    credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    maxAttempts,
  });
}

export function createStorageTarget(config: StorageConfig): StorageTarget {
  return { config, bucket: config.bucket, client: makeClient(config, 3), probeClient: makeClient(config, 1) };
}
