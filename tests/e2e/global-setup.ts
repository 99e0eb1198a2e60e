/**
 * Browser tests run against the production build (`next build` runs first in tests/run-all.sh),
 * started with its stand-ins on free ports over a throwaway data directory.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { startStack } from "../../storage-fake/demo";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    mailWebUrl: string;
    dataDir: string;
  }
}

export default async function setup(project: TestProject) {
  if (!fs.existsSync(path.join(process.cwd(), process.env.NEXT_DIST_DIR ?? ".next", "BUILD_ID"))) {
    throw new Error("browser tests need a production build: run `npx next build` first (tests/run-all.sh does)");
  }
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "portolan-e2e-"));
  const stack = await startStack({ dataDir, freePorts: true, build: false, extraEnv: { NEXTAUTH_SECRET: "e2e-only-secret-not-for-production" } });
  project.provide("baseUrl", stack.url);
  project.provide("mailWebUrl", stack.fakes.mailWebUrl);
  project.provide("dataDir", dataDir);
  return async () => {
    await stack.stop();
    fs.rmSync(dataDir, { recursive: true, force: true });
  };
}
