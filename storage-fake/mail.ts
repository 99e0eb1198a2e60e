/**
 * Starts maildev as a child process: an SMTP catcher with a web inbox and REST API, both bound
 * to loopback (its default is every interface). Used by the demo and the browser tests; the
 * integration tests use an in-process catcher instead.
 */
import { mkdirSync } from "node:fs";
import path from "node:path";
import { projectRoot, spawnNodeService, type ChildService } from "./child";
import { findFreePort, httpAnswers, tcpAnswers, waitUntil } from "./net";

export type MailCatcherOptions = {
  /** 0 picks a free port (maildev cannot report the port it bound). */
  smtpPort?: number;
  webPort?: number;
  host?: string;
  /** Keep caught mail on disk here; in memory when omitted. */
  directory?: string;
  echo?: boolean;
  startTimeoutMs?: number;
};

export type MailCatcher = {
  smtpHost: string;
  smtpPort: number;
  webUrl: string;
  service: ChildService;
  stop(): Promise<void>;
};

export async function startMailCatcher(opts: MailCatcherOptions = {}): Promise<MailCatcher> {
  const host = opts.host ?? "127.0.0.1";
  const smtpPort = opts.smtpPort === 0 ? await findFreePort(host) : (opts.smtpPort ?? 1025);
  const webPort = opts.webPort === 0 ? await findFreePort(host) : (opts.webPort ?? 1080);
  const bin = path.join(projectRoot, "node_modules/maildev/dist/bin/maildev.js");
  const args = [bin, "--ip", host, "--web-ip", host, "--smtp", String(smtpPort), "--web", String(webPort)];
  if (opts.directory) {
    mkdirSync(opts.directory, { recursive: true });
    args.push("--mail-directory", path.resolve(opts.directory));
  }
  if (!opts.echo) args.push("--silent");

  const service = spawnNodeService({ name: "mail", nodeArgs: args, echo: opts.echo });
  const webUrl = `http://${host}:${webPort}`;
  try {
    await waitUntil(
      async () => (await httpAnswers(`${webUrl}/api/healthz`)) && (await tcpAnswers(host, smtpPort)),
      "mail catcher did not start",
      { timeoutMs: opts.startTimeoutMs ?? 30_000, abort: () => (service.hasExited() ? `exited early:\n${service.recentOutput()}` : undefined) },
    );
  } catch (err) {
    await service.stop();
    throw err;
  }
  return { smtpHost: host, smtpPort, webUrl, service, stop: () => service.stop() };
}
