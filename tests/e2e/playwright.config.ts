import fs from "node:fs";
import path from "node:path";
import { defineConfig } from "@playwright/test";
import { CHROMIUM, CHROMIUM_ARGS, E2E_PORT } from "./constants.ts";

// Debian's Chromium only; never a downloaded browser. Outside CI a machine
// without it skips the browser tests (and says so); under CI=true that fails.
const hasChromium = fs.existsSync(CHROMIUM);
if (!hasChromium) {
  const msg = `browser tests need Debian's Chromium at ${CHROMIUM} (apt-get install -y chromium)`;
  if (process.env.CI === "true") throw new Error(msg);
  console.warn(`${msg}: skipping them`);
}

export default defineConfig({
  testDir: path.dirname(new URL(import.meta.url).pathname),
  testMatch: "**/*.spec.ts",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 30_000,
  // The first pages after a cold start are slow on a small shared machine.
  expect: { timeout: 10_000 },
  reporter: [["list"]],
  outputDir: path.resolve(import.meta.dirname, "../../test-results"),
  use: {
    baseURL: `http://localhost:${E2E_PORT}`,
    browserName: "chromium",
    launchOptions: { executablePath: CHROMIUM, args: CHROMIUM_ARGS },
    trace: "off",
    screenshot: "only-on-failure",
  },
  projects: [
    {
      name: "phone",
      use: { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 },
    },
  ],
  webServer: hasChromium
    ? {
        command: `node_modules/.bin/tsx tests/e2e/serve.ts`,
        cwd: path.resolve(import.meta.dirname, "../.."),
        url: `http://localhost:${E2E_PORT}/sign-in`,
        timeout: 240_000,
        reuseExistingServer: false,
        stdout: "pipe",
        gracefulShutdown: { signal: "SIGTERM", timeout: 15_000 },
      }
    : undefined,
});
