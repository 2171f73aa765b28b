import { defineConfig, devices } from "@playwright/test";

// Debian's chromium, kept off the closed network; the app is served by `npm test` beforehand.
const chromiumFlags = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--no-first-run",
  "--disable-quic",
  '--host-resolver-rules=MAP * ~NOTFOUND, EXCLUDE 127.0.0.1, EXCLUDE localhost',
];

export default defineConfig({
  testDir: "tests/e2e",
  outputDir: process.env.HOEBENCH_TEST_SLOT ? `test-results-${process.env.HOEBENCH_TEST_SLOT}` : "test-results",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  use: {
    baseURL: process.env.APP_BASE_URL ?? "http://127.0.0.1:3100",
    screenshot: "only-on-failure",
    trace: "off",
  },
  projects: [
    {
      name: "chromium",
      use: { ...devices["Desktop Chrome"], launchOptions: { executablePath: "/usr/bin/chromium", args: chromiumFlags } },
    },
  ],
});
