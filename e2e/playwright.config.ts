import { defineConfig } from "@playwright/test";
import { chromiumLaunchOptions } from "./support/chromium";

export default defineConfig({
  testDir: ".",
  outputDir: "../.data/reports/e2e-artifacts",
  fullyParallel: false,
  workers: 2,
  retries: 0,
  // Whole journeys (commit, review, release) take 20–30 s on a 2-core machine running the app and its database too.
  timeout: 60_000,
  expect: { timeout: 7_000 },
  use: {
    baseURL: process.env.GAITLOOM_E2E_URL ?? "http://127.0.0.1:3100",
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: chromiumLaunchOptions,
  },
});
