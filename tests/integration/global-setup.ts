/**
 * Integration tests: each file opens its own fresh SQLite file (tests/integration/support/app.ts)
 * and starts the stand-ins it needs; this only gives the run a private data directory and the
 * settings next-auth needs to sign test sessions.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

export default async function setup() {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "portolan-integration-"));
  process.env.DATA_DIR = dir;
  process.env.NEXTAUTH_SECRET = "integration-tests-only";
  process.env.NEXTAUTH_URL = "http://127.0.0.1:3000";
  process.env.APP_URL = "http://127.0.0.1:3000";
  return () => fs.rmSync(dir, { recursive: true, force: true });
}
