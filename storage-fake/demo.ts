#!/usr/bin/env tsx
/**
 * `npm run demo`: the whole product on one machine — the local stand-ins, a migrated and seeded
 * SQLite file, a production build of the app — with the URL and demo sign-ins printed, and
 * everything stopped cleanly on Ctrl-C.
 *
 *   npm run demo -- [--port 3000] [--data-dir data] [--no-build]
 *
 * startStack() is the same sequence for the browser tests (fresh data dir, free ports).
 * Like the stand-ins, this file runs the app as separate processes and never imports its code.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { parseArgs } from "node:util";
import { projectRoot } from "./child";
import { findFreePort, isPortFree } from "./net";
import { startFakes, type RunningFakes } from "./start";

const HOST = "127.0.0.1";

export type StackOptions = {
  port?: number;
  dataDir?: string;
  build?: boolean;
  /** Use free ports for every stand-in (tests); the demo uses the documented fixed ports. */
  freePorts?: boolean;
  /** Print the stand-ins' own log lines. */
  echo?: boolean;
  /** Show migrate/seed/build/app output (the demo does; tests keep it for failures only). */
  showSteps?: boolean;
  extraEnv?: Record<string, string>;
};

export type RunningStack = {
  url: string;
  env: Record<string, string>;
  fakes: RunningFakes;
  stop(): Promise<void>;
};

