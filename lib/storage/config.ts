/** Storage settings, taken from the app's configuration (lib/env.ts) so tests can pass their own. */
import { env, type Env } from "../env";

export type StorageConfig = {
  /** S3 endpoint URL; a hosted S3 or the local fake. */
  endpoint: string;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** Path-style URLs (`endpoint/bucket/key`); needed by the local fake and most self-hosted S3s. */
  forcePathStyle: boolean;
};

export function storageConfigFromEnv(e: Env = env()): StorageConfig {
  return {
    endpoint: e.S3_ENDPOINT,
    region: e.S3_REGION,
    bucket: e.S3_BUCKET,
    accessKeyId: e.S3_ACCESS_KEY_ID,
    secretAccessKey: e.S3_SECRET_ACCESS_KEY,
    forcePathStyle: e.S3_FORCE_PATH_STYLE,
  };
}
