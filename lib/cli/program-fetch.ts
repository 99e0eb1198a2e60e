/**
 * `portolan program fetch`: the cell computer downloads a job's program with its machine token,
 * and the file is only kept when its SHA-256 matches the one the server recorded. Dispatched
 * from `lib/cli/program.ts` (the program group also holds the library's commands).
 * Exit codes: 0 ok, 1 refused (server refusal, checksum mismatch, broken download), 2 usage.
 */
import { parseArgs } from "node:util";
import { DownloadError, downloadProgram } from "../delivery/download";
import type { CliIo } from "./io";

export const FETCH_USAGE = `usage:
  portolan program fetch --job NUMBER --port intake|exhaust --out FILE [--url URL] [--token TOKEN] [--json]
    --url    the app's address (default: $APP_URL, else http://127.0.0.1:3000)
    --token  the machine token (default: $PORTOLAN_MACHINE_TOKEN; prefer the variable, a flag shows in the process list)`;

const USAGE = FETCH_USAGE;

/** `args` are the words after `program fetch`. */
export async function runFetch(rest: string[], io: CliIo, fetchImpl?: typeof fetch): Promise<number> {
  let values: Record<string, string | boolean | undefined>;
  try {
    ({ values } = parseArgs({
      args: rest,
      options: { job: { type: "string" }, port: { type: "string" }, out: { type: "string" }, url: { type: "string" }, token: { type: "string" }, json: { type: "boolean" } },
      allowPositionals: false,
    }));
  } catch (err) {
    io.err(`portolan program fetch: ${(err as Error).message}\n${USAGE}`);
    return 2;
  }
  const json = values.json === true;
  const job = values.job as string | undefined;
  const port = values.port as string | undefined;
  const out = values.out as string | undefined;
  const url = (values.url as string | undefined) ?? process.env.APP_URL ?? "http://127.0.0.1:3000";
  const token = (values.token as string | undefined) ?? process.env.PORTOLAN_MACHINE_TOKEN;
  const problems = [
    !job && "--job is required",
    port !== "intake" && port !== "exhaust" && "--port must be intake or exhaust",
    !out && "--out is required",
    !token && "a machine token is required (--token or $PORTOLAN_MACHINE_TOKEN)",
  ].filter(Boolean);
  try {
    new URL(url);
  } catch {
    problems.push(`--url is not a URL: ${url}`);
  }
  if (problems.length) {
    io.err(`portolan program fetch: ${problems.join("; ")}\n${USAGE}`);
    return 2;
  }
  try {
    const result = await downloadProgram({ url, token: token!, job: job!, port: port as "intake" | "exhaust", out: out!, fetchImpl });
    if (json) io.out(JSON.stringify({ ok: true, ...result }));
    else io.out(`${result.out}: ${result.revision ?? "program"} for job ${result.job} (${result.port}), ${result.bytes} bytes, sha256 ${result.sha256} verified`);
    return 0;
  } catch (err) {
    if (!(err instanceof DownloadError)) throw err;
    if (json) io.out(JSON.stringify({ ok: false, error: err.kind, message: err.message, ...err.detail }));
    else io.err(`portolan program fetch: ${err.message}`);
    return 1;
  }
}
