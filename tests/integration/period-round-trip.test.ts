import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { bidReceipt } from "@/lib/db/bid-receipt";
import { db } from "@/lib/db/client";
import { exportPeriod } from "@/lib/db/period-export";
import { importBundle } from "@/lib/db/period-import";
import {
  addDays,
  addMinutes,
  atLocalTime,
  bundleSchema,
  canonicalJson,
  instantMs,
  schemaVersion,
  startOfLocalDay,
  type Bundle,
  type CrewMember,
  type DutyPeriod,
  type Pairing,
  type Position,
  type RuleSet,
} from "@/lib/domain/index";
import { STATIONS } from "@/seed/carrier";
import { smallScenario, smallScenarioBundle } from "@/seed/small-scenario";
import { truncateAll } from "../support/reset";

// A fixed clock: 2026-12-01 places the bid period in January 2027 (base HLV, America/Denver).
const scenario = smallScenario({ now: new Date("2026-12-01T12:00:00Z") });
const ZONE = scenario.period.zone;
const PERIOD = { id: "HLV-2027-01", name: scenario.period.name, startDate: scenario.period.startDate, endDate: scenario.period.endDate, zone: ZONE };

const FLIGHT_DECK: RuleSet = {
  name: "Flight deck (round-trip test)",
  preset: "us-flightcrew",
  rules: [{ id: "min-rest", params: { minMinutes: 600 }, text: "At least 10 hours of rest between duty periods." }],
};

/** A duty of one leg each way is enough for carry-in; written by hand so the test does not lean on the factory. */
function duty(date: string, departs: string, from: string, to: string, block: number): DutyPeriod {
  const departure = atLocalTime(date, departs, ZONE);
  const arrival = addMinutes(departure, block);
  return {
    report: addMinutes(departure, -60),
    release: addMinutes(arrival, 30),
    legs: [{ flightNumber: `LK${block}`, from, to, departure, arrival, deadhead: false, blockMinutes: block, equipment: "A220" }],
  };
}

function stationsOf(base: string, pairings: Pairing[], crew: CrewMember[]) {
  const codes = new Set([base]);
  for (const leg of pairings.flatMap((p) => p.dutyPeriods.flatMap((d) => d.legs))) codes.add(leg.from).add(leg.to);
  for (const member of crew) {
    for (const leg of member.carryIn.flatMap((t) => t.dutyPeriods.flatMap((d) => d.legs))) codes.add(leg.from).add(leg.to);
    for (const d of member.lookBack.duties) if (d.endStation) codes.add(d.endStation);
  }
  return STATIONS.filter((s) => codes.has(s.code)).sort((a, b) => (a.code < b.code ? -1 : 1));
}

/**
 * The small scenario as a bundle, in the export's orders, with an extra of
 * every kind: a captain-only trip, a vacation and a training day, a carry-in
 * trip, look-back duties and daily totals, a carried weight, bids of every wish
 * kind (and an empty one), non-default settings for the captains.
 */
