/**
 * The award job through pg-boss and PostgreSQL: a scheduler's request queues
 * one job per award group, the worker claims the run (the run row is the lock),
 * runs lib/award in a thread, writes progress and then the results in one
 * transaction; cancel stops a running run and touches nothing else.
 */
import type PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { awardSchema, sha256Hex } from "@/lib/domain";
import { cancelRun, claimRun, failRun, heartbeat, requestRun } from "@/lib/db/award-runs";
import { db } from "@/lib/db/client";
import { startAwardWorker } from "@/lib/jobs/award-worker";
import { AWARD_QUEUE, startQueue } from "@/lib/jobs/queue";
import { seedDemoIfEmpty } from "@/seed/demo";
import { truncateAll } from "../support/reset";
import { groupWithLimit, watchRun } from "../support/award-runs";

const NOW = new Date("2026-12-01T12:00:00Z");

describe("the award job", { timeout: 180_000 }, () => {
  let boss: PgBoss;
  const log: string[] = [];
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    await seedDemoIfEmpty(db(), NOW);
    boss = await startQueue(inject("databaseUrl"), (l) => log.push(l), { maintenanceIntervalSeconds: 1 });
  });
  afterAll(async () => {
    await boss.stop({ graceful: false });
  });

  it("refuses a run before bidding opens, queueing nothing", async () => {
    const groupId = await groupWithLimit("captain", 5);
    const group = await db().awardGroup.findUniqueOrThrow({ where: { id: groupId }, select: { bidPeriodId: true, bidPeriod: { select: { state: true } } } });
    const runs = await db().awardRun.count();
    await db().bidPeriod.update({ where: { id: group.bidPeriodId }, data: { state: "draft" } });
    try {
      await expect(requestRun(boss, { groupId })).rejects.toThrow("bidding has not opened yet, and a run reads the crew's bids");
    } finally {
      await db().bidPeriod.update({ where: { id: group.bidPeriodId }, data: { state: group.bidPeriod.state } });
    }
    expect(await db().awardRun.count()).toBe(runs);
  });

  it("lets only one claimer take a run (the run row is the lock)", async () => {
    const { runId } = await requestRun(boss, { groupId: await groupWithLimit("captain", 5) });
    const claims = await Promise.all([claimRun(runId), claimRun(runId), claimRun(runId)]);
    expect(claims.map((c) => c.kind).sort()).toEqual(["claimed", "held", "held"]);
    expect((await db().awardRun.findUniqueOrThrow({ where: { id: runId } })).state).toBe("running");
    // The holder's lease lapses (its worker died): another claimer takes over, and the first one's
    // heartbeats and closing no longer touch the run.
    const first = claims.find((c) => c.kind === "claimed")!;
    if (first.kind !== "claimed") throw new Error("unreachable");
    await db().awardRun.update({ where: { id: runId }, data: { leaseUntil: new Date(Date.now() - 1000) } });
    const second = await claimRun(runId);
    expect(second.kind).toBe("claimed");
    if (second.kind !== "claimed") throw new Error("unreachable");
    expect(await heartbeat(runId, first.claim)).toEqual({ stop: true });
    await failRun(runId, "the first worker's late failure", first.claim);
    expect((await db().awardRun.findUniqueOrThrow({ where: { id: runId } })).state).toBe("running");
    expect(await heartbeat(runId, second.claim)).toEqual({ stop: false });
    // "Cancel" on the running run; once its worker's lease lapses, a retried job closes it as cancelled instead of running it.
    expect(await cancelRun(runId)).toBe("stopping");
    await db().awardRun.update({ where: { id: runId }, data: { leaseUntil: new Date(Date.now() - 1000) } });
    expect((await claimRun(runId)).kind).toBe("gone");
    expect((await db().awardRun.findUniqueOrThrow({ where: { id: runId } })).state).toBe("cancelled");
  });

  let firstRun = "";
  it("runs an award end to end: stored progress takes several values before 100 %, then the results", async () => {
    await startAwardWorker(boss, (l) => log.push(l), { heartbeatMs: 200 });
    const groupId = await groupWithLimit("captain", 6);
    const { runId, instanceHash } = await requestRun(boss, { groupId });
    firstRun = runId;
    const { run, seen } = await watchRun(runId, (r) => r.state !== "queued" && r.state !== "running", 120_000);
    expect(run.state, `${run.error}; ${log.join(" | ")}`).toBe("succeeded");
    const before100 = new Set(seen.filter((p) => p.percent < 100).map((p) => p.percent));
    expect(before100.size).toBeGreaterThanOrEqual(3);
    expect(seen.at(-1)!.percent).toBe(100);
    // The run keeps its input's hash (RFC 8785 canonical JSON, SHA-256), its results and its statistics.
    expect(sha256Hex(run.instance)).toBe(instanceHash);
    expect(run.instanceHash).toBe(instanceHash);
    const award = awardSchema.parse(run.award);
    const crew = await db().crewMember.count({ where: { position: "captain" } });
    expect(award.lines).toHaveLength(crew);
    expect(await db().awardedLine.count({ where: { awardRunId: runId } })).toBe(crew);
    expect((run.stats as { report?: { method?: string } }).report?.method).toBe("column-generation");
    expect(run.finishedAt!.getTime()).toBeGreaterThan(run.startedAt!.getTime());
  });

  it("cancels a running run, which ends as cancelled; the earlier run keeps its results", async () => {
    const before = await db().awardRun.findUniqueOrThrow({ where: { id: firstRun }, include: { lines: true } });
    const { runId } = await requestRun(boss, { groupId: await groupWithLimit("captain", 120) });
    const running = await watchRun(runId, (r) => r.state === "running" && r.progress.percent > 0, 60_000);
    expect(running.run.state).toBe("running");
    expect(await cancelRun(runId)).toBe("stopping");
    const { run } = await watchRun(runId, (r) => r.state !== "running", 60_000);
    expect(run.state).toBe("cancelled");
    expect(run.award).toBeNull();
    expect(await db().awardedLine.count({ where: { awardRunId: runId } })).toBe(0);
    const after = await db().awardRun.findUniqueOrThrow({ where: { id: firstRun }, include: { lines: true } });
    expect(after).toEqual(before);
    // A finished run cannot be cancelled.
    await expect(cancelRun(firstRun)).rejects.toThrow(/finished already/);
  });

  it("cancels a queued run at once", async () => {
    // A run whose job is not on the queue yet: straight to cancelled.
    const group = await db().awardGroup.findFirstOrThrow({ where: { position: "first_officer" } });
    const run = await db().awardRun.create({ data: { awardGroupId: group.id, settings: {}, instance: {}, instanceHash: "0".repeat(64) } });
    expect(await cancelRun(run.id)).toBe("cancelled");
    expect((await db().awardRun.findUniqueOrThrow({ where: { id: run.id } })).state).toBe("cancelled");
  });

  it("closes a run that cannot be worked with the reason", async () => {
    const group = await db().awardGroup.findFirstOrThrow({ where: { position: "first_officer" } });
    const run = await db().awardRun.create({ data: { awardGroupId: group.id, settings: {}, instance: { not: "an instance" }, instanceHash: "0".repeat(64) } });
    expect(await boss.send(AWARD_QUEUE, { runId: run.id })).toBeTruthy();
    const { run: after } = await watchRun(run.id, (r) => r.state !== "queued" && r.state !== "running", 30_000);
    expect(after.state).toBe("failed");
    expect(after.error).toMatch(/the run's instance cannot be read/);
    expect(after.finishedAt).not.toBeNull();
  });
});
