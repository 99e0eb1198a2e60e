/**
 * Storage failures as AppErrors (the route layer turns them into answers a person can act on);
 * the technical reason stays in `detail` for the log.
 */
import { AppError } from "../errors";

export class StorageObjectNotFoundError extends AppError {
  constructor(readonly key: string) {
    super("not_found", "The stored file was not found.");
    this.name = "StorageObjectNotFoundError";
  }
}

/** The bytes read back do not hash to the SHA-256 recorded for them. */
export class StorageChecksumMismatchError extends AppError {
  constructor(
    readonly key: string,
    readonly expectedSha256: string,
    readonly actualSha256: string,
    readonly sizeBytes: number,
  ) {
    super("conflict", "The stored file does not match the checksum recorded for it; it may be damaged or replaced.");
    this.name = "StorageChecksumMismatchError";
  }
}

export class StorageUnavailableError extends AppError {
  constructor(
    readonly detail: string,
    options?: { cause?: unknown },
  ) {
    super("unavailable", "File storage could not be reached. Try again in a few minutes.");
    this.name = "StorageUnavailableError";
    if (options?.cause !== undefined) (this as { cause?: unknown }).cause = options.cause;
  }
}

type SdkError = { name?: string; code?: string; message?: string; $metadata?: { httpStatusCode?: number }; cause?: unknown; errors?: unknown[] };

/** HTTP status of an SDK error, when the server answered at all. */
export function httpStatusOf(err: unknown): number | undefined {
  return (err as SdkError | null)?.$metadata?.httpStatusCode;
}

export function isNotFound(err: unknown): boolean {
  const e = err as SdkError | null;
  return e?.name === "NoSuchKey" || e?.name === "NotFound" || e?.name === "NoSuchUpload" || httpStatusOf(err) === 404;
}

/** A network-level code (ECONNREFUSED, …) anywhere in the error's cause chain. */
export function networkCodeOf(err: unknown): string | undefined {
  const seen = new Set<unknown>();
  const queue: unknown[] = [err];
  while (queue.length) {
    const e = queue.shift() as SdkError | null;
    if (!e || typeof e !== "object" || seen.has(e)) continue;
    seen.add(e);
    if (typeof e.code === "string" && /^E[A-Z]+/.test(e.code)) return e.code;
    queue.push(e.cause, ...(Array.isArray(e.errors) ? e.errors : []));
  }
  return undefined;
}

/** Rethrows an SDK failure as one of ours when we can say what happened. */
export function translateError(err: unknown, key?: string): never {
  if (key !== undefined && isNotFound(err)) throw new StorageObjectNotFoundError(key);
  const code = networkCodeOf(err);
  if (code) throw new StorageUnavailableError(`storage request failed: ${code}`, { cause: err });
  throw err;
}
