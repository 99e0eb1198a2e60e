#!/usr/bin/env tsx
/**
 * `npm run fakes`: the local stand-ins for the hosted services, each in its own child process —
 * S3-compatible storage (s3rver), an SMTP catcher with a web inbox (maildev) and the uploadthing
 * stand-in. Checks the ports first, waits until each answers, prints the URLs and the settings
 * the app needs, and stops them all on Ctrl-C / SIGTERM.
 *
 *   npm run fakes -- [--s3-port 9310] [--smtp-port 1025] [--mail-web-port 1080]
 *                    [--uploadthing-port 9320] [--data-dir data] [--app-origin URL ...]
 *                    [--json] [--verbose]
 *
 * Exit codes: 0 stopped by a signal, 1 could not start (busy port, a stand-in failed) or a
 * stand-in died, 2 usage error.
 *
 * startFakes() is the same thing for the demo launcher and the browser-test setup.
 */
import path from "node:path";
import { parseArgs } from "node:util";
import { projectRoot, startReportingChild, type ChildService } from "./child";
import { startMailCatcher } from "./mail";
import { isPortFree } from "./net";
import { DEFAULT_APP_ORIGINS } from "./s3-cors";
import { S3RVER_CREDENTIALS, startS3Fake } from "./s3";
import { loadOrCreateLocalToken } from "./uploadthing-token";

export type FakesOptions = {
  s3Port?: number;
  smtpPort?: number;
  mailWebPort?: number;
  uploadthingPort?: number;
  /** Root of the stand-ins' data: `<dataDir>/s3`, `<dataDir>/mail`, `<dataDir>/uploadthing`. */
  dataDir?: string;
  /** Browser origins the storage bucket accepts (CORS). */
  appOrigins?: string[];
  bucket?: string;
  /** Print the children's own log lines. */
  echo?: boolean;
};

export type RunningFakes = {
  s3Url: string;
  smtp: { host: string; port: number };
  mailWebUrl: string;
  uploadthingUrl: string;
  /** The environment the app needs to use these stand-ins (merge into the app's env). */
  env: Record<string, string>;
  /** Settles when any stand-in ends on its own (a crash), naming it; never after stop(). */
  firstExit: Promise<{ service: string; code: number | null; output: string }>;
  stop(): Promise<void>;
};

/** A port we want is taken; the message names the port and the service that wanted it. */
export class PortInUseError extends Error {
  constructor(
    readonly port: number,
    readonly service: string,
  ) {
    super(`port ${port} is already in use (wanted by the ${service}); stop whatever holds it or pick another port`);
    this.name = "PortInUseError";
  }
}

const HOST = "127.0.0.1";

export const DEFAULT_FAKE_PORTS = { s3Port: 9310, smtpPort: 1025, mailWebPort: 1080, uploadthingPort: 9320 } as const;

async function startUploadthingProcess(port: number, dataDir: string, token: string, echo: boolean) {
  const { service, port: bound } = await startReportingChild({
    name: "uploadthing",
    what: "uploadthing stand-in",
    host: HOST,
    nodeArgs: ["--import", "tsx", path.join(projectRoot, "storage-fake/uploadthing.ts"), "--port", String(port), "--host", HOST, "--data-dir", dataDir],
    env: { UPLOADTHING_TOKEN: token },
    echo,
  });
  return { service, url: `http://${HOST}:${bound}`, port: bound };
}

