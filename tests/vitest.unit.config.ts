import path from "node:path";
import { defineConfig } from "vitest/config";

const root = path.resolve(import.meta.dirname, "..");

export default defineConfig({
  root,
  resolve: { alias: { "@": root } },
  test: {
    include: ["tests/unit/**/*.test.ts"],
    environment: "node",
  },
});
