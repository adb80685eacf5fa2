/**
 * The bidding window (DESIGN.md, "Bidding window"): draft → open → closed,
 * each step audited; extending and closing early post in-app notices to the
 * crew; after closing, crew edits are refused and the last submitted bid is
 * what an award run exports. Publishing posts its notice too.
 */
import { beforeAll, describe, expect, inject, it } from "vitest";
import { db } from "@/lib/db/client";
import { closeBidding, extendDeadline, noticesForCrew, openBidding } from "@/lib/db/period-lifecycle";
import { saveDraft } from "@/lib/db/bids";
import { userById } from "@/lib/db/users";
import { smallScenario } from "@/seed/small-scenario";
import { writeScenario } from "@/seed/write-scenario";
import { truncateAll } from "../support/reset";

const DEC_1 = new Date("2026-12-01T12:00:00Z");
let periodId = "";
let scheduler = "";
let crewMemberId = "";

const audits = async () => (await db().auditEvent.findMany({ where: { entityId: periodId }, orderBy: { at: "asc" } })).map((a) => a.action);

describe("the bidding window", () => {
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    ({ periodId } = await writeScenario(db(), smallScenario({ now: DEC_1, state: "draft" })));
    scheduler = (await db().user.findFirstOrThrow({ where: { role: "scheduler" } })).id;
    crewMemberId = (await db().user.findFirstOrThrow({ where: { role: "crew", crewMemberId: { not: null } } })).crewMemberId!;
  });

  it("opens a draft, once, and tells the crew until when", async () => {
    expect(await openBidding(periodId, scheduler, DEC_1)).toBe("Bidding for January 2027 is open until Sun, Dec 20, 18:00 MST");
    await expect(openBidding(periodId, scheduler, DEC_1)).rejects.toThrow(/has been opened already \(it is open\)/);
    expect((await db().bidPeriod.findUniqueOrThrow({ where: { id: periodId } })).state).toBe("open");
    expect((await noticesForCrew(crewMemberId)).map((n) => n.text)).toEqual(["Bidding for January 2027 is open until Sun, Dec 20, 18:00 MST."]);
  });

  it("extends the deadline only to a later time, only before it passes", async () => {
    const current = (await db().bidPeriod.findUniqueOrThrow({ where: { id: periodId } })).deadline;
    await expect(extendDeadline(periodId, new Date(current.getTime() - 3_600_000), scheduler, DEC_1)).rejects.toThrow(/must be after the current one \(Sun, Dec 20, 18:00 MST\)/);
    await expect(extendDeadline(periodId, new Date(current.getTime() + 86_400_000), scheduler, new Date(current.getTime() + 1))).rejects.toThrow(/has passed: it can no longer be extended/);
    const later = new Date(current.getTime() + 86_400_000);
    expect(await extendDeadline(periodId, later, scheduler, DEC_1)).toBe("The deadline is now Mon, Dec 21, 18:00 MST");
    expect((await db().bidPeriod.findUniqueOrThrow({ where: { id: periodId } })).deadline).toEqual(later);
    expect((await noticesForCrew(crewMemberId))[0]!.text).toBe("The bidding deadline for January 2027 is extended to Mon, Dec 21, 18:00 MST.");
  });

  it("closes early only when asked to, tells the crew, and then refuses their edits", async () => {
    const dec5 = new Date("2026-12-05T12:00:00Z");
    await expect(closeBidding(periodId, scheduler, {}, dec5)).rejects.toThrow(/has not passed: confirm closing early, which tells the crew/);
    expect(await closeBidding(periodId, scheduler, { early: true }, dec5)).toBe("Bidding for January 2027 is closed: each crew member's last submitted bid counts");
    const notices = await noticesForCrew(crewMemberId);
    expect(notices[0]!.kind).toBe("closed_early");
    expect(notices[0]!.text).toBe("Bidding for January 2027 was closed early, at Sat, Dec 5, 05:00 MST. Your last submitted bid counts.");
    const user = (await userById((await db().user.findFirstOrThrow({ where: { crewMemberId } })).id))!;
    await expect(saveDraft(user, { periodId, baseRevision: 0, wishes: [] }, dec5)).rejects.toThrow(/bidding for January 2027 is closed; your bid was not changed/);
    await expect(closeBidding(periodId, scheduler, { early: true }, dec5)).rejects.toThrow(/is not open \(it is closed\)/);
    expect(await audits()).toEqual(["period.opened", "period.deadline-extended", "period.closed-early"]);
  });
});
