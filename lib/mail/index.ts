/**
 * Mail for the app: `sendMail` and the health check use the SMTP server from the environment
 * unless a mailer is passed (tests pass one aimed at their own catcher).
 */
import { defaultMailer, type MailCheck, type Mailer, type OutgoingMail, type SentMail } from "./mailer";

export { createMailer, defaultMailer, type MailCheck, type Mailer, type OutgoingMail, type SentMail } from "./mailer";
export { mailConfigFromEnv, type MailConfig } from "./config";
export { MailRejectedError, MailUnavailableError } from "./errors";

/** Sends one message; throws MailUnavailableError when the server cannot be reached. */
export function sendMail(mail: OutgoingMail, mailer: Mailer = defaultMailer()): Promise<SentMail> {
  return mailer.send(mail);
}

/** Health check: does the SMTP server answer (connect, greet, EHLO, login when configured)? */
export function checkMail(mailer: Mailer = defaultMailer()): Promise<MailCheck> {
  return mailer.check();
}