function scenarioBundle(): Bundle {
  const pairings: Pairing[] = scenario.pairings
    .map((p, k) => (k === 3 ? { ...p, crewNeeded: { captain: 1 } } : p))
    .sort((a, b) => instantMs(a.dutyPeriods[0]!.report) - instantMs(b.dutyPeriods[0]!.report) || (a.id < b.id ? -1 : 1));
  // The scenario's crew as the bundle writer makes them (structuredClone: the extras below change them).
  const crew: CrewMember[] = structuredClone(smallScenarioBundle(scenario).instances.flatMap((i) => i.crew)).sort(
    (a, b) => a.seniority - b.seniority,
  );
  const [c0, c1, c2, c3, , c5] = crew as [CrewMember, CrewMember, CrewMember, CrewMember, CrewMember, CrewMember];
  c0.carryIn = [{ pairingId: "T099", dutyPeriods: [duty("2026-12-31", "15:10", "HLV", "PSB", 150), duty("2027-01-01", "09:00", "PSB", "HLV", 150)] }];
  c0.fixedActivities.push({ kind: "training", start: atLocalTime("2027-01-15", "08:00", ZONE), end: atLocalTime("2027-01-15", "16:00", ZONE) });
  const past = [duty("2026-12-27", "07:00", "HLV", "TLR", 95), duty("2026-12-29", "11:30", "HLV", "PSB", 150)];
  c1.lookBack = {
    duties: past.map((d, k) => ({ report: d.report, release: d.release, flightMinutes: 95 + 55 * k, segments: 1, ...(k ? { endStation: "PSB" } : {}) })),
    dailyFlightMinutes: [{ date: "2026-02-10", minutes: 310 }, { date: "2026-12-27", minutes: 95 }, { date: "2026-12-29", minutes: 150 }],
  };
  c2.carriedWeight = 1.2;
  const bids: Record<Position, Record<string, unknown[]>> = {
    captain: {
      [c0.id]: [
        { kind: "trip", pairingIds: [pairings[0]!.id, pairings[1]!.id], count: 2 },
        { kind: "trip", filter: { layoverAt: ["PSB"], lengthDays: { min: 2 } } },
        { kind: "free-days", dates: ["2027-01-24", "2027-01-25", "2027-01-26"] },
      ],
      [c2.id]: [{ kind: "no-trip", filter: { reportBefore: "06:00" } }, { kind: "rhythm", maxDaysOn: 4, weekendsOff: true }],
    },
    first_officer: {
      [c1.id]: [{ kind: "credit", minMinutes: 4200, maxMinutes: 4800 }, { kind: "buddy", crewId: c3.id }],
      [c3.id]: [{ kind: "buddy", crewId: c1.id }],
      [c5.id]: [],
    },
    flight_attendant: {},
    purser: {},
  };
  const settings = { captain: { mode: "balanced", rankDecay: 0.7, fairnessFloor: 0.3, reserve: { min: 1, max: 2 }, iterationLimit: 5000, seed: 7 } };
  const instances = (["captain", "first_officer"] as const).map((position) => {
    const groupPairings = pairings.filter((p) => (p.crewNeeded[position] ?? 0) > 0);
    const groupCrew = crew.filter((c) => c.position === position);
    return {
      schemaVersion,
      period: PERIOD,
      group: { base: "HLV", position },
      stations: stationsOf("HLV", groupPairings, groupCrew),
      pairings: groupPairings,
      crew: groupCrew,
      bids: bids[position],
      ruleSet: FLIGHT_DECK,
      settings: position === "captain" ? settings.captain : {},
    };
  });
  return bundleSchema.parse({ schemaVersion, period: PERIOD, instances });
}

/** Row counts of every table an import writes. */
async function counts() {
  const p = db();
  const [stations, bases, crew, periods, pairings, duties, legs, activities, carryIn, pastDuties, daily, ruleSets, groups, bids, submissions] =
    await Promise.all([
      p.station.count(), p.base.count(), p.crewMember.count(), p.bidPeriod.count(), p.pairing.count(), p.dutyPeriod.count(),
      p.leg.count(), p.fixedActivity.count(), p.carryInTrip.count(), p.pastDuty.count(), p.dailyFlightTotal.count(),
      p.ruleSet.count(), p.awardGroup.count(), p.bid.count(), p.bidSubmission.count(),
    ]);
  return { stations, bases, crew, periods, pairings, duties, legs, activities, carryIn, pastDuties, daily, ruleSets, groups, bids, submissions };
}

async function timed<T>(label: string, run: () => Promise<T>): Promise<T> {
  const t = performance.now();
  const result = await run();
  console.log(`${label}: ${(performance.now() - t).toFixed(0)} ms`);
  return result;
}

/** A JSON copy to damage; the bundle itself stays as built. */
const copy = (bundle: Bundle) => JSON.parse(JSON.stringify(bundle)) as Bundle;

