/**
 * `portolan storage …`: housekeeping of the file store.
 *   sweep [--older-than-hours 24] [--json]   abort and forget uploads abandoned half-way
 *   verify --file-id N [--json]              re-hash a stored file against its recorded SHA-256
 * Exit codes: 0 ok, 1 a file failed verification or storage refused, 2 usage.
 */
import { parseArgs } from "node:util";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { storedFiles } from "@/db/schema";
import { storage, StorageChecksumMismatchError } from "../storage";
import { sweepAbandonedUploads } from "../uploads/sessions";
import type { CliIo } from "./io";

const USAGE = "usage: portolan storage sweep [--older-than-hours 24] [--json] | storage verify --file-id <id> [--json]";

export async function run(args: string[], io: CliIo): Promise<number> {
  const [command, ...rest] = args;
  let values: Record<string, string | boolean | undefined>;
  try {
    ({ values } = parseArgs({ args: rest, options: { "older-than-hours": { type: "string" }, "file-id": { type: "string" }, json: { type: "boolean", default: false } } }));
  } catch (err) {
    io.err(`${(err as Error).message}\n${USAGE}`);
    return 2;
  }
  if (command === "sweep") {
    const hours = values["older-than-hours"] === undefined ? 24 : Number(values["older-than-hours"]);
    if (!(hours > 0)) {
      io.err(`--older-than-hours must be a positive number\n${USAGE}`);
      return 2;
    }
    const result = await sweepAbandonedUploads(db(), storage(), { olderThanHours: hours });
    if (values.json) io.out(JSON.stringify({ olderThanHours: hours, ...result }));
    else io.out(`removed ${result.rowsRemoved} abandoned uploads (${result.uploadsAborted} multipart uploads aborted), aborted ${result.orphanUploadsAborted} more without a record`);
    return 0;
  }
  if (command === "verify") {
    const id = Number(values["file-id"]);
    if (!Number.isInteger(id) || id <= 0) {
      io.err(`--file-id must be a file's id\n${USAGE}`);
      return 2;
    }
    const file = db().select().from(storedFiles).where(eq(storedFiles.id, id)).get();
    if (!file || !file.sha256) {
      io.err(`file ${id} is not a stored file with a checksum`);
      return 1;
    }
    try {
      const digest = await storage().verifyObject(file.storageKey, file.sha256);
      if (values.json) io.out(JSON.stringify({ fileId: id, ok: true, sha256: digest.sha256, sizeBytes: digest.sizeBytes }));
      else io.out(`file ${id} (${file.originalName}) matches its SHA-256 ${digest.sha256}`);
      return 0;
    } catch (err) {
      if (!(err instanceof StorageChecksumMismatchError)) throw err;
      if (values.json) io.out(JSON.stringify({ fileId: id, ok: false, expected: err.expectedSha256, actual: err.actualSha256, sizeBytes: err.sizeBytes }));
      else io.err(`file ${id} (${file.originalName}) does NOT match: recorded ${err.expectedSha256}, read ${err.actualSha256}`);
      return 1;
    }
  }
  io.err(USAGE);
  return 2;
}
