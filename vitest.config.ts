import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

// Three suites, one runner: `npm test` sets up the services first (src/cli/test.ts) and runs them all.
export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    alias: { "server-only": fileURLToPath(new URL("./src/test/server-only-shim.ts", import.meta.url)) },
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          include: ["src/**/*.test.ts", "fixtures/**/*.test.ts"],
          exclude: ["src/**/*.db.test.ts", "node_modules/**"],
          environment: "node",
        },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["src/**/*.db.test.ts"],
          environment: "node",
          testTimeout: 60_000,
          hookTimeout: 120_000,
          setupFiles: ["src/test/integration-setup.ts"],
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["e2e/**/*.spec.ts"],
          environment: "node",
          testTimeout: 120_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
