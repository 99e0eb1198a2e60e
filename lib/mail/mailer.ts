/**
 * Sending mail through nodemailer's SMTP transport. One mailer per configuration; the app
 * uses the one built from its environment, tests build their own against a local catcher.
 */
import nodemailer, { type Transporter } from "nodemailer";
import { mailConfigFromEnv, type MailConfig } from "./config";
import { describeMailError, MailRejectedError, MailUnavailableError } from "./errors";

export type OutgoingMail = {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
  replyTo?: string;
};

export type SentMail = { messageId: string; accepted: string[] };

/** Same shape as the health route's checks: ok, or not ok with the reason. */
export type MailCheck = { ok: boolean; message?: string };

export type Mailer = {
  readonly config: MailConfig;
  send(mail: OutgoingMail): Promise<SentMail>;
  check(): Promise<MailCheck>;
  close(): void;
};

function addresses(list: unknown): string[] {
  if (!Array.isArray(list)) return [];
  return list.map((a) => (typeof a === "string" ? a : ((a as { address?: string }).address ?? String(a))));
}

export function createMailer(config: MailConfig): Mailer {
  const transport: Transporter = nodemailer.createTransport({
    host: config.host,
    port: config.port,
    secure: config.secure,
    auth: config.user ? { user: config.user, pass: config.password ?? "" } : undefined,
    connectionTimeout: config.connectTimeoutMs,
    greetingTimeout: config.connectTimeoutMs,
    socketTimeout: config.connectTimeoutMs * 4,
  });

  return {
    config,
    async send(mail) {
      const to = Array.isArray(mail.to) ? mail.to : [mail.to];
      if (to.length === 0) throw new MailRejectedError([], "no recipient");
      let info: { messageId: string; accepted: unknown; rejected: unknown };
      try {
        info = await transport.sendMail({ from: config.from, to, subject: mail.subject, text: mail.text, html: mail.html, replyTo: mail.replyTo });
      } catch (err) {
        const { unreachable, reason } = describeMailError(err, config.host, config.port);
        if (unreachable) throw new MailUnavailableError(reason, { cause: err });
        throw new MailRejectedError(to, reason);
      }
      const rejected = addresses(info.rejected);
      if (rejected.length > 0) throw new MailRejectedError(rejected, "recipient refused");
      return { messageId: info.messageId, accepted: addresses(info.accepted) };
    },
    async check() {
      try {
        await transport.verify();
        return { ok: true, message: `SMTP server at ${config.host}:${config.port} answered` };
      } catch (err) {
        return { ok: false, message: `mail: ${describeMailError(err, config.host, config.port).reason}` };
      }
    },
    close() {
      transport.close();
    },
  };
}

let shared: Mailer | undefined;

/** The mailer configured from the environment (built on first use). */
export function defaultMailer(): Mailer {
  shared ??= createMailer(mailConfigFromEnv());
  return shared;
}
