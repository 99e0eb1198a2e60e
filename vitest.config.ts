import { defineConfig } from "vitest/config";
import path from "node:path";

// Three kinds of tests, one runner:
//  unit        – plain functions in lib/ (engines, guards, schemas); no I/O beyond temp files
//  integration – route handlers and verbs against a fresh migrated SQLite and the real local fakes
//  e2e         – Debian's chromium (playwright-core) against a production build of the app
export default defineConfig({
  resolve: {
    alias: {
      "@": path.resolve(import.meta.dirname),
      // Next's bundler provides this marker module; in tests it is empty.
      "server-only": path.resolve(import.meta.dirname, "tests/support/server-only.ts"),
    },
  },
  test: {
    // The AWS SDK is pinned; its notice that later releases need Node 22 is known (README).
    env: { AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true" },
    projects: [
      {
        extends: true,
        test: { name: "unit", include: ["tests/unit/**/*.test.ts", "tests/unit/**/*.test.tsx"], environment: "node" },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/integration/global-setup.ts"],
          testTimeout: 60_000,
          hookTimeout: 60_000,
          fileParallelism: false,
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/e2e/global-setup.ts"],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