function loadOrCreateSecret(dataDir: string): string {
  const file = path.join(dataDir, ".nextauth-secret");
  if (fs.existsSync(file)) return fs.readFileSync(file, "utf8").trim();
  const secret = randomBytes(32).toString("base64url");
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

function runStep(label: string, args: string[], env: Record<string, string>, echo: boolean): void {
  if (echo) process.stdout.write(`… ${label}\n`);
  const res = spawnSync(process.execPath, args, { cwd: projectRoot, env: env as NodeJS.ProcessEnv, stdio: echo ? "inherit" : "pipe", encoding: "utf8" });
  if (res.status !== 0) {
    const detail = echo ? "" : `\n${res.stdout ?? ""}${res.stderr ?? ""}`;
    throw new Error(`${label} failed (exit ${res.status})${detail}`);
  }
}

const nextBin = () => path.join(projectRoot, "node_modules", "next", "dist", "bin", "next");
const tsxArgs = (script: string) => ["--import", "tsx", path.join(projectRoot, script)];

async function waitForHealth(url: string, child: ChildProcess, timeoutMs = 90_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let last = "no answer yet";
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the app exited with code ${child.exitCode} while starting`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) return;
      last = `health answered ${res.status}: ${await res.text()}`;
    } catch (err) {
      last = (err as Error).message;
    }
    await new Promise((r) => setTimeout(r, 400));
  }
  throw new Error(`the app did not become healthy within ${timeoutMs / 1000} s (${last})`);
}

export async function startStack(options: StackOptions = {}): Promise<RunningStack> {
  const echo = options.echo ?? false;
  const show = options.showSteps ?? false;
  const dataDir = path.resolve(options.dataDir ?? process.env.DATA_DIR ?? path.join(projectRoot, "data"));
  fs.mkdirSync(dataDir, { recursive: true });

  const port = options.port ?? (options.freePorts ? await findFreePort(HOST) : 3000);
  if (!(await isPortFree(port, HOST))) {
    throw new Error(`port ${port} is already in use (wanted by the Portolan app); stop whatever holds it or pass --port`);
  }
  const url = `http://${HOST}:${port}`;

  const fakes = await startFakes({
    dataDir,
    appOrigins: [url, `http://localhost:${port}`],
    echo,
    ...(options.freePorts ? { s3Port: 0, smtpPort: 0, mailWebPort: 0, uploadthingPort: 0 } : {}),
  });

  let app: ChildProcess | undefined;
  let stopping = false;
  const stop = async () => {
    stopping = true;
    const child = app;
    if (child && child.exitCode === null) {
      const exited = new Promise((r) => child.once("exit", r));
      child.kill("SIGTERM");
      await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
      if (child.exitCode === null) child.kill("SIGKILL");
    }
    await fakes.stop();
  };

  try {
    const env: Record<string, string> = {
      ...(process.env as Record<string, string>),
      ...fakes.env,
      DATA_DIR: dataDir,
      DATABASE_PATH: path.join(dataDir, "portolan.db"),
      APP_URL: url,
      NEXTAUTH_URL: url,
      NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? loadOrCreateSecret(dataDir),
      NEXT_TELEMETRY_DISABLED: "1",
      // The SDK version is pinned; its notice about future releases needing Node 22 is known (README).
      AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true",
      ...options.extraEnv,
    };
    runStep("migrating the database", tsxArgs("db/migrate.ts"), env, show);
    runStep("loading the demo shop", tsxArgs("db/seed.ts"), env, show);
    if (options.build ?? true) runStep("building the app (about a minute)", [nextBin(), "build"], env, show);

    const started = spawn(process.execPath, [nextBin(), "start", "-p", String(port), "-H", HOST], {
      cwd: projectRoot,
      env: env as NodeJS.ProcessEnv,
      stdio: show ? "inherit" : ["ignore", "pipe", "pipe"],
    });
    app = started;
    if (!show) {
      // Keep the last lines so a failed start can say why.
      let tail = "";
      const keep = (b: Buffer) => (tail = (tail + b.toString()).slice(-4000));
      started.stdout?.on("data", keep);
      started.stderr?.on("data", keep);
      started.once("exit", (code) => {
        if (!stopping && code) process.stderr.write(`app exited (${code}):\n${tail}\n`);
      });
    }
    await waitForHealth(url, started);
    return { url, env, fakes, stop };
  } catch (err) {
    await stop();
    throw err;
  }
}

const DEMO_SIGN_INS = [
  ["porter", "porter@harbourline.invalid", "porter-portolan"],
  ["machinist", "machinist@harbourline.invalid", "machinist-portolan"],
  ["lead", "lead@harbourline.invalid", "lead-portolan"],
  ["auditor", "auditor@harbourline.invalid", "auditor-portolan"],
  ["admin", "admin@harbourline.invalid", "admin-portolan"],
];

async function main(): Promise<number> {
  let values;
  try {
    ({ values } = parseArgs({
      options: { port: { type: "string" }, "data-dir": { type: "string" }, "no-build": { type: "boolean", default: false }, verbose: { type: "boolean", default: false } },
    }));
  } catch (err) {
    process.stderr.write(`demo: ${(err as Error).message}\n`);
    return 2;
  }
  const port = values.port ? Number(values.port) : undefined;
  if (port !== undefined && (!Number.isInteger(port) || port < 1 || port > 65535)) {
    process.stderr.write(`demo: --port must be a port number, got "${values.port}"\n`);
    return 2;
  }
  process.stdout.write("Starting Portolan with its demo shop and local stand-ins…\n");
  let stack: RunningStack;
  try {
    stack = await startStack({ port, dataDir: values["data-dir"], build: !values["no-build"], echo: values.verbose, showSteps: true });
  } catch (err) {
    process.stderr.write(`demo: ${(err as Error).message}\n`);
    return 1;
  }
  const lines = [
    "",
    `Portolan is running at ${stack.url}`,
    `Demo mail inbox (invitations, resets, notices): ${stack.fakes.mailWebUrl}`,
    "",
    "Demo sign-ins (invented shop, invented people):",
    ...DEMO_SIGN_INS.map(([role, email, pw]) => `  ${role.padEnd(10)} ${email.padEnd(32)} ${pw}`),
    "",
    "Press Ctrl-C to stop everything.",
  ];
  process.stdout.write(`${lines.join("\n")}\n`);
  await new Promise<void>((resolve) => {
    const done = () => resolve();
    process.once("SIGINT", done);
    process.once("SIGTERM", done);
  });
  process.stdout.write("\nStopping…\n");
  await stack.stop();
  process.stdout.write("Stopped.\n");
  return 0;
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(projectRoot, "storage-fake/demo.ts")) {
  main().then((code) => process.exit(code));
}
