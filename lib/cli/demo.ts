/**
 * `npm run demo`: one command from a fresh clone to a running Bidwright.
 * Database (DATABASE_URL, or the embedded PostgreSQL in .data/), migrations,
 * demo data when empty, a production build when the sources changed, then the
 * web server and the award worker. Ctrl-C stops all of it.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { createPrisma } from "../db/client.ts";
import { resolveDatabase } from "../db/database.ts";
import { REPO_ROOT, isFree } from "../db/local-server.ts";
import { applyMigrations } from "../db/migrate.ts";
import { seedDemoIfEmpty, writeDemoFiles } from "../../seed/demo.ts";
import { needsBuild } from "./build-state.ts";

const log = (l: string) => console.log(`[demo] ${l}`);
const PIDS_FILE = path.join(REPO_ROOT, ".data", "demo.pids");
const bin = (name: string) => path.join(REPO_ROOT, "node_modules", ".bin", name);

stopLeftovers();
const db = await resolveDatabase({ log });
log(db.server ? `embedded PostgreSQL on port ${db.server.port} (data in ${path.relative(REPO_ROOT, db.server.dataDir).startsWith("..") ? db.server.dataDir : path.relative(REPO_ROOT, db.server.dataDir)})` : `using DATABASE_URL (${new URL(db.url).host})`);
const children: ChildProcess[] = [];
let stopping = false;

async function shutdown(code: number, why: string): Promise<never> {
  if (!stopping) {
    stopping = true;
    log(`${why}: stopping`);
    await Promise.all(children.map((c) => stopChild(c)));
    await db.server?.stop();
    fs.rmSync(PIDS_FILE, { force: true });
  }
  process.exit(code);
}
process.on("SIGINT", () => void shutdown(0, "Ctrl-C"));
process.on("SIGTERM", () => void shutdown(0, "SIGTERM"));

try {
  await applyMigrations(db.url, { log });
  const prisma = createPrisma(db.url);
  const { seeded, users } = await seedDemoIfEmpty(prisma);
  await prisma.$disconnect();
  log(seeded ? "demo data written" : "existing data kept");
  const files = writeDemoFiles(new Date(), path.join(REPO_ROOT, ".data", "demo-files"));
  log(`CSV files of the month after the demo's period, to try "New period" and its import: ${path.relative(REPO_ROOT, files)}/`);

  if (needsBuild()) {
    log("building the web app (a minute on a small machine)…");
    const built = spawnSync(bin("next"), ["build"], { stdio: "inherit", cwd: REPO_ROOT, env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" } });
    if (built.status !== 0) await shutdown(1, "the build failed");
  }

  const port = await freePort(Number(process.env.PORT ?? 3000));
  const url = `http://localhost:${port}`;
  const env = {
    ...process.env,
    DATABASE_URL: db.url,
    NEXTAUTH_URL: url,
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? demoSecret(),
    NEXT_TELEMETRY_DISABLED: "1",
    PORT: String(port),
    BIDWRIGHT_DEMO_ACCOUNTS: [`password: ${users[0]?.password}`, ...users.map((u) => `${u.role.padEnd(9)} ${u.email}`)].join("\n"),
  };
  children.push(start("web", bin("next"), ["start", "-p", String(port)], env));
  // `node --import tsx` rather than the tsx wrapper: one process per child, so a pid stops it.
  children.push(start("worker", process.execPath, ["--import", "tsx", path.join(REPO_ROOT, "lib/jobs/worker-main.ts")], env));
  fs.writeFileSync(PIDS_FILE, children.map((c) => c.pid).join("\n"));
  await waitForHttp(`${url}/sign-in`, 60_000);
  console.log(`\nBidwright is running at ${url}\n\nDemo sign-ins (password for all: ${users[0]?.password}):`);
  for (const u of users) console.log(`  ${u.role.padEnd(9)} ${u.email.padEnd(34)} ${u.name}`);
  console.log("\nCtrl-C stops the web server, the award worker and the database.\n");
} catch (e) {
  console.error(`[demo] ${(e as Error).message}`);
  await shutdown(1, "start-up failed");
}

/**
 * A demo killed hard (kill -9, a closed terminal) leaves its web server and
 * worker running: stop those before starting new ones. The command line is
 * checked so that a recycled pid of some other program is left alone.
 */
function stopLeftovers(): void {
  if (!fs.existsSync(PIDS_FILE)) return;
  for (const pid of fs.readFileSync(PIDS_FILE, "utf8").split("\n").map(Number).filter((p) => p > 0)) {
    let cmd = "";
    try {
      cmd = fs.readFileSync(`/proc/${pid}/cmdline`, "utf8");
    } catch {
      continue; // gone already
    }
    if (!/next|worker-main/.test(cmd)) continue;
    log(`stopping process ${pid} left over from an earlier start`);
    try {
      process.kill(pid, "SIGKILL");
    } catch {
      /* exited meanwhile */
    }
  }
  fs.rmSync(PIDS_FILE, { force: true });
}

function start(name: string, cmd: string, args: string[], env: NodeJS.ProcessEnv): ChildProcess {
  const child = spawn(cmd, args, { cwd: REPO_ROOT, env, stdio: ["ignore", "pipe", "pipe"] });
  const prefix = (chunk: Buffer) =>
    chunk.toString().split("\n").filter(Boolean).forEach((l) => console.log(`[${name}] ${l}`));
  child.stdout?.on("data", prefix);
  child.stderr?.on("data", prefix);
  child.on("exit", (code, signal) => {
    if (!stopping) void shutdown(1, `the ${name} process exited (${signal ?? code})`);
  });
  return child;
}

function stopChild(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    const timer = setTimeout(() => child.kill("SIGKILL"), 10_000);
    child.once("exit", () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill("SIGTERM");
  });
}

/** The session secret: generated once and kept in the git-ignored data folder. */
function demoSecret(): string {
  const file = path.join(REPO_ROOT, ".data", "nextauth-secret");
  if (!fs.existsSync(file)) {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, randomBytes(32).toString("base64url"), { mode: 0o600 });
  }
  return fs.readFileSync(file, "utf8").trim();
}

async function freePort(preferred: number): Promise<number> {
  for (let p = preferred; p < preferred + 20; p++) {
    if (await isFree(p)) return p; // next start listens on every interface
    log(`port ${p} is taken, trying ${p + 1}`);
  }
  throw new Error(`no free port between ${preferred} and ${preferred + 19}; set PORT`);
}

async function waitForHttp(url: string, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const res = await fetch(url);
      if (res.status < 500) return;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`the web server did not answer at ${url} within ${timeoutMs / 1000} s`);
}
