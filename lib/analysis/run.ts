/**
 * The analysis child process: `node --import tsx lib/analysis/run.ts --analysis-id 12
 * [--database path]`. It runs one claimed analysis off the web server's event loop and exits
 * 0 when the row ended done or failed (the row carries the engine's message), 1 when it could
 * not even start.
 */
import path from "node:path";
import { fileURLToPath } from "node:url";
import { parseArgs } from "node:util";
import { db as defaultDb, openDatabase } from "@/db/client";
import { storage } from "../storage";
import { runAnalysis } from "./runner";

export async function runFromArgs(argv: string[]): Promise<number> {
  const { values } = parseArgs({ args: argv, options: { "analysis-id": { type: "string" }, database: { type: "string" }, claimed: { type: "boolean", default: false } } });
  const id = Number(values["analysis-id"]);
  if (!Number.isInteger(id) || id <= 0) {
    process.stderr.write("usage: run.ts --analysis-id <id> [--database <file>] [--claimed]\n");
    return 2;
  }
  const db = values.database ? openDatabase(values.database) : defaultDb();
  const outcome = await runAnalysis(db, storage(), id, { claimed: values.claimed });
  process.stdout.write(`${JSON.stringify(outcome)}\n`);
  db.$client.close();
  return 0;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  runFromArgs(process.argv.slice(2)).then(
    (code) => process.exit(code),
    (err: unknown) => {
      process.stderr.write(`analysis: ${err instanceof Error ? err.message : String(err)}\n`);
      process.exit(1);
    },
  );
}
