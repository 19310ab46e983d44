import { defineConfig } from "vitest/config";
import path from "node:path";

const root = import.meta.dirname;

// Three suites: pure code (no services), integration against a running server + MariaDB,
// and browser runs in Debian's chromium. scripts/test.sh starts the services for the last two.
export default defineConfig({
  resolve: { alias: { "@": root, "server-only": path.join(root, "tests/support/server-only.ts") } },
  test: {
    setupFiles: ["tests/support/load-solvers.ts"],
    projects: [
      {
        extends: true,
        test: { name: "unit", include: ["tests/unit/**/*.test.ts", "tests/routing/**/*.test.ts"], testTimeout: 60_000 },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          testTimeout: 60_000,
          fileParallelism: false,
        },
      },
      {
        extends: true,
        test: {
          name: "browser",
          include: ["tests/browser/**/*.test.ts"],
          testTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