describe("a bid period exported to a bundle and imported back", () => {
  const bundle = scenarioBundle();
  const url = inject("databaseUrl");
  let periodId = "";

  beforeAll(async () => {
    await truncateAll(url);
  });
  afterAll(async () => {
    await truncateAll(url);
  });

  it("imports a bundle and exports exactly that bundle", async () => {
    const result = await timed("import of the test bundle", () => importBundle(db(), bundle));
    expect(result).toEqual({ periodId: PERIOD.id, outsideWindows: [] });
    periodId = result.periodId;
    const exported = await timed("export of the test bundle", () => exportPeriod(db(), periodId));
    expect(canonicalJson(exported)).toBe(canonicalJson(bundle));
    // Every table was written: the extras are in the rows, not only in the round trip.
    expect(await counts()).toMatchObject({
      bases: 1, crew: 12, periods: 1, pairings: scenario.pairings.length, activities: 2, carryIn: 1, pastDuties: 2, daily: 3,
      ruleSets: 1, groups: 2, bids: 5, submissions: 5,
    });
    expect(exported.instances[1]!.pairings.map((p) => p.id)).not.toContain(scenario.pairings[3]!.id);
  });

  it("stores each bid as revision 1 with a receipt over { crewId, periodId, wishes }", async () => {
    const row = await db().bidSubmission.findFirstOrThrow({ where: { crewMember: { employeeNumber: "4100" } } });
    const wishes = bundle.instances[0]!.bids["4100"]!;
    // Hashed here straight from node:crypto, independent of lib/domain's sha256Hex.
    const expected = createHash("sha256").update(canonicalJson({ crewId: "4100", periodId, wishes })).digest("hex");
    expect(row).toMatchObject({ revision: 1, hash: expected, receiptCode: expected.slice(0, 12).toUpperCase().replace(/(.{4})(?=.)/g, "$1-") });
    const period = await db().bidPeriod.findUniqueOrThrow({ where: { id: periodId } });
    // Bids present → closed; deadline 20 Dec 2026 18:00 in America/Denver (MST, UTC-7) = 21 Dec 01:00 UTC.
    expect(period.state).toBe("closed");
    expect(period.deadline.toISOString()).toBe("2026-12-21T01:00:00.000Z");
    expect(period.opensAt.toISOString()).toBe("2026-12-01T07:00:00.000Z");
  });

  it("exports a crew member's latest submitted version, never the working copy", async () => {
    const crewMemberId = (await db().crewMember.findUniqueOrThrow({ where: { employeeNumber: "4100" } })).id;
    await db().bid.update({ where: { crewMemberId_bidPeriodId: { crewMemberId, bidPeriodId: periodId } }, data: { wishes: [], revision: 2 } });
    expect(canonicalJson(await exportPeriod(db(), periodId))).toBe(canonicalJson(bundle));
    const wishes = [{ kind: "rhythm", maxDaysOn: 3 }];
    const receipt = bidReceipt({ crewId: "4100", periodId, wishes });
    await db().bidSubmission.create({ data: { crewMemberId, bidPeriodId: periodId, revision: 2, wishes, hash: receipt.hash, receiptCode: receipt.receiptCode } });
    expect((await exportPeriod(db(), periodId)).instances[0]!.bids["4100"]).toEqual(wishes);
  });

  it("exports, imports into an emptied database and exports again byte for byte", async () => {
    const first = await exportPeriod(db(), periodId);
    await truncateAll(url);
    await importBundle(db(), JSON.parse(JSON.stringify(first)));
    expect(canonicalJson(await exportPeriod(db(), periodId))).toBe(canonicalJson(first));
  });

  it("leaves out crew rows of other periods, and names the row when a row breaks the schema", async () => {
    const before = canonicalJson(await exportPeriod(db(), periodId));
    const crewMemberId = (await db().crewMember.findUniqueOrThrow({ where: { employeeNumber: "4107" } })).id;
    const at = (date: string, time: string) => new Date(atLocalTime(date, time, ZONE));
    await db().pastDuty.create({ data: { crewMemberId, reportAt: at("2026-11-20", "08:00"), releaseAt: at("2026-11-20", "17:00"), flightMinutes: 300, segments: 2 } });
    await db().dailyFlightTotal.create({ data: { crewMemberId, date: new Date("2025-12-31"), minutes: 200 } });
    await db().fixedActivity.create({ data: { crewMemberId, kind: "vacation", startsAt: at("2027-03-01", "00:00"), endsAt: at("2027-03-08", "00:00") } });
    const ended = [duty("2026-12-20", "08:00", "HLV", "TLR", 95)];
    await db().carryInTrip.create({ data: { crewMemberId, pairingCode: "T001", dutyPeriods: ended, startsAt: new Date(ended[0]!.report), endsAt: new Date(ended[0]!.release) } });
    expect(canonicalJson(await exportPeriod(db(), periodId))).toBe(before);

    const trip = bundle.instances[0]!.pairings[1]!;
    const leg = await db().leg.findFirstOrThrow({ where: { seq: 0, dutyPeriod: { seq: 0, pairing: { code: trip.id } } } });
    await db().leg.update({ where: { id: leg.id }, data: { arrivesAt: leg.departsAt } });
    await expect(exportPeriod(db(), periodId)).rejects.toThrow(
      `Leg seq 0 (row ${leg.id}) of DutyPeriod seq 0 of Pairing ${trip.id}`,
    );
    await db().leg.update({ where: { id: leg.id }, data: { arrivesAt: leg.arrivesAt } });
  });

  it("stores crew rows outside the period's windows, lists them, and leaves them out of the export", async () => {
    await truncateAll(url);
    const wider = copy(bundle);
    const member = wider.instances[1]!.crew[0]!;
    member.fixedActivities.push({ kind: "office", start: "2027-03-01T15:00:00Z", end: "2027-03-01T23:00:00Z" });
    member.lookBack.dailyFlightMinutes.unshift({ date: "2025-12-31", minutes: 200 });
    const result = await importBundle(db(), wider);
    expect(result.outsideWindows).toEqual([
      "instances[1].crew[0].fixedActivities[0] (office 2027-03-01T15:00:00Z..2027-03-01T23:00:00Z) does not overlap the period 2027-01-01..2027-01-31",
      "instances[1].crew[0].lookBack.dailyFlightMinutes[0] is dated 2025-12-31, more than 365 days before the period",
    ]);
    expect(await counts()).toMatchObject({ activities: 3, daily: 4 });
    expect(canonicalJson(await exportPeriod(db(), periodId))).toBe(canonicalJson(bundle));
  });

  it("refuses a pairing to an unknown station, naming the place, and writes nothing", async () => {
    const bad = copy(bundle);
    const trip = bad.instances[0]!.pairings[2]!;
    trip.dutyPeriods[0]!.legs[0]!.to = "ZZZ";
    const before = await counts();
    await expect(importBundle(db(), bad)).rejects.toThrow(new RegExp(`instances\\[0\\]\\.pairings\\[2\\].*"${trip.id}" flies to or from "ZZZ"`));
    expect(await counts()).toEqual(before);
  });

  it("refuses a rule set the legality engine cannot read, naming the rule, and writes nothing", async () => {
    const bad = copy(bundle);
    bad.instances[1]!.ruleSet = { ...bad.instances[1]!.ruleSet, name: "Broken", rules: [{ id: "min-rest", params: { minutes: 600 }, text: "Rest." }] };
    const before = await counts();
    await expect(importBundle(db(), bad)).rejects.toThrow(/instances\[1\]\.ruleSet \("Broken"\): rules\[0\] "min-rest": .*minutes/);
    expect(await counts()).toEqual(before);
  });

  it("refuses trip numbers that disagree on crewNeeded across groups, naming both places", async () => {
    const bad = copy(bundle);
    const id = bad.instances[1]!.pairings[0]!.id;
    bad.instances[1]!.pairings[0]!.crewNeeded = { captain: 1, first_officer: 2 };
    const k = bad.instances[0]!.pairings.findIndex((p) => p.id === id);
    await expect(importBundle(db(), bad)).rejects.toThrow(`instances[1].pairings[0] "${id}": crewNeeded {"captain":1,"first_officer":2} differs from {"captain":1,"first_officer":1} at instances[0].pairings[${k}]`);
  });

  it("refuses an employee number already in the database, naming it, and writes nothing", async () => {
    await truncateAll(url);
    const base = await db().base.create({ data: { station: { create: STATIONS[1]! }, name: "Port Sable" } });
    await db().crewMember.create({ data: { employeeNumber: "4107", name: "Someone Else", seniority: 900, baseId: base.id, position: "captain" } });
    const before = await counts();
    await expect(importBundle(db(), bundle)).rejects.toThrow(/instances\[1\]\.crew\[0\]\.id "4107": employee number 4107 is already in the database/);
    expect(await counts()).toEqual(before);
  });

  it("rolls back a write that fails halfway, and keeps a renamed rule set beside one of the same name", async () => {
    await truncateAll(url);
    // A trap: a submission elsewhere already holds the receipt code of crew 4100's bid, which is written last.
    const base = await db().base.create({ data: { station: { create: STATIONS[1]! }, name: "Port Sable" } });
    const other = await db().crewMember.create({ data: { employeeNumber: "9001", name: "Someone Else", seniority: 900, baseId: base.id, position: "captain" } });
    const psb = await db().bidPeriod.create({
      data: { baseId: base.id, name: "PSB January", startDate: new Date("2027-01-01"), endDate: new Date("2027-01-31"), zone: "America/Los_Angeles", opensAt: new Date("2026-12-01"), deadline: new Date("2026-12-20") },
    });
    const code = bidReceipt({ crewId: "4100", periodId, wishes: bundle.instances[0]!.bids["4100"]! }).receiptCode;
    const trap = await db().bidSubmission.create({ data: { crewMemberId: other.id, bidPeriodId: psb.id, revision: 1, wishes: [], hash: "0".repeat(64), receiptCode: code } });
    await db().ruleSet.create({ data: { name: FLIGHT_DECK.name, preset: "us-flightcrew", document: { ...FLIGHT_DECK, rules: [] } } });
    const before = await counts();
    await expect(importBundle(db(), bundle)).rejects.toThrow(
      /collides with a row already in the database \(unique constraint BidSubmission_receiptCode_key\); nothing was imported/,
    );
    expect(await counts()).toEqual(before);

    await db().bidSubmission.delete({ where: { id: trap.id } });
    await importBundle(db(), bundle);
    const names = (await db().ruleSet.findMany({ orderBy: { name: "asc" } })).map((r) => r.name);
    expect(names).toEqual([FLIGHT_DECK.name, expect.stringMatching(/^Flight deck \(round-trip test\) \(variant [0-9a-f]{8}\)$/)]);
    expect(canonicalJson(await exportPeriod(db(), periodId))).toBe(canonicalJson(bundle));
  });
});
