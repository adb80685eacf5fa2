import path from "node:path";
import { defineConfig } from "vitest/config";

const root = path.resolve(import.meta.dirname, "..");

export default defineConfig({
  root,
  resolve: { alias: { "@": root } },
  test: {
    include: ["tests/integration/**/*.test.ts"],
    environment: "node",
    // One PostgreSQL (embedded or DATABASE_URL) for the whole run, a database per run.
    globalSetup: ["tests/integration/global-setup.ts"],
    setupFiles: ["tests/integration/setup-env.ts"],
    // Files share the run's database; run them one after another.
    fileParallelism: false,
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
