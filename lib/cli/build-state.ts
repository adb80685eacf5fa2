/**
 * Whether the production build is missing or older than the sources, so a
 * second `npm run demo` starts in seconds instead of rebuilding.
 */
import fs from "node:fs";
import path from "node:path";
import { REPO_ROOT } from "../db/local-server.ts";

// lib/db/generated is included: a schema change regenerates the client the build bundles.
const SOURCES = ["app", "lib", "seed", "prisma", "next.config.mjs", "postcss.config.mjs", "package-lock.json", "tsconfig.json"];
const SKIP = new Set(["node_modules", ".data"]);

/** True when the build in `distDir` (relative to the repository) is missing or older than a source. */
export function needsBuild(distDir = ".next"): boolean {
  const buildId = path.join(REPO_ROOT, distDir, "BUILD_ID");
  if (!fs.existsSync(buildId)) return true;
  const builtAt = fs.statSync(buildId).mtimeMs;
  return SOURCES.some((s) => newerThan(path.join(REPO_ROOT, s), builtAt));
}

function newerThan(p: string, t: number): boolean {
  if (!fs.existsSync(p)) return false;
  const st = fs.statSync(p);
  if (!st.isDirectory()) return st.mtimeMs > t;
  return fs.readdirSync(p).some((name) => !SKIP.has(name) && newerThan(path.join(p, name), t));
}
