/**
 * `portolan audit verify`: walks the whole audit chain in the database at DATABASE_PATH and
 * names the first event whose link or content does not match.
 * Exit codes: 0 intact, 1 broken (or the database could not be opened), 2 usage.
 */
import fs from "node:fs";
import { parseArgs } from "node:util";
import { openDatabase } from "@/db/client";
import { verifyAuditChain } from "../audit/verify";
import { readEnv } from "../env";
import type { CliIo } from "./io";

const USAGE = `usage:
  portolan audit verify [--db FILE] [--json]
    --db  the SQLite file (default: $DATABASE_PATH, else $DATA_DIR/portolan.db)`;

export async function run(args: string[], io: CliIo): Promise<number> {
  const [command, ...rest] = args;
  if (command !== "verify") {
    io.err(USAGE);
    return 2;
  }
  let values: { db?: string; json?: boolean };
  try {
    ({ values } = parseArgs({ args: rest, options: { db: { type: "string" }, json: { type: "boolean" } }, allowPositionals: false }));
  } catch (err) {
    io.err(`portolan audit verify: ${(err as Error).message}\n${USAGE}`);
    return 2;
  }
  const file = values.db ?? readEnv().DATABASE_PATH;
  if (!fs.existsSync(file)) {
    const message = `no database at ${file}`;
    if (values.json) io.out(JSON.stringify({ ok: false, events: 0, reason: message }));
    else io.err(`portolan audit verify: ${message}`);
    return 1;
  }
  const db = openDatabase(file);
  try {
    const report = verifyAuditChain(db.$client);
    if (values.json) {
      io.out(JSON.stringify(report.ok ? { ok: true, events: report.events, lastHash: report.lastHash } : report));
    } else if (report.ok) {
      io.out(`audit chain intact: ${report.events} events, last hash ${report.lastHash || "(none)"}`);
    } else {
      io.out(`audit chain BROKEN at event #${report.brokenAt}: ${report.reason} (${report.events} events read)`);
    }
    return report.ok ? 0 : 1;
  } finally {
    db.$client.close();
  }
}
