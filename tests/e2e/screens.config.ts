/**
 * `npm run screens`: phone screenshots of the crew pages into docs/screens/,
 * for a reviewer to look at. Same server and browser as the browser tests;
 * not part of `npm test`.
 */
import { defineConfig } from "@playwright/test";
import base from "./playwright.config.ts";

export default defineConfig({
  ...base,
  testMatch: "**/*.screens.ts",
  projects: [{ name: "phone-360", use: { viewport: { width: 360, height: 780 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 } }],
});
