/**
 * Preview runs: while bidding is open, a run on the bids submitted so far;
 * each crew member then sees whether the preview granted each of their own
 * submitted wishes, and nothing of anyone else's bid. A preview is never
 * published.
 */
import { beforeAll, describe, expect, inject, it } from "vitest";
import { awardSchema, sha256Hex, type Wish } from "@/lib/domain";
import { previewVerdict } from "@/lib/db/award-runs";
import { saveDraft, submitBid } from "@/lib/db/bids";
import { db } from "@/lib/db/client";
import { exportPeriod } from "@/lib/db/period-export";
import { publishPeriod } from "@/lib/db/publish";
import { userById } from "@/lib/db/users";
import { workRun } from "@/lib/jobs/award-worker";
import { smallScenario } from "@/seed/small-scenario";
import { writeScenario } from "@/seed/write-scenario";
import { truncateAll } from "../support/reset";

const NOW = new Date("2026-12-01T12:00:00Z");
let periodId = "";
let runId = "";
/** captains in seniority order; those with an account first bid */
const captains: { userId: string | null; crewMemberId: string; employeeNumber: string }[] = [];

describe("a preview run", { timeout: 60_000 }, () => {
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    ({ periodId } = await writeScenario(db(), smallScenario({ now: NOW })));
    const crew = await db().crewMember.findMany({ where: { position: "captain" }, include: { user: true }, orderBy: { seniority: "asc" } });
    for (const [k, c] of crew.entries()) {
      // The two most senior captains bid: an account for each who has none.
      const userId = c.user?.id ?? (k < 2 ? (await db().user.create({ data: { email: `bidder${k}@example.test`, name: c.name, role: "crew", passwordHash: "-", crewMemberId: c.id } })).id : null);
      captains.push({ userId, crewMemberId: c.id, employeeNumber: c.employeeNumber });
    }
    // Two captains submit bids: one wants a trip the other avoids.
    const trips = await db().pairing.findMany({ where: { bidPeriodId: periodId }, orderBy: { startsAt: "asc" }, take: 2 });
    const bids: Wish[][] = [
      [{ kind: "trip", pairingIds: [trips[0]!.code], count: 1 }, { kind: "free-days", dates: ["2027-01-30", "2027-01-31"] }],
      [{ kind: "no-trip", pairingIds: [trips[1]!.code] }],
    ];
    for (const [k, wishes] of bids.entries()) {
      const user = (await userById(captains[k]!.userId!))!;
      const saved = await saveDraft(user, { periodId, baseRevision: 0, wishes }, NOW);
      if (saved.status !== "saved") throw new Error(`draft not saved: ${saved.status}`);
      await submitBid(user, { periodId, revision: saved.draft.revision }, NOW);
    }
    const group = await db().awardGroup.findFirstOrThrow({ where: { bidPeriodId: periodId, position: "captain" } });
    const instance = (await exportPeriod(db(), periodId)).instances.find((i) => i.group.position === "captain")!;
    const limited = { ...instance, settings: { ...instance.settings, timeLimitSeconds: 3 } };
    const run = await db().awardRun.create({
      data: { awardGroupId: group.id, preview: true, settings: limited.settings, instance: JSON.parse(JSON.stringify(limited)), instanceHash: sha256Hex(instance) },
    });
    await workRun(run.id, () => {});
    runId = run.id;
  });

  it("shows each crew member the verdict on their own submitted wishes, and nothing of anyone else's", async () => {
    const award = awardSchema.parse((await db().awardRun.findUniqueOrThrow({ where: { id: runId } })).award);
    const first = await previewVerdict(captains[0]!.crewMemberId, periodId);
    const line = award.lines.find((l) => l.crewId === captains[0]!.employeeNumber)!;
    expect(first?.wishes.map((w) => w.wish.kind)).toEqual(["trip", "free-days"]);
    expect(first?.wishes.map((w) => w.granted)).toEqual([0, 1].map((r) => line.grantedWishes.includes(r)));
    const second = await previewVerdict(captains[1]!.crewMemberId, periodId);
    expect(second?.wishes.map((w) => w.wish.kind)).toEqual(["no-trip"]);
    // Someone who did not bid sees an empty verdict; no verdict names another crew member or their wishes.
    const third = await previewVerdict(captains[2]!.crewMemberId, periodId);
    expect(third?.wishes).toEqual([]);
    for (const [k, verdict] of [first, second, third].entries()) {
      const text = JSON.stringify(verdict);
      for (const [j, other] of captains.entries()) if (j !== k) expect(text).not.toContain(other.employeeNumber);
    }
    expect(JSON.stringify(third)).not.toContain("no-trip");
  });

  it("is never published", async () => {
    await db().bidPeriod.update({ where: { id: periodId }, data: { state: "closed" } });
    const groups = await db().awardGroup.findMany({ where: { bidPeriodId: periodId } });
    const runs = Object.fromEntries(groups.map((g) => [g.id, runId]));
    const reviewerId = (await db().user.findFirstOrThrow({ where: { role: "scheduler" } })).id;
    await expect(publishPeriod({ periodId, runs, reviewerId })).rejects.toThrow(/is a preview: run the award itself to publish|is not one of theirs/);
    const captainsGroup = groups.find((g) => g.position === "captain")!;
    const officers = groups.find((g) => g.position === "first_officer")!;
    const officersRun = await db().awardRun.create({ data: { awardGroupId: officers.id, settings: {}, instance: {}, instanceHash: "0".repeat(64), state: "succeeded" } });
    await expect(publishPeriod({ periodId, runs: { [captainsGroup.id]: runId, [officers.id]: officersRun.id }, reviewerId })).rejects.toThrow(/captains is a preview: run the award itself to publish/);
  });
});
