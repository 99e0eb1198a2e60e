/**
 * Starts the S3-compatible fake (storage-fake/s3-server.ts) as a child process and waits until
 * it answers. The legacy OpenSSL provider is switched on for that process only.
 */
import path from "node:path";
import { projectRoot, startReportingChild, type ChildService } from "./child";

export type S3FakeOptions = {
  /** 0 lets the OS choose; the fake reports the port it bound. */
  port?: number;
  host?: string;
  /** Objects are kept in this directory (created when missing). */
  directory: string;
  bucket?: string;
  /** Browser origins allowed by the bucket's CORS rule. */
  origins?: string[];
  echo?: boolean;
  startTimeoutMs?: number;
};

export type S3Fake = {
  url: string;
  port: number;
  bucket: string;
  directory: string;
  /** The well-known credentials s3rver accepts. */
  accessKeyId: string;
  secretAccessKey: string;
  service: ChildService;
  stop(): Promise<void>;
};

export const S3RVER_CREDENTIALS = { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" } as const;

export async function startS3Fake(opts: S3FakeOptions): Promise<S3Fake> {
  const host = opts.host ?? "127.0.0.1";
  const bucket = opts.bucket ?? "portolan";
  const directory = path.resolve(opts.directory);
  const args = [path.join(projectRoot, "storage-fake/s3-server.ts"), "--dir", directory, "--host", host, "--port", String(opts.port ?? 9310), "--bucket", bucket];
  for (const origin of opts.origins ?? []) args.push("--origin", origin);

  const { service, port } = await startReportingChild({
    name: "s3",
    what: "S3 fake",
    host,
    nodeArgs: ["--import", "tsx", ...args],
    // Appended so options the caller already gave Node keep working.
    env: { NODE_OPTIONS: `${process.env.NODE_OPTIONS ?? ""} --openssl-legacy-provider`.trim() },
    echo: opts.echo,
    startTimeoutMs: opts.startTimeoutMs,
  });
  return {
    url: `http://${host}:${port}`,
    port,
    bucket,
    directory,
    ...S3RVER_CREDENTIALS,
    service,
    stop: () => service.stop(),
  };
}
