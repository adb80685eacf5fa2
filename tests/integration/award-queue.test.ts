import type PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { claimRun } from "@/lib/db/award-runs";
import { db } from "@/lib/db/client";
import { startAwardWorker } from "@/lib/jobs/award-worker";
import { AWARD_QUEUE, startQueue } from "@/lib/jobs/queue";
import { smallScenario } from "@/seed/small-scenario";
import { writeScenario } from "@/seed/write-scenario";
import { truncateAll } from "../support/reset";

async function queuedRun(): Promise<string> {
  const group = await db().awardGroup.findFirstOrThrow();
  const run = await db().awardRun.create({
    data: { awardGroupId: group.id, settings: {}, instance: {}, instanceHash: "0".repeat(64) },
  });
  return run.id;
}

describe("the award queue", () => {
  let boss: PgBoss;
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    await writeScenario(db(), smallScenario({ now: new Date("2026-12-01T12:00:00Z") }));
    boss = await startQueue(inject("databaseUrl"));
  });
  afterAll(async () => {
    await boss.stop({ graceful: false });
  });

  it("lets only one claimer take a run (the run row is the lock)", async () => {
    const id = await queuedRun();
    const claims = await Promise.all([claimRun(id), claimRun(id), claimRun(id)]);
    expect(claims.filter(Boolean)).toHaveLength(1);
    expect((await db().awardRun.findUniqueOrThrow({ where: { id } })).state).toBe("running");
  });

  it("delivers a job to the worker, which closes the run with a plain message", async () => {
    const lines: string[] = [];
    await startAwardWorker(boss, (l) => lines.push(l));
    const id = await queuedRun();
    // Starting the queue twice is harmless: the queue already exists.
    await (await startQueue(inject("databaseUrl"))).stop({ graceful: false });
    expect(await boss.send(AWARD_QUEUE, { runId: id })).toBeTruthy();
    let run = await db().awardRun.findUniqueOrThrow({ where: { id } });
    for (let i = 0; i < 100 && run.state !== "failed"; i++) {
      await new Promise((r) => setTimeout(r, 200));
      run = await db().awardRun.findUniqueOrThrow({ where: { id } });
    }
    expect(run.state).toBe("failed");
    expect(run.error).toMatch(/no award engine yet/);
    expect(run.finishedAt).not.toBeNull();
  });
});
