/**
 * A worker process killed mid-run (SIGKILL: no clean-up of any kind) leaves
 * its job active; pg-boss expires it and retries it, and a second worker
 * process takes the run over once the dead worker's lease has lapsed, then
 * finishes it. The runs are the real `npm run worker` process (node with tsx).
 */
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import type PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { awardSchema } from "@/lib/domain";
import { LEASE_SECONDS, requestRun } from "@/lib/db/award-runs";
import { db } from "@/lib/db/client";
import { startQueue } from "@/lib/jobs/queue";
import { seedDemoIfEmpty } from "@/seed/demo";
import { truncateAll } from "../support/reset";
import { groupWithLimit, watchRun } from "../support/award-runs";

const root = path.resolve(import.meta.dirname, "../..");

function startWorker(output: string[]): ChildProcess {
  // One process (node --import tsx), so that SIGKILL leaves no child behind.
  const child = spawn(process.execPath, ["--import", "tsx", "lib/jobs/worker-main.ts"], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: inject("databaseUrl") },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout!.on("data", (d: Buffer) => output.push(d.toString()));
  child.stderr!.on("data", (d: Buffer) => output.push(d.toString()));
  return child;
}

describe("a worker killed mid-run", { timeout: 240_000 }, () => {
  let boss: PgBoss;
  const children: ChildProcess[] = [];
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    await seedDemoIfEmpty(db(), new Date("2026-12-01T12:00:00Z"));
    // This process only sends the job and runs pg-boss's maintenance (which expires the dead worker's job) every second.
    boss = await startQueue(inject("databaseUrl"), () => {}, { maintenanceIntervalSeconds: 1 });
  });
  afterAll(async () => {
    for (const c of children) c.kill("SIGKILL");
    await boss.stop({ graceful: false });
  });

  it("leaves the job to pg-boss's retry, and another worker finishes the run", async () => {
    const output: string[] = [];
    const first = startWorker(output);
    children.push(first);
    const { runId } = await requestRun(boss, { groupId: await groupWithLimit("first_officer", 8), expiryMarginSeconds: 4 });
    const running = await watchRun(runId, (r) => r.state === "running" && r.progress.percent > 0, 90_000);
    expect(running.run.state, output.join("")).toBe("running");
    const firstStart = running.run.startedAt!;
    first.kill("SIGKILL");
    const killedAt = Date.now();
    children.push(startWorker(output));
    const { run } = await watchRun(runId, (r) => r.state !== "running" && r.state !== "queued", 200_000);
    expect(run.state, output.join("")).toBe("succeeded");
    // Taken over, not finished by the dead worker: a later start, after the lease had lapsed.
    expect(run.startedAt!.getTime()).toBeGreaterThan(firstStart.getTime());
    expect(run.startedAt!.getTime()).toBeGreaterThanOrEqual(killedAt + (LEASE_SECONDS - 2) * 1000);
    const award = awardSchema.parse(run.award);
    expect(await db().awardedLine.count({ where: { awardRunId: runId } })).toBe(award.lines.length);
    expect(award.lines.length).toBe(await db().crewMember.count({ where: { position: "first_officer" } }));
  });
});
