import { defineConfig } from "vitest/config";
import path from "node:path";

export default defineConfig({
  resolve: { alias: { "@shared": path.resolve(import.meta.dirname, "shared") } },
  test: {
    include: ["shared/**/*.test.ts", "server/**/*.test.ts", "src/**/*.test.{ts,tsx}", "tests/api/**/*.test.ts", "tests/unit/**/*.test.ts", "tests/payments-standin/**/*.test.ts"],
    environment: "node",
    testTimeout: 20_000,
    hookTimeout: 60_000,
    pool: "forks",
    // Vitest's default is one file at a time on a 2-core machine (cores - 1); the API tests spend most of
    // their time waiting on PostgreSQL and their app, and each file has its own database, so two at once.
    maxWorkers: 2,
  },
});
