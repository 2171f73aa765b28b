import { defineConfig } from "vitest/config";

export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    // The guard against importing server code into the browser has no meaning in tests.
    alias: { "server-only": new URL("./tests/support/empty-module.ts", import.meta.url).pathname },
  },
  test: {
    include: ["tests/**/*.test.ts"],
    exclude: ["tests/e2e/**", "node_modules/**"],
    environment: "node",
    // Database suites share one test database; files run one after another.
    fileParallelism: false,
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
