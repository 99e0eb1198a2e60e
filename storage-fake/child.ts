/**
 * Runs one stand-in as a child process: keeps the tail of its output for error messages,
 * lets the caller react to each output line (to learn the port it bound), and stops it
 * politely (SIGTERM, then SIGKILL after a grace period) so no orphan keeps a port busy.
 */
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { httpAnswers, waitUntil } from "./net";

/** The repository root, found from this file's location (stand-ins run from any cwd). */
export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

export type ChildService = {
  name: string;
  pid: number;
  /** Exit code, or null when killed by a signal; pending while it runs. */
  exited: Promise<number | null>;
  /** Set once the process has ended. */
  hasExited(): boolean;
  /** The last lines it printed (stdout and stderr), for error messages. */
  recentOutput(): string;
  stop(graceMs?: number): Promise<void>;
};

export type SpawnOptions = {
  name: string;
  /** Arguments to `node` (script path first). */
  nodeArgs: string[];
  env?: Record<string, string | undefined>;
  onLine?: (line: string) => void;
  /** Echo the child's output to ours with a name prefix (the `npm run fakes` console). */
  echo?: boolean;
};

const KEEP_LINES = 40;

export function spawnNodeService(opts: SpawnOptions): ChildService {
  const child: ChildProcess = spawn(process.execPath, opts.nodeArgs, {
    cwd: projectRoot,
    env: { ...process.env, ...opts.env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  const lines: string[] = [];
  let ended = false;

  const collect = (stream: NodeJS.ReadableStream | null) => {
    let partial = "";
    stream?.setEncoding("utf8");
    stream?.on("data", (chunk: string) => {
      partial += chunk;
      const parts = partial.split("\n");
      partial = parts.pop() ?? "";
      for (const line of parts) {
        lines.push(line);
        if (lines.length > KEEP_LINES) lines.shift();
        if (opts.echo && line.trim()) process.stdout.write(`[${opts.name}] ${line}\n`);
        opts.onLine?.(line);
      }
    });
  };
  collect(child.stdout);
  collect(child.stderr);

  const exited = new Promise<number | null>((resolve) => {
    child.once("exit", (code) => {
      ended = true;
      resolve(code);
    });
    child.once("error", (err) => {
      ended = true;
      lines.push(String(err));
      resolve(1);
    });
  });

  return {
    name: opts.name,
    pid: child.pid ?? -1,
    exited,
    hasExited: () => ended,
    recentOutput: () => lines.join("\n"),
    async stop(graceMs = 5000) {
      if (ended) return;
      child.kill("SIGTERM");
      const timer = setTimeout(() => {
        if (!ended) child.kill("SIGKILL");
      }, graceMs);
      await exited;
      clearTimeout(timer);
    },
  };
}

/**
 * Spawns a stand-in that prints `{"event":"ready","port":N}` once it listens, and waits until
 * that port answers HTTP. Stops the child again when it does not come up.
 */
export async function startReportingChild(
  opts: SpawnOptions & { host: string; startTimeoutMs?: number; what: string },
): Promise<{ service: ChildService; port: number }> {
  let port: number | undefined;
  const service = spawnNodeService({
    ...opts,
    onLine: (line) => {
      opts.onLine?.(line);
      if (!line.startsWith("{")) return;
      try {
        const msg = JSON.parse(line) as { event?: string; port?: number };
        if (msg.event === "ready" && typeof msg.port === "number") port = msg.port;
      } catch {
        // an ordinary log line that happens to start with a brace
      }
    },
  });
  try {
    await waitUntil(async () => port !== undefined && (await httpAnswers(`http://${opts.host}:${port}/`)), `${opts.what} did not start`, {
      timeoutMs: opts.startTimeoutMs ?? 30_000,
      abort: () => (service.hasExited() ? `exited early:\n${service.recentOutput()}` : undefined),
    });
  } catch (err) {
    await service.stop();
    throw err;
  }
  return { service, port: port! };
}
