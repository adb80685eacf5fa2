import { createHash } from "node:crypto";
import { canonicalize as independentJcs } from "json-canonicalize";
import { DateTime } from "luxon";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { db } from "@/lib/db/client";
import { copyPreviousBid, loadBid, loadVersion, saveDraft, submitBid, addTripWish } from "@/lib/db/bids";
import { checkCredentials, type SessionUser } from "@/lib/db/users";
import { atLocalTime, isAppError, type Wish } from "@/lib/domain/index";
import { DEMO_PASSWORD, smallScenario } from "@/seed/small-scenario";
import { writeScenario } from "@/seed/write-scenario";
import { truncateAll } from "../support/reset";

// A fixed clock: 2026-12-01 places the bid period in January 2027, deadline 20 Dec 18:00 at HLV.
const scenario = smallScenario({ seed: 3, now: new Date("2026-12-01T12:00:00Z") });
const NOW = new Date("2026-12-05T15:00:00Z");
const ZONE = "America/Denver";
let periodId = "";
let ines: SessionUser;
let dev: SessionUser;
let sam: SessionUser;

const trip = (k: number) => scenario.pairings[k]!.id;

async function fails(p: Promise<unknown>): Promise<{ code: string; message: string; details?: Record<string, unknown> }> {
  try {
    await p;
  } catch (error) {
    if (isAppError(error)) return { code: error.code, message: error.message, details: error.details };
    throw error;
  }
  throw new Error("expected a refusal");
}

