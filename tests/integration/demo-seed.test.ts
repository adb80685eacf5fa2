// The demo's data, written by the same function `npm run demo` and
// `npm run db:reset` call: the open month and, before it, a month holding a
// bid each demo crew account submitted, so "start from my last bid" is there.
import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { canonicalize as independentJcs } from "json-canonicalize";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { db } from "@/lib/db/client";
import { copyPreviousBid, loadBid, previousBid } from "@/lib/db/bids";
import { checkCredentials, type SessionUser } from "@/lib/db/users";
import { seedDemoIfEmpty, writeDemoFiles } from "@/seed/demo";
import { createPeriod } from "@/lib/db/period-create";
import { importCsvFiles } from "@/lib/db/period-csv-import";
import { DEMO_PASSWORD } from "@/seed/demo-users";
import { truncateAll } from "../support/reset";

const NOW = new Date("2026-12-01T12:00:00Z");
let crew: SessionUser[] = [];

describe("the demo seed", () => {
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    const { users } = await seedDemoIfEmpty(db(), NOW);
    crew = await Promise.all(users.filter((u) => u.role === "crew").map(async (u) => (await checkCredentials(u.email, DEMO_PASSWORD))!));
  }, 120_000);

  it("holds the month before the open one, closed, at the same base, with a submitted bid for every demo crew account", async () => {
    const periods = await db().bidPeriod.findMany({ orderBy: { startDate: "asc" }, include: { submissions: { include: { crewMember: true } } } });
    expect(periods.map((p) => [p.name, p.state])).toEqual([["December 2026", "closed"], ["January 2027", "open"]]);
    expect(periods[0]!.baseId).toBe(periods[1]!.baseId);
    expect(crew).toHaveLength(3);
    const past = periods[0]!;
    expect(past.submissions.map((s) => s.crewMemberId).sort()).toEqual(crew.map((u) => u.crewMemberId).sort());
    // The receipt hash, re-computed with an independent RFC 8785 implementation (npm json-canonicalize).
    for (const s of past.submissions) {
      const content = { crewId: s.crewMember.employeeNumber, periodId: past.id, wishes: s.wishes };
      expect(s.hash).toBe(createHash("sha256").update(independentJcs(content)).digest("hex"));
    }
  });

  it("offers that bid to each demo crew account, and copying it keeps what carries over", async () => {
    const user = crew[0]!;
    const view = await loadBid(user);
    expect(view.draft.revision).toBe(0);
    expect((await previousBid(view.scope))?.periodName).toBe("December 2026");
    const copied = await copyPreviousBid(user, { periodId: view.scope.period.id, baseRevision: 0 }, NOW);
    expect(copied).toMatchObject({ status: "saved", copied: 4, draft: { revision: 1 } });
    expect(copied.leftBehind).toEqual(["wish 2: free days named last period's dates", "wish 5: it named last period's trips (T105)"]);
    expect((await loadBid(user)).draft.wishes.map((w) => w.kind)).toEqual(["trip", "no-trip", "rhythm", "credit"]);
  });

  it("writes the next month's CSV files, which import into a new period with the demo's crew unchanged", async () => {
    const dir = writeDemoFiles(NOW, fs.mkdtempSync(path.join(os.tmpdir(), "demo-files-")));
    expect(path.basename(dir)).toBe("2027-02");
    const read = (f: string) => fs.readFileSync(path.join(dir, f), "utf8");
    const scheduler = (await db().user.findFirstOrThrow({ where: { role: "scheduler" } })).id;
    const { id } = await createPeriod({ baseCode: "HLV", startDate: "2027-02-01", endDate: "2027-02-28" }, scheduler);
    const result = await importCsvFiles(id, scheduler, { trips: read("trips.csv"), legs: read("legs.csv"), crew: read("crew.csv"), activities: read("activities.csv") });
    const crewCount = await db().crewMember.count();
    expect(result.crew).toEqual({ added: 0, changed: 0, removed: 0, unchanged: crewCount });
    // January is open: leave that reaches into it from February stays as January's data has it.
    expect(result.activities!.kept).toBeGreaterThan(0);
    expect(result.activities!.keptIn).toEqual(["January 2027 (open for bidding)"]);
    const again = await importCsvFiles(id, scheduler, { trips: read("trips.csv"), legs: read("legs.csv"), crew: read("crew.csv"), activities: read("activities.csv") });
    expect(again.changed).toBe(false);
    expect(result.trips!.added).toBe(read("trips.csv").trimEnd().split("\n").length - 1);
    expect(result.trips!.added).toBeGreaterThan(100);
  }, 60_000);
});
