/**
 * Comparing two runs of one award group: who changed, by how much, and the
 * totals side by side. The first run is real (the worker's workRun); the
 * second is the same award with two known crew members' lines exchanged.
 */
import { beforeAll, describe, expect, inject, it } from "vitest";
import { awardSchema, sha256Hex } from "@/lib/domain";
import { compareRuns } from "@/lib/db/award-runs";
import { db } from "@/lib/db/client";
import { exportPeriod } from "@/lib/db/period-export";
import { workRun } from "@/lib/jobs/award-worker";
import { smallScenario } from "@/seed/small-scenario";
import { writeScenario } from "@/seed/write-scenario";
import { truncateAll } from "../support/reset";

let groupId = "";
let first = "";

async function storedRun(award: unknown): Promise<string> {
  const run = await db().awardRun.create({ data: { awardGroupId: groupId, settings: {}, instance: {}, instanceHash: "0".repeat(64), state: "succeeded", award: JSON.parse(JSON.stringify(award)) } });
  return run.id;
}

describe("comparing two runs", { timeout: 60_000 }, () => {
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    const { periodId } = await writeScenario(db(), smallScenario({ now: new Date("2026-12-01T12:00:00Z") }));
    groupId = (await db().awardGroup.findFirstOrThrow({ where: { bidPeriodId: periodId, position: "captain" } })).id;
    const instance = (await exportPeriod(db(), periodId)).instances.find((i) => i.group.position === "captain")!;
    const limited = { ...instance, settings: { ...instance.settings, timeLimitSeconds: 3 } };
    const run = await db().awardRun.create({ data: { awardGroupId: groupId, settings: limited.settings, instance: JSON.parse(JSON.stringify(limited)), instanceHash: sha256Hex(instance) } });
    await workRun(run.id, () => {});
    first = run.id;
  });

  it("shows exactly the crew whose lines differ, with the change in satisfaction, and both runs' totals", async () => {
    const award = awardSchema.parse((await db().awardRun.findUniqueOrThrow({ where: { id: first } })).award);
    const [x, y] = award.lines.filter((l) => l.kind === "line" && l.pairings.length > 0);
    expect(x && y).toBeTruthy();
    const swapped = {
      ...award,
      lines: award.lines.map((l) =>
        l.crewId === x!.crewId ? { ...l, pairings: y!.pairings, satisfaction: 0.25 } : l.crewId === y!.crewId ? { ...l, pairings: x!.pairings, satisfaction: 0.5 } : l,
      ),
    };
    const second = await storedRun(swapped);
    const result = await compareRuns(first, second);
    expect(result.changed.map((c) => c.crewId).sort()).toEqual([x!.crewId, y!.crewId].sort());
    const cx = result.changed.find((c) => c.crewId === x!.crewId)!;
    expect(cx.satisfactionChange).toBeCloseTo(0.25 - x!.satisfaction, 12);
    expect(cx.second?.pairings).toEqual(y!.pairings);
    const mean = (xs: number[]) => xs.reduce((t, v) => t + v, 0) / xs.length;
    expect(result.first.totals.meanSatisfaction).toBeCloseTo(mean(award.lines.map((l) => l.satisfaction)), 12);
    expect(result.second.totals.meanSatisfaction).toBeCloseTo(mean(swapped.lines.map((l) => l.satisfaction)), 12);
    expect(result.second.totals.openPositions).toBe(result.first.totals.openPositions);
  });

  it("shows no one for the same award, and refuses runs of two groups or unfinished ones", async () => {
    const award = (await db().awardRun.findUniqueOrThrow({ where: { id: first } })).award;
    expect((await compareRuns(first, await storedRun(award))).changed).toEqual([]);
    const officers = await db().awardGroup.findFirstOrThrow({ where: { position: "first_officer" } });
    const other = await db().awardRun.create({ data: { awardGroupId: officers.id, settings: {}, instance: {}, instanceHash: "0".repeat(64), state: "succeeded", award: JSON.parse(JSON.stringify(award)) } });
    await expect(compareRuns(first, other.id)).rejects.toThrow(/different award groups/);
    const queued = await db().awardRun.create({ data: { awardGroupId: groupId, settings: {}, instance: {}, instanceHash: "0".repeat(64) } });
    await expect(compareRuns(first, queued.id)).rejects.toThrow(/only finished runs can be compared/);
  });
});
