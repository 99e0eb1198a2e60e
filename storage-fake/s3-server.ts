/**
 * Child-process entry of the S3-compatible fake: s3rver 3.7.1 serving a directory, the bucket
 * created (with the app's CORS rule) before it listens, and the multipart operations s3rver
 * lacks added in front of its router.
 *
 *   node --openssl-legacy-provider --import tsx storage-fake/s3-server.ts \
 *     --dir data/s3 --port 9310 --bucket portolan [--origin http://localhost:3000 ...]
 *
 * Prints one JSON line `{"event":"ready","port":N}` when it listens (port 0 picks a free one).
 * Started by storage-fake/s3.ts; it never imports the app's code.
 */
import crypto from "node:crypto";
import { mkdirSync } from "node:fs";
import type { Server } from "node:http";
import { createRequire } from "node:module";
import path from "node:path";
import { parseArgs } from "node:util";
import { corsConfigurationXml, DEFAULT_APP_ORIGINS } from "./s3-cors";
import { multipartExtras, type KoaLikeMiddleware } from "./s3-multipart-extras";

type S3rverInstance = {
  middleware: KoaLikeMiddleware[];
  run(): Promise<{ address: string; port: number }>;
  close(): Promise<void>;
  httpServer?: Server;
};
type S3rverConstructor = new (options: Record<string, unknown>) => S3rverInstance;

/** s3rver encrypts ListObjectsV2 continuation tokens with DES, which needs the legacy provider. */
function desAvailable(): boolean {
  try {
    crypto.createCipheriv("des", Buffer.alloc(8), Buffer.alloc(8));
    return true;
  } catch {
    return false;
  }
}

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: {
      dir: { type: "string" },
      host: { type: "string", default: "127.0.0.1" },
      port: { type: "string", default: "9310" },
      bucket: { type: "string", default: "portolan" },
      origin: { type: "string", multiple: true },
    },
  });
  if (!values.dir) throw new Error("--dir is required (where the fake keeps its objects)");
  if (!desAvailable()) {
    throw new Error("DES is unavailable: start this process with NODE_OPTIONS=--openssl-legacy-provider (listings past one page fail otherwise)");
  }
  const directory = path.resolve(values.dir);
  mkdirSync(directory, { recursive: true });

  const S3rver = createRequire(import.meta.url)("s3rver") as S3rverConstructor;
  const server = new S3rver({
    directory,
    address: values.host,
    port: Number(values.port),
    silent: true,
    vhostBuckets: false,
    configureBuckets: [{ name: values.bucket, configs: [corsConfigurationXml(values.origin?.length ? values.origin : DEFAULT_APP_ORIGINS)] }],
  });
  // Koa composes `middleware` when the server starts listening: ours must run before the router.
  server.middleware.unshift(multipartExtras(directory));
  const { port } = await server.run();
  process.stdout.write(`${JSON.stringify({ event: "ready", service: "s3", port })}\n`);

  const shutdown = () => {
    server.httpServer?.closeAllConnections();
    server.close().finally(() => process.exit(0));
    setTimeout(() => process.exit(0), 2000).unref();
  };
  process.once("SIGTERM", shutdown);
  process.once("SIGINT", shutdown);
}

main().catch((err: unknown) => {
  process.stderr.write(`s3 fake: ${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});
