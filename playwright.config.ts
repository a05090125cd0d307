import { defineConfig } from "@playwright/test";

// Debian's Chromium, never a downloaded browser. `npm test` starts the app and sets KERF_E2E_URL.
export default defineConfig({
  testDir: "tests/browser",
  outputDir: ".kerf/test-output/browser",
  forbidOnly: true,
  retries: 0,
  // One file at a time. Each journey makes its own people and channel (or only reads the demo channel, made
  // once under a lock: demoChannelId) and finds its mail by its own address, so two could run at once
  // (`npm test -- --browser --workers=2`), but on a 2-core machine the browser, the server and PostgreSQL
  // already fill both cores: two workers took 13.6 min against 11–12 for one.
  workers: 1,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"], ["json"]],
  use: {
    baseURL: process.env.KERF_E2E_URL,
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--disable-dev-shm-usage"],
    },
  },
});
