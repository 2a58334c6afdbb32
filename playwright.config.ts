import { defineConfig, devices } from "@playwright/test";
import { DEBIAN_CHROMIUM } from "./e2e/helpers/chromium";

// Browser tests run in Debian's chromium (never a downloaded browser) against the production
// build that scripts/test.sh starts on APP_URL.
export default defineConfig({
  testDir: "e2e",
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  use: {
    baseURL: process.env.APP_URL ?? "http://127.0.0.1:3100",
    trace: "off",
    screenshot: "only-on-failure",
    launchOptions: DEBIAN_CHROMIUM,
  },
  projects: [{ name: "chromium", use: { ...devices["Desktop Chrome"], channel: undefined } }],
});
