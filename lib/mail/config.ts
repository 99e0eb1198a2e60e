/** Mail settings, taken from the app's configuration (lib/env.ts) so tests can pass their own. */
import { env, type Env } from "../env";

export type MailConfig = {
  host: string;
  port: number;
  /** TLS from the first byte (port 465 style); otherwise STARTTLS when the server offers it. */
  secure: boolean;
  user?: string;
  password?: string;
  /** The From header, e.g. `Portolan <no-reply@shop.example>`. */
  from: string;
  /** How long to wait for the server to accept a connection and greet. */
  connectTimeoutMs: number;
};

export const DEFAULT_CONNECT_TIMEOUT_MS = 5_000;

export function mailConfigFromEnv(e: Env = env()): MailConfig {
  return {
    host: e.SMTP_HOST,
    port: e.SMTP_PORT,
    secure: e.SMTP_SECURE,
    user: e.SMTP_USER || undefined,
    password: e.SMTP_PASSWORD || undefined,
    from: e.MAIL_FROM,
    connectTimeoutMs: DEFAULT_CONNECT_TIMEOUT_MS,
  };
}
