/**
 * Publishing (DESIGN.md, "Publishing again"): every award group's run in one
 * transaction, the reviewer recorded; publishing the same runs again is a
 * no-op with a message; a stale run (its input changed after it ran) is
 * refused and nothing is written; other runs replace the award as a
 * correction; crew then see their line. The runs are real: the award worker's
 * workRun on each group's exported instance (no pg-boss here).
 */
import { beforeAll, describe, expect, inject, it } from "vitest";
import { sha256Hex } from "@/lib/domain";
import { db } from "@/lib/db/client";
import { exportPeriod } from "@/lib/db/period-export";
import { createPeriod } from "@/lib/db/period-create";
import { publishedLine, publishPeriod } from "@/lib/db/publish";
import { workRun } from "@/lib/jobs/award-worker";
import { smallScenario } from "@/seed/small-scenario";
import { writeScenario } from "@/seed/write-scenario";
import { truncateAll } from "../support/reset";

let periodId = "";
let reviewerId = "";
const groups: Record<"captain" | "first_officer", string> = { captain: "", first_officer: "" };

/** A finished run of `position`'s group on the period as it stands now. */
async function finishedRun(position: "captain" | "first_officer"): Promise<string> {
  const bundle = await exportPeriod(db(), periodId);
  const instance = bundle.instances.find((i) => i.group.position === position)!;
  const limited = { ...instance, settings: { ...instance.settings, timeLimitSeconds: 3 } };
  const run = await db().awardRun.create({
    // The hash is of the instance as exported (the settings as stored), as requestRun stores it.
    data: { awardGroupId: groups[position], settings: limited.settings, instance: JSON.parse(JSON.stringify(limited)), instanceHash: sha256Hex(instance) },
  });
  await workRun(run.id, () => {});
  const after = await db().awardRun.findUniqueOrThrow({ where: { id: run.id } });
  expect(after.state, after.error ?? "").toBe("succeeded");
  return run.id;
}

const auditCount = (action: string) => db().auditEvent.count({ where: { entity: "BidPeriod", entityId: periodId, action } });

