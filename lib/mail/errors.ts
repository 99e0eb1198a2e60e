/**
 * Mail failures as AppErrors, so a route answers with a message a person can act on; the
 * technical reason (connection refused, timeout, SMTP reply) stays in `detail` for the log.
 */
import { AppError } from "../errors";

export class MailUnavailableError extends AppError {
  readonly detail: string;

  constructor(detail: string, options?: { cause?: unknown }) {
    super("unavailable", "The mail server could not be reached, so no e-mail was sent. Try again in a few minutes.");
    this.name = "MailUnavailableError";
    this.detail = detail;
    if (options?.cause !== undefined) (this as { cause?: unknown }).cause = options.cause;
  }
}

export class MailRejectedError extends AppError {
  readonly detail: string;
  readonly recipients: string[];

  constructor(recipients: string[], detail: string) {
    super("invalid", `The mail server refused the address ${recipients.join(", ")}.`, { to: ["The mail server refused this address."] });
    this.name = "MailRejectedError";
    this.recipients = recipients;
    this.detail = detail;
  }
}

/** Network-level failures: nothing reached a mail server that could take the message. */
const UNREACHABLE_CODES = new Set(["ECONNECTION", "ETIMEDOUT", "ESOCKET", "EDNS", "ECONNREFUSED", "ECONNRESET", "EHOSTUNREACH", "ENOTFOUND", "EGREETING", "ETLS"]);

/** A short reason from a nodemailer error, e.g. "connection refused by 127.0.0.1:1025". */
export function describeMailError(err: unknown, host: string, port: number): { unreachable: boolean; reason: string } {
  const e = err as { code?: string; message?: string; responseCode?: number; response?: string } | null;
  const code = e?.code ?? "";
  const message = e?.message ?? String(err);
  if (/ECONNREFUSED/.test(message) || code === "ECONNREFUSED") return { unreachable: true, reason: `connection refused by ${host}:${port}` };
  if (code === "ETIMEDOUT" || /timeout/i.test(message)) return { unreachable: true, reason: `no answer from ${host}:${port} in time` };
  if (code === "EDNS" || /ENOTFOUND|EAI_AGAIN/.test(message)) return { unreachable: true, reason: `cannot resolve the mail host ${host}` };
  if (code === "EAUTH") return { unreachable: true, reason: `the mail server at ${host}:${port} refused our login` };
  if (UNREACHABLE_CODES.has(code)) return { unreachable: true, reason: `${host}:${port}: ${message}` };
  if (e?.responseCode) return { unreachable: false, reason: `SMTP ${e.responseCode}: ${e.response ?? message}` };
  return { unreachable: true, reason: `${host}:${port}: ${message}` };
}
