/**
 * The cell computer's side of program delivery: download a job's toolpath, hashing the bytes
 * while they are written to a temporary file beside the target, and only rename it into place
 * when the SHA-256 matches the one the server announced. On any failure the partial file is
 * removed and a file already at the target is left as it was.
 */
import { createHash, randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { Readable, Transform } from "node:stream";
import { pipeline } from "node:stream/promises";
import type { ReadableStream as WebReadableStream } from "node:stream/web";

export type DownloadRequest = {
  /** Base URL of the app, e.g. http://127.0.0.1:3000 */
  url: string;
  token: string;
  job: string;
  port: "intake" | "exhaust";
  out: string;
  fetchImpl?: typeof fetch;
};

export type DownloadResult = {
  job: string;
  port: string;
  revision: string | null;
  sha256: string;
  bytes: number;
  out: string;
};

export type DownloadFailureKind = "refused" | "unreachable" | "no_checksum" | "mismatch" | "incomplete" | "write";

export class DownloadError extends Error {
  constructor(
    readonly kind: DownloadFailureKind,
    message: string,
    readonly detail: { status?: number; expected?: string; actual?: string; bytes?: number } = {},
  ) {
    super(message);
    this.name = "DownloadError";
  }
}

const SHA256_HEX = /^[0-9a-f]{64}$/;

export async function downloadProgram(req: DownloadRequest): Promise<DownloadResult> {
  const doFetch = req.fetchImpl ?? fetch;
  const endpoint = new URL("/api/machine/program", req.url);
  endpoint.searchParams.set("job", req.job);
  endpoint.searchParams.set("port", req.port);

  let res: Response;
  try {
    res = await doFetch(endpoint, { headers: { Authorization: `Bearer ${req.token}`, Accept: "application/octet-stream" } });
  } catch (err) {
    throw new DownloadError("unreachable", `could not reach ${endpoint.origin}: ${(err as Error).message}`);
  }
  if (!res.ok) {
    const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
    throw new DownloadError("refused", `the server refused (${res.status}): ${body?.error?.message ?? res.statusText}`, { status: res.status });
  }
  const expected = (res.headers.get("x-content-sha256") ?? "").toLowerCase();
  if (!SHA256_HEX.test(expected)) {
    await res.body?.cancel().catch(() => undefined);
    throw new DownloadError("no_checksum", "the server sent no SHA-256 for the program; refusing to write it");
  }
  const announcedLength = res.headers.get("content-length");
  if (!res.body) throw new DownloadError("incomplete", "the server sent no body");

  const out = path.resolve(req.out);
  const temp = path.join(path.dirname(out), `.${path.basename(out)}.${randomBytes(6).toString("hex")}.part`);
  const hash = createHash("sha256");
  let bytes = 0;
  const hashing = new Transform({
    transform(chunk: Buffer, _enc, done) {
      hash.update(chunk);
      bytes += chunk.length;
      done(null, chunk);
    },
  });
  try {
    try {
      await pipeline(Readable.fromWeb(res.body as unknown as WebReadableStream<Uint8Array>), hashing, fs.createWriteStream(temp, { flags: "wx" }));
    } catch (err) {
      const code = (err as NodeJS.ErrnoException).code;
      if (code && /^E[A-Z]+$/.test(code) && code !== "ECONNRESET") throw new DownloadError("write", `could not write ${temp}: ${(err as Error).message}`);
      throw new DownloadError("incomplete", `the download broke off after ${bytes} bytes: ${(err as Error).message}`, { bytes });
    }
    const actual = hash.digest("hex");
    if (announcedLength != null && Number(announcedLength) !== bytes) {
      throw new DownloadError("incomplete", `received ${bytes} bytes, the server announced ${announcedLength}`, { bytes, expected, actual });
    }
    if (actual !== expected) {
      throw new DownloadError("mismatch", `checksum mismatch: the server announced ${expected}, the bytes hash to ${actual}; the file was not kept`, { expected, actual, bytes });
    }
    fs.renameSync(temp, out);
    return { job: res.headers.get("x-portolan-job") ?? req.job, port: req.port, revision: res.headers.get("x-portolan-revision"), sha256: actual, bytes, out };
  } finally {
    fs.rmSync(temp, { force: true });
  }
}
