/**
 * The web server the browser tests talk to: a database of its own (see
 * tests/support/test-database.ts), migrated and seeded with the small scenario
 * at a fixed clock and the period before it (seed/past-period.ts), a production build when the sources changed, `next start`
 * on the test port and an award worker. Playwright starts and stops this process.
 */
import { spawn, spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { createPrisma } from "../../lib/db/client.ts";
import { REPO_ROOT } from "../../lib/db/local-server.ts";
import { needsBuild } from "../../lib/cli/build-state.ts";
import { writePastPeriod } from "../../seed/past-period.ts";
import { smallScenario } from "../../seed/small-scenario.ts";
import { writeScenario } from "../../seed/write-scenario.ts";
import { createTestDatabase } from "../support/test-database.ts";
import { E2E_DATABASE_FILE, E2E_NOW, E2E_PORT } from "./constants.ts";

const db = await createTestDatabase("e2e");
const prisma = createPrisma(db.url);
// E2E_PAIRINGS: a bigger month for measuring the trip list (tests/e2e/measure.config.ts); the tests use the default 36.
const pairings = process.env.E2E_PAIRINGS ? Number(process.env.E2E_PAIRINGS) : undefined;
const scenario = smallScenario({ seed: 11, now: new Date(E2E_NOW), pairings });
const { periodId } = await writeScenario(prisma, scenario);
// December 2026 with a bid each crew account submitted, for "start from my last bid".
await writePastPeriod(prisma, periodId, scenario.users.flatMap((u) => (u.crewId ? [u.crewId] : [])));
await prisma.$disconnect();
// Specs that must change the data behind the server's back (a deadline that has passed) read the URL here.
fs.mkdirSync(path.dirname(E2E_DATABASE_FILE), { recursive: true });
fs.writeFileSync(E2E_DATABASE_FILE, JSON.stringify({ url: db.url }));

const next = path.join(REPO_ROOT, "node_modules", ".bin", "next");
const DIST = ".next-e2e";
if (needsBuild(DIST)) {
  const built = spawnSync(next, ["build"], { cwd: REPO_ROOT, stdio: "inherit", env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", BIDWRIGHT_DIST_DIR: DIST } });
  if (built.status !== 0) {
    await db.drop();
    process.exit(1);
  }
}
const web = spawn(next, ["start", "-p", String(E2E_PORT)], {
  cwd: REPO_ROOT,
  stdio: "inherit",
  env: {
    ...process.env,
    DATABASE_URL: db.url,
    NEXTAUTH_URL: `http://localhost:${E2E_PORT}`,
    NEXTAUTH_SECRET: "e2e-only-secret-not-for-production",
    NEXT_TELEMETRY_DISABLED: "1",
    BIDWRIGHT_DIST_DIR: DIST,
    // The seeded period's deadline stays ahead of the server's clock whatever day the tests run.
    BIDWRIGHT_CLOCK_START: E2E_NOW,
  },
});

// The award worker, as the demo runs it (`npm run worker`).
const worker = spawn(process.execPath, ["--import", "tsx", path.join(REPO_ROOT, "lib/jobs/worker-main.ts")], {
  cwd: REPO_ROOT,
  stdio: "inherit",
  env: { ...process.env, DATABASE_URL: db.url },
});

let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  web.kill("SIGTERM");
  worker.kill("SIGTERM");
  await new Promise((r) => (web.exitCode !== null ? r(null) : web.once("exit", r)));
  await new Promise((r) => (worker.exitCode !== null ? r(null) : worker.once("exit", r)));
  fs.rmSync(E2E_DATABASE_FILE, { force: true });
  await db.drop();
  process.exit(0);
}
process.on("SIGINT", () => void stop());
process.on("SIGTERM", () => void stop());
web.on("exit", () => void stop());