describe("a crew member's bid: draft revisions, versions, receipts, deadline and privacy", () => {
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    ({ periodId } = await writeScenario(db(), scenario));
    ines = (await checkCredentials("ines@larkfield.test", DEMO_PASSWORD))!;
    dev = (await checkCredentials("dev@larkfield.test", DEMO_PASSWORD))!;
    sam = (await checkCredentials("sam@larkfield.test", DEMO_PASSWORD))!;
  });

  it("saves drafts as revisions and keeps every submitted version unchanged", async () => {
    const first: Wish[] = [{ kind: "free-days", dates: ["2027-01-01"] }];
    const saved = await saveDraft(ines, { periodId, baseRevision: 0, wishes: first }, NOW);
    expect(saved).toMatchObject({ status: "saved", draft: { revision: 1 } });
    const v1 = await submitBid(ines, { periodId, revision: 1 }, NOW);
    expect(v1).toMatchObject({ status: "submitted", unchanged: false, version: { version: 1, revision: 1 } });

    const second = [...first, { kind: "trip", pairingIds: [trip(3)], count: 1 }];
    expect(await saveDraft(ines, { periodId, baseRevision: 1, wishes: second }, NOW)).toMatchObject({ status: "saved", draft: { revision: 2 } });
    const v2 = await submitBid(ines, { periodId, revision: 2 }, new Date(NOW.getTime() + 60_000));
    if (v2.status !== "submitted" || v1.status !== "submitted") throw new Error("not submitted");
    expect(v2.version.version).toBe(2);
    expect(v2.version.receiptCode).not.toBe(v1.version.receiptCode);
    // Submitting the same revision again adds no version.
    expect(await submitBid(ines, { periodId, revision: 2 }, NOW)).toMatchObject({ status: "submitted", unchanged: true, version: { version: 2 } });

    const view = await loadBid(ines);
    expect(view.versions.map((v) => v.version)).toEqual([2, 1]);
    expect(view.versions[1]!.wishes).toEqual(first);
    expect(view.versions[1]!.hash).toBe(v1.version.hash);
    expect(await db().bidSubmission.count({ where: { bidPeriodId: periodId } })).toBe(2);
  });

  it("the same content submitted again as a later version gets a receipt code of its own", async () => {
    const a: Wish[] = [{ kind: "rhythm", maxDaysOn: 4 }];
    const b: Wish[] = [{ kind: "rhythm", maxDaysOn: 5 }];
    let rev = (await loadBid(dev)).draft.revision;
    const codes: string[] = [];
    const hashes: string[] = [];
    for (const wishes of [a, b, a]) {
      const s = await saveDraft(dev, { periodId, baseRevision: rev, wishes }, NOW);
      if (s.status !== "saved") throw new Error("conflict");
      rev = s.draft.revision;
      const v = await submitBid(dev, { periodId, revision: rev }, NOW);
      if (v.status !== "submitted") throw new Error("conflict");
      codes.push(v.version.receiptCode);
      hashes.push(v.version.hash);
    }
    expect(hashes[2]).toBe(hashes[0]);
    expect(new Set(codes).size).toBe(3);
  });

  it("a second device saving from an older revision gets a conflict with the stored draft, and nothing is overwritten", async () => {
    const start = (await loadBid(ines)).draft;
    const phone: Wish[] = [...start.wishes, { kind: "credit", minMinutes: 70 * 60, maxMinutes: 80 * 60 }];
    const laptop: Wish[] = [{ kind: "buddy", crewId: "4114" }];
    expect(await saveDraft(ines, { periodId, baseRevision: start.revision, wishes: phone }, NOW)).toMatchObject({ status: "saved" });
    const second = await saveDraft(ines, { periodId, baseRevision: start.revision, wishes: laptop }, NOW);
    expect(second.status).toBe("conflict");
    if (second.status !== "conflict") return;
    expect(second.stored.revision).toBe(start.revision + 1);
    expect(second.stored.wishes).toEqual(phone);
    expect((await loadBid(ines)).draft.wishes).toEqual(phone);
    // A stale submit is a conflict too, not a version of something not seen.
    expect((await submitBid(ines, { periodId, revision: start.revision }, NOW)).status).toBe("conflict");
    // Choosing to keep the laptop's version is a save from the stored revision.
    expect(await saveDraft(ines, { periodId, baseRevision: second.stored.revision, wishes: laptop }, NOW)).toMatchObject({ status: "saved" });
    expect((await loadBid(ines)).draft.wishes).toEqual(laptop);
  });

  it("the receipt hash equals SHA-256 of RFC 8785 JSON (json-canonicalize package) whatever order the keys arrive in", async () => {
    const forwards = [
      { kind: "trip", count: 2, filter: { lengthDays: { min: 2, max: 3 }, layoverAt: ["PLM"], reportAfter: "08:00" } },
      { kind: "credit", minMinutes: 4200, maxMinutes: 4800 },
      { kind: "free-days", dates: ["2027-01-10", "2027-01-11"] },
    ];
    const backwards = [
      { filter: { reportAfter: "08:00", layoverAt: ["PLM"], lengthDays: { max: 3, min: 2 } }, count: 2, kind: "trip" },
      { maxMinutes: 4800, minMinutes: 4200, kind: "credit" },
      { dates: ["2027-01-10", "2027-01-11"], kind: "free-days" },
    ];
    const hashes: string[] = [];
    for (const wishes of [forwards, backwards]) {
      const rev = (await loadBid(sam)).draft.revision;
      const s = await saveDraft(sam, { periodId, baseRevision: rev, wishes }, NOW);
      if (s.status !== "saved") throw new Error("conflict");
      const v = await submitBid(sam, { periodId, revision: s.draft.revision }, NOW);
      if (v.status !== "submitted") throw new Error("conflict");
      hashes.push(v.version.hash);
      // RFC 8785 via the json-canonicalize package, over the bid as sent (keys in their arrival order).
      const bid = { wishes, periodId, crewId: "4177" };
      expect(v.version.hash).toBe(createHash("sha256").update(independentJcs(bid), "utf8").digest("hex"));
    }
    expect(hashes[0]).toBe(hashes[1]);
  });

  it("refuses a bad wish with the field that is wrong, and keeps the stored draft", async () => {
    const before = (await loadBid(sam)).draft;
    const bad = await fails(saveDraft(sam, { periodId, baseRevision: before.revision, wishes: [{ kind: "free-days", dates: ["2027-02-30"] }] }, NOW));
    expect(bad.code).toBe("invalid");
    expect(bad.details?.issues).toEqual([{ path: [0, "dates", 0], message: "expected a date such as 2027-03-14" }]);
    const unknown = await fails(saveDraft(sam, { periodId, baseRevision: before.revision, wishes: [{ kind: "rhythm", weekendsOff: true }, { kind: "trip", pairingIds: ["T999"] }] }, NOW));
    expect(unknown.details?.issues).toEqual([{ path: [1, "pairingIds", 0], message: "there is no trip T999 in January 2027" }]);
    const self = await fails(saveDraft(sam, { periodId, baseRevision: before.revision, wishes: [{ kind: "buddy", crewId: "4177" }] }, NOW));
    expect(self.details?.issues).toEqual([{ path: [0, "crewId"], message: "a buddy wish names someone else" }]);
    expect((await loadBid(sam)).draft).toEqual(before);
  });

  it("enforces the deadline in the base's zone across the change to daylight-saving time", async () => {
    // 14 Mar 2027: Denver springs forward at 02:00, so 18:00 that day is MDT (UTC-6), not MST (UTC-7).
    const deadline = atLocalTime("2027-03-14", "18:00", ZONE);
    // Independent of lib/domain/time: luxon straight from the wall clock.
    expect(deadline).toBe(DateTime.fromObject({ year: 2027, month: 3, day: 14, hour: 18 }, { zone: ZONE }).toUTC().toISO({ suppressMilliseconds: true }));
    expect(deadline).toBe("2027-03-15T00:00:00Z");
    await db().bidPeriod.update({ where: { id: periodId }, data: { deadline: new Date(deadline) } });
    try {
      const rev = (await loadBid(dev)).draft.revision;
      const wishes: Wish[] = [{ kind: "rhythm", weekendsOff: true }];
      const justBefore = await saveDraft(dev, { periodId, baseRevision: rev, wishes }, new Date("2027-03-14T23:59:59Z"));
      expect(justBefore.status).toBe("saved");
      // 00:30Z is 18:30 MDT: past the deadline (with the winter offset it would wrongly read 17:30).
      const late = await fails(saveDraft(dev, { periodId, baseRevision: rev + 1, wishes: [] }, new Date("2027-03-15T00:30:00Z")));
      expect(late.code).toBe("deadline_passed");
      expect(late.message).toBe("bidding for January 2027 closed at Sun, Mar 14, 18:00 MDT; your bid was not changed");
      const lateSubmit = await fails(submitBid(dev, { periodId, revision: rev + 1 }, new Date("2027-03-15T00:00:00Z")));
      expect(lateSubmit.code).toBe("deadline_passed");
      expect((await loadBid(dev)).draft.wishes).toEqual(wishes);
    } finally {
      await db().bidPeriod.update({ where: { id: periodId }, data: { deadline: new Date(scenario.period.deadline) } });
    }
  });

  it("a crew member reaches only their own bid; other roles have none", async () => {
    const mine = (await loadBid(ines)).versions[0]!;
    expect((await loadVersion(ines, mine.id)).version.receiptCode).toBe(mine.receiptCode);
    expect((await fails(loadVersion(sam, mine.id))).code).toBe("not_found");
    expect((await loadBid(sam)).versions.every((v) => v.wishes.every((w) => w.kind !== "buddy"))).toBe(true);
    const planner = (await checkCredentials("planning@larkfield.test", DEMO_PASSWORD))!;
    expect((await fails(loadBid(planner))).code).toBe("forbidden");
    expect((await fails(saveDraft(planner, { periodId, baseRevision: 0, wishes: [] }, NOW))).code).toBe("forbidden");
  });

  it("adds a trip from its page to the end of the draft, and copies last period's bid as a starting point", async () => {
    const before = (await loadBid(sam)).draft;
    const after = await addTripWish(sam, trip(7), NOW);
    expect(after.revision).toBe(before.revision + 1);
    expect(after.wishes.at(-1)).toEqual({ kind: "trip", pairingIds: [trip(7)], count: 1 });

    // December 2026 at the same base, with a bid Sam submitted there.
    const base = await db().bidPeriod.findUniqueOrThrow({ where: { id: periodId } });
    const crew = await db().crewMember.findUniqueOrThrow({ where: { employeeNumber: "4177" } });
    await db().bidPeriod.create({
      data: {
        id: "HLV-2026-12", baseId: base.baseId, name: "December 2026", startDate: new Date("2026-12-01"), endDate: new Date("2026-12-31"),
        zone: ZONE, opensAt: new Date("2026-11-01T07:00:00Z"), deadline: new Date("2026-11-21T01:00:00Z"), state: "published",
        submissions: { create: { crewMemberId: crew.id, revision: 3, hash: "0".repeat(64), receiptCode: "OLD0-0000-0001", wishes: [
          { kind: "free-days", dates: ["2026-12-24"] }, { kind: "rhythm", maxDaysOn: 3 }, { kind: "no-trip", filter: { redEye: true } },
        ] } },
      },
    });
    const copied = await copyPreviousBid(sam, { periodId, baseRevision: after.revision }, NOW);
    expect(copied).toMatchObject({ status: "saved", copied: 2 });
    expect(copied.leftBehind).toEqual(["wish 1: free days named last period's dates"]);
    expect((await loadBid(sam)).draft.wishes.slice(-2)).toEqual([{ kind: "rhythm", maxDaysOn: 3 }, { kind: "no-trip", filter: { redEye: true } }]);
  });
});