describe("publishing a bid period", { timeout: 120_000 }, () => {
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    ({ periodId } = await writeScenario(db(), smallScenario({ now: new Date("2026-12-01T12:00:00Z") })));
    reviewerId = (await db().user.findFirstOrThrow({ where: { role: "scheduler" } })).id;
    for (const g of await db().awardGroup.findMany({ where: { bidPeriodId: periodId } })) groups[g.position as keyof typeof groups] = g.id;
  });

  let first: Record<string, string> = {};
  it("refuses while bidding is open", async () => {
    first = { [groups.captain]: await finishedRun("captain"), [groups.first_officer]: await finishedRun("first_officer") };
    await expect(publishPeriod({ periodId, runs: first, reviewerId })).rejects.toThrow(/still open: close it before publishing/);
    await db().bidPeriod.update({ where: { id: periodId }, data: { state: "closed", closedAt: new Date() } });
  });

  it("publishes every group's run at once, records the reviewer, and crew see their line", async () => {
    const exportedBefore = sha256Hex(await exportPeriod(db(), periodId));
    const outcome = await publishPeriod({ periodId, runs: first, reviewerId });
    expect(outcome.status).toBe("published");
    // Publishing writes the ledger, which only later periods read: this period's own export is unchanged.
    expect(sha256Hex(await exportPeriod(db(), periodId))).toBe(exportedBefore);
    const period = await db().bidPeriod.findUniqueOrThrow({ where: { id: periodId }, include: { groups: true } });
    expect(period.state).toBe("published");
    expect(Object.fromEntries(period.groups.map((g) => [g.id, g.chosenRunId]))).toEqual(first);
    for (const runId of Object.values(first)) expect((await db().awardRun.findUniqueOrThrow({ where: { id: runId } })).reviewedById).toBe(reviewerId);
    expect(await auditCount("period.published")).toBe(1);
    // A crew member's published line is the chosen run's line for them.
    const line = await db().awardedLine.findFirstOrThrow({ where: { awardRunId: first[groups.captain], kind: "line" } });
    const seen = await publishedLine(line.crewMemberId);
    expect(seen?.kind).toBe("line");
    expect(seen?.trips.map((t) => t.code).sort()).toEqual([...line.pairingCodes].sort());
    expect(seen?.creditMinutes).toBe(line.creditMinutes);
    // The fairness ledger: one entry per crew member, from the chosen run's satisfaction; a first period's balances sum to 0 per group.
    const entries = await db().fairnessEntry.findMany({ where: { bidPeriodId: periodId } });
    const lines = await db().awardedLine.findMany({ where: { awardRunId: { in: Object.values(first) } } });
    expect(entries).toHaveLength(12);
    expect(entries.map((e) => [e.crewMemberId, e.awardRunId, e.satisfaction]).sort()).toEqual(lines.map((l) => [l.crewMemberId, l.awardRunId, l.satisfaction]).sort());
    for (const runId of Object.values(first)) {
      const group = entries.filter((e) => e.awardRunId === runId);
      expect(group.reduce((sum, e) => sum + e.balance, 0)).toBeCloseTo(0, 9);
      for (const e of group) expect(e.carriedWeight).toBeCloseTo(Math.min(2, Math.max(0.5, 1 + e.balance)), 12);
    }
  });

  it("publishing the same runs again changes nothing and says so", async () => {
    const outcome = await publishPeriod({ periodId, runs: first, reviewerId });
    expect(outcome).toEqual({ status: "unchanged", message: "January 2027 is already published with these runs; nothing was changed" });
    expect(await auditCount("period.published")).toBe(1);
    expect(await auditCount("period.corrected")).toBe(0);
    expect(await db().fairnessEntry.count({ where: { bidPeriodId: periodId } })).toBe(12);
  });

  it("refuses a stale run and writes nothing, not even the other group's fresh run", async () => {
    const freshOfficers = await finishedRun("first_officer");
    const captains = await finishedRun("captain");
    // A captain's record changes after the captains' run: that run no longer matches the period.
    const captain = await db().crewMember.findFirstOrThrow({ where: { position: "captain" } });
    await db().crewMember.update({ where: { id: captain.id }, data: { qualifications: [...captain.qualifications, "lang:fr"] } });
    const before = await db().awardGroup.findMany({ where: { bidPeriodId: periodId }, orderBy: { id: "asc" } });
    await expect(publishPeriod({ periodId, runs: { [groups.captain]: captains, [groups.first_officer]: freshOfficers }, reviewerId })).rejects.toThrow(
      /the run chosen for the captains is stale: the period's bids, trips or crew changed after it ran; run the award again/,
    );
    expect(await db().awardGroup.findMany({ where: { bidPeriodId: periodId }, orderBy: { id: "asc" } })).toEqual(before);
    expect(await auditCount("period.corrected")).toBe(0);
    // The runs already published are still the award: asked again, publishing says so rather than calling them stale.
    expect((await publishPeriod({ periodId, runs: first, reviewerId })).status).toBe("unchanged");
  });

  it("replaces the award with other fresh runs as a correction, once even when two schedulers publish at once", async () => {
    const next = { [groups.captain]: await finishedRun("captain"), [groups.first_officer]: await finishedRun("first_officer") };
    const outcomes = await Promise.all([publishPeriod({ periodId, runs: next, reviewerId }), publishPeriod({ periodId, runs: next, reviewerId })]);
    expect(outcomes.map((o) => o.status).sort()).toEqual(["corrected", "unchanged"]);
    expect(await auditCount("period.corrected")).toBe(1);
    const period = await db().bidPeriod.findUniqueOrThrow({ where: { id: periodId }, include: { groups: true } });
    expect(Object.fromEntries(period.groups.map((g) => [g.id, g.chosenRunId]))).toEqual(next);
    // The ledger is replaced, not added to.
    const entries = await db().fairnessEntry.findMany({ where: { bidPeriodId: periodId } });
    expect(entries).toHaveLength(12);
    expect(new Set(entries.map((e) => e.awardRunId))).toEqual(new Set(Object.values(next)));
  });

  it("carries the ledger's weights into the next period's export, and leaves this period's own export as it was", async () => {
    const { id } = await createPeriod({ baseCode: "HLV", startDate: "2027-02-01", endDate: "2027-02-28" }, reviewerId);
    const entries = new Map((await db().fairnessEntry.findMany({ where: { bidPeriodId: periodId }, include: { crewMember: true } })).map((e) => [e.crewMember.employeeNumber, e.carriedWeight]));
    const next = await exportPeriod(db(), id);
    const carried = new Map(next.instances.flatMap((i) => i.crew.map((c) => [c.id, c.carriedWeight])));
    expect(carried).toEqual(entries);
    expect([...carried.values()].some((w) => w !== 1)).toBe(true);
    const own = await exportPeriod(db(), periodId);
    expect(own.instances.flatMap((i) => i.crew.map((c) => c.carriedWeight)).every((w) => w === 1)).toBe(true);
  });

  it("refuses a run that has not finished, or belongs to another group", async () => {
    const queued = await db().awardRun.create({ data: { awardGroupId: groups.captain, settings: {}, instance: {}, instanceHash: "0".repeat(64) } });
    const current = (await db().awardGroup.findUniqueOrThrow({ where: { id: groups.first_officer } })).chosenRunId!;
    await expect(publishPeriod({ periodId, runs: { [groups.captain]: queued.id, [groups.first_officer]: current }, reviewerId })).rejects.toThrow(/has not finished/);
    await expect(publishPeriod({ periodId, runs: { [groups.captain]: current, [groups.first_officer]: current }, reviewerId })).rejects.toThrow(/is not one of theirs/);
    const captains = (await db().awardGroup.findUniqueOrThrow({ where: { id: groups.captain } })).chosenRunId!;
    await expect(publishPeriod({ periodId, runs: { [groups.captain]: captains }, reviewerId })).rejects.toThrow(/choose a finished run for the first officers/);
  });
});
