import { defineConfig } from "vitest/config";
import path from "node:path";

const allTests = ["shared/**/*.test.ts", "server/**/*.test.ts", "src/**/*.test.{ts,tsx}", "tests/api/**/*.test.ts", "tests/unit/**/*.test.ts", "tests/payments-standin/**/*.test.ts"];
/** Files that replace a module (`vi.mock`) run in a process of their own, so no other file sees the stand-in. */
const ownModules = ["tests/api/all-or-nothing.test.ts"];

export default defineConfig({
  resolve: { alias: { "@shared": path.resolve(import.meta.dirname, "shared") } },
  test: {
    environment: "node",
    testTimeout: 20_000,
    hookTimeout: 60_000,
    pool: "forks",
    // Vitest's default is one file at a time on a 2-core machine (cores - 1); the API tests spend most of
    // their time waiting on PostgreSQL and their app, and each file has its own database, so two at once.
    maxWorkers: 2,
    projects: [
      {
        // Loading the server's modules anew for each file cost about 2 s a file (over 300 s a run), so the
        // files share a process's modules. That is safe because the server keeps no state at module level
        // but the results card's Chromium (server/jobs/chromium.ts, started again once closed): every app,
        // queue, cache and pool is made by startTestApp for its file. A file that fakes timers or spies
        // restores them in afterEach.
        extends: true,
        // A project's include adds to the root's, so the root names none and each project names its own.
        test: { name: "shared-modules", isolate: false, include: allTests, exclude: ownModules },
      },
      { extends: true, test: { name: "own-modules", isolate: true, include: ownModules } },
    ],
  },
});
