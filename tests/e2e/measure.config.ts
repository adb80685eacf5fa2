/**
 * `npm run measure:trips`: how long the trip list takes to show and to filter
 * at 360 px with several hundred trips (E2E_PAIRINGS, default 600), printed,
 * never asserted. Same server and browser as the browser tests; not part of
 * `npm test`.
 */
import { defineConfig } from "@playwright/test";
import base from "./playwright.config.ts";

const pairings = process.env.E2E_PAIRINGS ?? "600";

export default defineConfig({
  ...base,
  testMatch: "**/*.measure.ts",
  timeout: 300_000,
  projects: [{ name: "phone-360", use: { viewport: { width: 360, height: 780 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 } }],
  webServer: base.webServer && !Array.isArray(base.webServer) ? { ...base.webServer, env: { ...process.env, E2E_PAIRINGS: pairings } as Record<string, string> } : base.webServer,
});
