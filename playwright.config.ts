import { defineConfig } from "@playwright/test";

/** Browser tests drive Debian's Chromium against the server `npm test` started (APP_URL). */
export default defineConfig({
  testDir: "tests/e2e",
  outputDir: ".test-artifacts/playwright",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"], ["json", { outputFile: ".test-artifacts/playwright.json" }]],
  use: {
    baseURL: process.env.APP_URL ?? "http://127.0.0.1:3000",
    screenshot: "only-on-failure",
    trace: "retain-on-failure",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: [
        "--no-sandbox",
        "--disable-gpu",
        "--disable-quic",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
        "--no-first-run",
      ],
    },
  },
});