export async function startFakes(options: FakesOptions = {}): Promise<RunningFakes> {
  const ports = {
    s3Port: options.s3Port ?? DEFAULT_FAKE_PORTS.s3Port,
    smtpPort: options.smtpPort ?? DEFAULT_FAKE_PORTS.smtpPort,
    mailWebPort: options.mailWebPort ?? DEFAULT_FAKE_PORTS.mailWebPort,
    uploadthingPort: options.uploadthingPort ?? DEFAULT_FAKE_PORTS.uploadthingPort,
  };
  const wanted: Array<[number, string]> = [
    [ports.s3Port, "S3 storage fake"],
    [ports.smtpPort, "SMTP catcher"],
    [ports.mailWebPort, "mail catcher's web inbox"],
    [ports.uploadthingPort, "uploadthing stand-in"],
  ];
  // All checks before any start, so a busy port never leaves half the stand-ins running.
  for (const [port, service] of wanted) {
    if (port !== 0 && !(await isPortFree(port, HOST))) throw new PortInUseError(port, service);
  }

  const dataDir = path.resolve(options.dataDir ?? process.env.DATA_DIR ?? "data");
  const uploadthingDir = path.join(dataDir, "uploadthing");
  const token = loadOrCreateLocalToken(uploadthingDir);
  const echo = options.echo ?? false;
  const bucket = options.bucket ?? "portolan";

  const started: ChildService[] = [];
  const track = <T extends { service: ChildService }>(p: Promise<T>) =>
    p.then((v) => {
      started.push(v.service);
      return v;
    });
  const results = await Promise.allSettled([
    track(startS3Fake({ port: ports.s3Port, host: HOST, directory: path.join(dataDir, "s3"), bucket, origins: options.appOrigins ?? DEFAULT_APP_ORIGINS, echo })),
    track(startMailCatcher({ smtpPort: ports.smtpPort, webPort: ports.mailWebPort, host: HOST, directory: path.join(dataDir, "mail"), echo })),
    track(startUploadthingProcess(ports.uploadthingPort, uploadthingDir, token, echo)),
  ]);
  let stopping = false;
  const stopAll = async () => {
    stopping = true;
    await Promise.all(started.map((s) => s.stop()));
  };
  const failed = results.find((r): r is PromiseRejectedResult => r.status === "rejected");
  if (failed) {
    await stopAll();
    throw failed.reason instanceof Error ? failed.reason : new Error(String(failed.reason));
  }
  const [s3, mail, ut] = results.map((r) => (r as PromiseFulfilledResult<unknown>).value) as [
    Awaited<ReturnType<typeof startS3Fake>>,
    Awaited<ReturnType<typeof startMailCatcher>>,
    Awaited<ReturnType<typeof startUploadthingProcess>>,
  ];

  const env: Record<string, string> = {
    S3_ENDPOINT: s3.url,
    S3_REGION: "us-east-1",
    S3_BUCKET: bucket,
    S3_ACCESS_KEY_ID: S3RVER_CREDENTIALS.accessKeyId,
    S3_SECRET_ACCESS_KEY: S3RVER_CREDENTIALS.secretAccessKey,
    S3_FORCE_PATH_STYLE: "true",
    // The storage adapter sets these on its client; the variables cover any other SDK client.
    AWS_REQUEST_CHECKSUM_CALCULATION: "WHEN_REQUIRED",
    AWS_RESPONSE_CHECKSUM_VALIDATION: "WHEN_REQUIRED",
    SMTP_HOST: mail.smtpHost,
    SMTP_PORT: String(mail.smtpPort),
    SMTP_SECURE: "false",
    MAIL_INBOX_URL: mail.webUrl,
    UPLOADTHING_TOKEN: token,
    UPLOADTHING_API_URL: ut.url,
    UPLOADTHING_INGEST_URL: ut.url,
    // Signed links to private files: the SDK uses http only when the host contains "local".
    UPLOADTHING_UFS_HOST: `localhost:${ut.port}`,
    UPLOADTHING_UFS_APP_ID_LOCATION: "path",
  };

  const firstExit = Promise.race(
    started.map((s) => s.exited.then((code) => ({ service: s.name, code, output: s.recentOutput() }))),
  ).then((exit) => (stopping ? new Promise<never>(() => undefined) : exit));

  return {
    s3Url: s3.url,
    smtp: { host: mail.smtpHost, port: mail.smtpPort },
    mailWebUrl: mail.webUrl,
    uploadthingUrl: ut.url,
    env,
    firstExit,
    stop: stopAll,
  };
}

function portOption(value: string | undefined, name: string): number | undefined {
  if (value === undefined) return undefined;
  const port = Number(value);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`--${name} must be a port number (0-65535), got "${value}"`);
  return port;
}

async function main(): Promise<number> {
  let values;
  try {
    ({ values } = parseArgs({
      options: {
        "s3-port": { type: "string" },
        "smtp-port": { type: "string" },
        "mail-web-port": { type: "string" },
        "uploadthing-port": { type: "string" },
        "data-dir": { type: "string" },
        "app-origin": { type: "string", multiple: true },
        json: { type: "boolean", default: false },
        verbose: { type: "boolean", default: false },
      },
    }));
  } catch (err) {
    process.stderr.write(`fakes: ${(err as Error).message}\n`);
    return 2;
  }

  let options: FakesOptions;
  try {
    options = {
      s3Port: portOption(values["s3-port"], "s3-port"),
      smtpPort: portOption(values["smtp-port"], "smtp-port"),
      mailWebPort: portOption(values["mail-web-port"], "mail-web-port"),
      uploadthingPort: portOption(values["uploadthing-port"], "uploadthing-port"),
      dataDir: values["data-dir"],
      appOrigins: values["app-origin"],
      echo: values.verbose,
    };
  } catch (err) {
    process.stderr.write(`fakes: ${(err as Error).message}\n`);
    return 2;
  }

  let fakes: RunningFakes;
  try {
    fakes = await startFakes(options);
  } catch (err) {
    process.stderr.write(`fakes: ${(err as Error).message}\n`);
    return 1;
  }

  if (values.json) {
    process.stdout.write(`${JSON.stringify({ s3Url: fakes.s3Url, smtp: fakes.smtp, mailWebUrl: fakes.mailWebUrl, uploadthingUrl: fakes.uploadthingUrl, env: fakes.env })}\n`);
  } else {
    process.stdout.write(
      [
        "Local stand-ins are running:",
        `  storage (S3)   ${fakes.s3Url}  bucket ${fakes.env.S3_BUCKET}`,
        `  mail (SMTP)    ${fakes.smtp.host}:${fakes.smtp.port}`,
        `  mail inbox     ${fakes.mailWebUrl}`,
        `  uploads        ${fakes.uploadthingUrl}`,
        "",
        "Settings for the app (e.g. .env.local):",
        ...Object.entries(fakes.env).map(([k, v]) => `${k}=${v}`),
        "",
        "Ctrl-C stops them.",
        "",
      ].join("\n"),
    );
  }

  const signalled = new Promise<"signal">((resolve) => {
    process.once("SIGINT", () => resolve("signal"));
    process.once("SIGTERM", () => resolve("signal"));
  });
  const outcome = await Promise.race([signalled, fakes.firstExit]);
  await fakes.stop();
  if (outcome === "signal") return 0;
  process.stderr.write(`fakes: the ${outcome.service} stand-in stopped unexpectedly (exit ${outcome.code}); stopped the others.\n${outcome.output}\n`);
  return 1;
}

if (process.argv[1] && /storage-fake[\\/]start\.ts$/.test(process.argv[1])) {
  main().then((code) => process.exit(code));
}
