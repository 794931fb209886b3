import { defineConfig } from "@playwright/test";

export const E2E_PORT = Number(process.env.E2E_PORT || 3100);
const CHROMIUM = process.env.CHROMIUM_PATH || "/usr/bin/chromium";

export const CHROMIUM_ARGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--no-first-run",
];

export default defineConfig({
  testDir: "tests/e2e",
  outputDir: "test-results",
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: process.env.CI ? [["list"]] : [["list"]],
  use: {
    baseURL: `http://localhost:${E2E_PORT}`,
    browserName: "chromium",
    launchOptions: { executablePath: CHROMIUM, args: CHROMIUM_ARGS },
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
  },
  projects: [
    { name: "phone", use: { viewport: { width: 390, height: 844 }, isMobile: false, hasTouch: true } },
  ],
  webServer: {
    command: "npx tsx scripts/e2e-server.ts",
    url: `http://localhost:${E2E_PORT}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: "pipe",
    stderr: "pipe",
    env: {
      PORT: String(E2E_PORT),
      DATA_DIR: "tests/.tmp/e2e-data",
      AUTH_SECRET: "e2e-only-secret-not-for-production-0123456789",
      SKIP_BUILD: "1",
      BCRYPT_COST: "8",
    },
  },
});
