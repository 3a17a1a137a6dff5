import { defineConfig, devices } from "@playwright/test";

const results = ".data/test-results";

// The app, the database and the fakes are started by `npm test` (scripts/launch.mjs), not here.
export default defineConfig({
  testDir: "tests/e2e",
  testMatch: "**/*.spec.ts",
  outputDir: `${results}/playwright-artifacts`,
  fullyParallel: false,
  workers: 2,
  retries: 0,
  forbidOnly: true,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"], ["json", { outputFile: `${results}/playwright.json` }]],
  use: {
    baseURL: process.env.APP_URL ?? "http://localhost:3100",
    actionTimeout: 15_000,
    navigationTimeout: 30_000,
    trace: "retain-on-failure",
    video: "off",
    screenshot: "only-on-failure",
    timezoneId: "UTC",
  },
  projects: [
    {
      name: "chromium",
      use: {
        ...devices["Desktop Chrome"],
        launchOptions: {
          executablePath: "/usr/bin/chromium",
          args: [
            "--no-sandbox",
            "--headless",
            "--disable-gpu",
            "--disable-quic",
            "--no-first-run",
            "--disable-background-networking",
            "--disable-component-update",
            "--disable-sync",
          ],
        },
      },
    },
  ],
});
