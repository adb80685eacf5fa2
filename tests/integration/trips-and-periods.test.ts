import { DateTime } from "luxon";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { db } from "@/lib/db/client";
import { listPeriods, openPeriodForCrew } from "@/lib/db/periods";
import { checkCredentials, userById } from "@/lib/db/users";
import { DEMO_PASSWORD, smallScenario } from "@/seed/small-scenario";
import { writeScenario } from "@/seed/write-scenario";
import { truncateAll } from "../support/reset";

// A fixed clock: 2026-12-01 places the bid period in January 2027.
const scenario = smallScenario({ seed: 3, now: new Date("2026-12-01T12:00:00Z") });

describe("a seeded bid period read back through lib/db", () => {
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    await writeScenario(db(), scenario);
  });

  it("lists the period for planning with its counts", async () => {
    const rows = await listPeriods();
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({
      name: "January 2027",
      baseCode: "HLV",
      startDate: "2027-01-01",
      endDate: "2027-01-31",
      state: "open",
      pairings: scenario.pairings.length,
      crew: scenario.crew.length,
      submittedBids: 0,
    });
    // 20 Dec 2026 18:00 in America/Denver (MST, UTC-7) is 21 Dec 01:00 UTC.
    expect(rows[0]!.deadline).toBe("2026-12-21T01:00:00.000Z");
  });

  it("shows a crew member the trips with report and release in base local time", async () => {
    const ines = await checkCredentials("ines@larkfield.test", DEMO_PASSWORD);
    expect(ines?.role).toBe("crew");
    const view = await openPeriodForCrew(ines!);
    expect(view?.trips).toHaveLength(scenario.pairings.length);
    const seeded = scenario.pairings[5]!;
    const shown = view!.trips.find((t) => t.code === seeded.id)!;
    const first = seeded.dutyPeriods[0]!;
    const last = seeded.dutyPeriods[seeded.dutyPeriods.length - 1]!;
    // Independent of lib/domain/time: luxon straight from the seeded instants.
    expect(shown.report).toBe(DateTime.fromISO(first.report, { zone: "America/Denver" }).toFormat("HH:mm"));
    expect(shown.release).toBe(DateTime.fromISO(last.release, { zone: "America/Denver" }).toFormat("HH:mm"));
    expect(shown.startDate).toBe(DateTime.fromISO(first.report, { zone: "America/Denver" }).toISODate());
    expect(shown.creditMinutes).toBe(seeded.creditMinutes);
    expect(shown.layovers).toEqual(seeded.dutyPeriods.slice(0, -1).map((d) => d.legs[d.legs.length - 1]!.to));
    // Trips come in time order.
    const starts = view!.trips.map((t) => t.startDate);
    expect([...starts].sort()).toEqual(starts);
  });

  it("does not show a trip to a position it does not need", async () => {
    const trip = scenario.pairings[0]!.id;
    await db().pairing.updateMany({ where: { code: trip }, data: { crewNeeded: { captain: 1 } } });
    const dev = await checkCredentials("dev@larkfield.test", DEMO_PASSWORD); // a first officer
    const view = await openPeriodForCrew(dev!);
    expect(view!.trips.map((t) => t.code)).not.toContain(trip);
    const ines = await checkCredentials("ines@larkfield.test", DEMO_PASSWORD); // a captain
    expect((await openPeriodForCrew(ines!))!.trips.map((t) => t.code)).toContain(trip);
  });

  it("refuses a wrong password and an unknown account alike, and re-reads a changed role at once", async () => {
    expect(await checkCredentials("ines@larkfield.test", "wrong")).toBeNull();
    expect(await checkCredentials("nobody@larkfield.test", DEMO_PASSWORD)).toBeNull();
    const u = await checkCredentials("  INES@larkfield.test ", DEMO_PASSWORD);
    expect(u).not.toBeNull();
    await db().user.update({ where: { id: u!.id }, data: { role: "scheduler" } });
    expect((await userById(u!.id))?.role).toBe("scheduler");
    await db().user.update({ where: { id: u!.id }, data: { role: "crew" } });
  });

  it("refuses a second copy of the period, naming the clash, and leaves the first untouched", async () => {
    const before = await db().pairing.count();
    await expect(writeScenario(db(), scenario)).rejects.toThrow(/already in the database/);
    expect(await db().pairing.count()).toBe(before);
    expect(await db().bidPeriod.count()).toBe(1);
    expect(await db().user.count()).toBe(scenario.users.length);
  });
});
