/**
 * `npm run bench:job`: the time from "Run award" to results through the real
 * job path — requestRun (export, hash, pg-boss send) → a worker claims it →
 * the engine in its thread → results written — for the demo period (64 crew,
 * two groups, the demo's 120 s limit) and a generated 150-crew period (two
 * groups of 75, the engine's default 600 s limit), one group after another on
 * one worker, as `npm run worker` runs them. Prints a table; figures, not a test.
 * Database: a scratch one on DATABASE_URL's server, else an embedded server.
 * `npm run bench:job -- [demo|150] [--out docs/benchmarks-award-job.md]`.
 */
import { performance } from "node:perf_hooks";
import { createDatabaseIfMissing, dropDatabase, withDatabase } from "../db/database.ts";
import { startLocalServer, dataRoot, type LocalServer } from "../db/local-server.ts";
import { applyMigrations } from "../db/migrate.ts";
import path from "node:path";

import fs from "node:fs";
import { execSync } from "node:child_process";
import { parseArgs } from "node:util";

const { values: opts, positionals: only } = parseArgs({ options: { out: { type: "string" } }, allowPositionals: true });
const name = `bw_bench_job_${process.pid}`;
let server: LocalServer | undefined;
let serverUrl = process.env.DATABASE_URL;
if (!serverUrl) {
  server = await startLocalServer({ dataDir: path.join(dataRoot(), "test-runs", name), port: 0 });
  serverUrl = server.adminUrl;
}
await createDatabaseIfMissing(serverUrl, name);
const url = withDatabase(serverUrl, name);
await applyMigrations(url);
process.env.DATABASE_URL = url;

const { db } = await import("../db/client.ts");
const { importBundle } = await import("../db/period-import.ts");
const { requestRun } = await import("../db/award-runs.ts");
const { startQueue } = await import("../jobs/queue.ts");
const { startAwardWorker } = await import("../jobs/award-worker.ts");
const { demoBundle } = await import("../../seed/demo.ts");
const { generatePeriod } = await import("../../seed/generator/generate-period.ts");

const NOW = new Date("2026-12-01T12:00:00Z");
const commit = execSync("git rev-parse --short HEAD").toString().trim();
const started = new Date().toISOString().slice(0, 16);
const periods = [
  { label: "demo period (64 crew, 120 s limit)", bundle: demoBundle(NOW).bundle },
  { label: "generated 150 crew (default limit)", bundle: generatePeriod({ seed: 11, crew: 75, base: "HLV", startDate: "2027-03-01", days: 31 }) },
].filter((p) => only.length === 0 || only.some((o) => p.label.includes(o)));

const boss = await startQueue(url, () => {}, { maintenanceIntervalSeconds: 30 });
await startAwardWorker(boss, () => {});
const rows: string[] = [];
try {
  for (const { label, bundle } of periods) {
    // Each period on its own: the two carriers' crew would share seniority numbers.
    await db().$executeRawUnsafe(`TRUNCATE "BidPeriod", "CrewMember", "RuleSet", "Base", "Station" CASCADE`);
    const { periodId } = await importBundle(db(), bundle, { state: "closed" });
    const groups = await db().awardGroup.findMany({ where: { bidPeriodId: periodId }, orderBy: { position: "asc" } });
    for (const g of groups) {
      const t0 = performance.now();
      const { runId } = await requestRun(boss, { groupId: g.id });
      const requested = performance.now() - t0;
      let run = await db().awardRun.findUniqueOrThrow({ where: { id: runId } });
      while (run.state === "queued" || run.state === "running") {
        await new Promise((r) => setTimeout(r, 250));
        run = await db().awardRun.findUniqueOrThrow({ where: { id: runId } });
      }
      const total = performance.now() - t0;
      const stats = (run.stats ?? {}) as { stoppedBy?: string };
      const award = (run.award ?? { openPairings: [] }) as { openPairings: Array<{ openCreditMinutes: number }> };
      const openHours = award.openPairings.reduce((s, p) => s + p.openCreditMinutes, 0) / 60;
      const crew = await db().awardedLine.count({ where: { awardRunId: runId } });
      const queued = run.startedAt ? run.startedAt.getTime() - run.createdAt.getTime() : NaN;
      const limit = (run.settings as { timeLimitSeconds?: number }).timeLimitSeconds ?? 600;
      const line = `| ${label} | ${g.position} | ${crew} | ${limit} | ${(requested / 1000).toFixed(2)} | ${(queued / 1000).toFixed(2)} | ${(total / 1000).toFixed(1)} | ${run.state}${stats.stoppedBy ? ` (${stats.stoppedBy})` : ""} | ${openHours.toFixed(1)} |`;
      console.log(line);
      rows.push(line);
    }
  }
} finally {
  await boss.stop({ graceful: false, timeout: 2_000 }).catch(() => {});
  await db().$disconnect();
  await dropDatabase(serverUrl, name).catch(() => {});
  await server?.stop();
}
const table = [
  "| period | group | crew | limit (s) | request (s) | queued → claimed (s) | Run award → results (s) | state | open time (h) |",
  "| --- | --- | ---: | ---: | ---: | ---: | ---: | --- | ---: |",
  ...rows,
].join("\n");
console.log(`\n${table}`);
if (opts.out) {
  const head = `# The award job: "Run award" to results\n\nWritten by \`npm run bench:job\` (lib/cli/bench-award-job.ts) at ${commit}, from ${started} to ${new Date().toISOString().slice(11, 16)} UTC, Node ${process.version}: each group through requestRun, pg-boss and one worker, one group after another. "Request" is the export, hash and send; "queued → claimed" the wait for the worker; the last column the time a scheduler waits. The engine stops at its time limit unless it proves the award first.\n\n`;
  fs.writeFileSync(opts.out, `${head}${table}\n`);
}
