/**
 * The app's configuration, read once from the environment with working local defaults,
 * so pointing Portolan at a hosted S3 or a real SMTP relay is configuration only.
 * A wrong value stops the process with a message that names the variable.
 */
import path from "node:path";
import { z } from "zod";

const port = z.coerce.number().int().min(1).max(65535);
const bool = z.enum(["true", "false", "1", "0"]).transform((v) => v === "true" || v === "1");

const schema = z.object({
  DATA_DIR: z.string().min(1).default("data"),
  DATABASE_PATH: z.string().min(1).optional(),
  APP_URL: z.url().default("http://127.0.0.1:3000"),

  S3_ENDPOINT: z.url().default("http://127.0.0.1:9310"),
  S3_REGION: z.string().min(1).default("us-east-1"),
  S3_BUCKET: z.string().min(3).default("portolan"),
  S3_ACCESS_KEY_ID: z.string().min(1).default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().min(1).default("S3RVER"),
  S3_FORCE_PATH_STYLE: bool.default(true),

  SMTP_HOST: z.string().min(1).default("127.0.0.1"),
  SMTP_PORT: port.default(1025),
  SMTP_SECURE: bool.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default("Portolan <no-reply@portolan.invalid>"),
  /** Web inbox of the local mail catcher; shown to admins in the demo only. */
  MAIL_INBOX_URL: z.string().optional(),
});

export type Env = z.infer<typeof schema> & { DATABASE_PATH: string };

let cached: Env | undefined;

export function readEnv(source: Record<string, string | undefined> = process.env): Env {
  const raw = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== undefined && v !== ""));
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid configuration in the environment:\n${lines.join("\n")}`);
  }
  const env = parsed.data;
  return { ...env, DATABASE_PATH: env.DATABASE_PATH ?? path.join(env.DATA_DIR, "portolan.db") };
}

/** The process-wide configuration (parsed on first use). */
export function env(): Env {
  cached ??= readEnv();
  return cached;
}
