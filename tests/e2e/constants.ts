/** The browser tests' own port (never the demo's 3000) and the clock their data is seeded at. */
export const E2E_PORT = 3117;
export const E2E_NOW = "2026-12-01T12:00:00Z";
export const CHROMIUM = "/usr/bin/chromium";
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
