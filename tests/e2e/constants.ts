/** The browser tests' own port (never the demo's 3000) and the clock their data is seeded at. */
export const E2E_PORT = 3117;
export const E2E_NOW = "2026-12-01T12:00:00Z";
export const CHROMIUM = "/usr/bin/chromium";
/** Where the e2e server writes its database's URL (git-ignored .data). */
export const E2E_DATABASE_FILE = new URL("../../.data/e2e-database.json", import.meta.url).pathname;
/** Flags for Debian's Chromium on a closed network (DEVELOPERS.md). */
export const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--no-first-run",
  "--disable-quic",
];
