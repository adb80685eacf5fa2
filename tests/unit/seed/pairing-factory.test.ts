import { describe, expect, it } from "vitest";
import { pairingSchema, stationSchema } from "@/lib/domain";
import { RELEASE_AFTER_MIN, REPORT_BEFORE_MIN, dutyCredit } from "@/seed/pairing-factory";
import { smallScenario } from "@/seed/small-scenario";

const now = new Date("2026-12-01T12:00:00Z");
const min = (a: string, b: string) => (Date.parse(b) - Date.parse(a)) / 60000;

describe("duty rig (common practice: credit = max(block, 1 h per 2 h on duty))", () => {
  const leg = (dep: string, arr: string, block: number, deadhead = false) => ({
    flightNumber: "LK1", from: "HLV", to: "PSB", departure: `2027-03-02T${dep}:00Z`, arrival: `2027-03-02T${arr}:00Z`, deadhead, blockMinutes: block,
  });
  it("pays block when the duty is busy: 3 h flown in a 5.5 h duty → 3:00", () => {
    expect(dutyCredit({ report: "2027-03-02T06:00:00Z", release: "2027-03-02T11:30:00Z", legs: [leg("07:00", "09:00", 120), leg("10:00", "11:00", 60)] })).toBe(180);
  });
  it("pays the rig on a long, thin duty: 2 h flown in a 10.5 h duty → 5:15", () => {
    expect(dutyCredit({ report: "2027-03-02T06:00:00Z", release: "2027-03-02T16:30:00Z", legs: [leg("07:00", "08:00", 60), leg("15:00", "16:00", 60)] })).toBe(315);
  });
  it("counts no block for a deadhead: 1 h flown + 2 h deadhead in a 4.5 h duty → 2:15 by the rig", () => {
    expect(dutyCredit({ report: "2027-03-02T06:00:00Z", release: "2027-03-02T10:30:00Z", legs: [leg("07:00", "09:00", 120, true), leg("09:00", "10:00", 60)] })).toBe(135);
  });
});

describe("the small scenario's pairings", () => {
  const s = smallScenario({ seed: 5, now });

  it("is the same for the same seed and differs for another", () => {
    expect(smallScenario({ seed: 5, now })).toEqual(s);
    expect(smallScenario({ seed: 6, now }).pairings).not.toEqual(s.pairings);
  });

  it("places the period in the month after next when the 20th has passed", () => {
    expect(s.period).toMatchObject({ startDate: "2027-01-01", endDate: "2027-01-31" });
    const late = smallScenario({ now: new Date("2026-12-22T12:00:00Z") });
    expect(late.period).toMatchObject({ startDate: "2027-02-01", endDate: "2027-02-28", name: "February 2027" });
    // 25 Nov: bidding for December has closed, so January of the next year; deadline 20 Dec 18:00 MST.
    const wrap = smallScenario({ now: new Date("2026-11-25T12:00:00Z") });
    expect(wrap.period).toMatchObject({ startDate: "2027-01-01", endDate: "2027-01-31", deadline: "2026-12-21T01:00:00Z" });
    // Before the 20th in summer (MDT, UTC-6): the deadline is 20 Jul 18:00 local = 21 Jul 00:00 UTC.
    expect(smallScenario({ now: new Date("2027-07-02T12:00:00Z") }).period).toMatchObject({ startDate: "2027-08-01", endDate: "2027-08-31", deadline: "2027-07-21T00:00:00Z" });
  });

  it("builds stations and pairings that the domain schemas accept as they are", () => {
    for (const st of s.stations) expect(stationSchema.parse(st)).toEqual(st);
    for (const p of s.pairings) expect(pairingSchema.parse(p)).toEqual(p);
  });

  it.each(s.pairings.map((p) => [p.id, p] as const))("%s starts and ends at the base, with report, release and credit as documented", (_id, p) => {
    const legs = p.dutyPeriods.flatMap((d) => d.legs);
    expect(legs[0]!.from).toBe("HLV");
    expect(legs[legs.length - 1]!.to).toBe("HLV");
    // No visit home in the middle of a trip.
    expect(legs.slice(0, -1).every((l) => l.to !== "HLV")).toBe(true);
    for (const d of p.dutyPeriods) {
      expect(min(d.report, d.legs[0]!.departure)).toBe(REPORT_BEFORE_MIN);
      expect(min(d.legs[d.legs.length - 1]!.arrival, d.release)).toBe(RELEASE_AFTER_MIN);
      // Legs connect and do not overlap.
      d.legs.slice(1).forEach((l, i) => {
        expect(l.from).toBe(d.legs[i]!.to);
        expect(min(d.legs[i]!.arrival, l.departure)).toBeGreaterThanOrEqual(40);
      });
    }
    // Rest at layovers is at least 11 h.
    p.dutyPeriods.slice(1).forEach((d, i) => expect(min(p.dutyPeriods[i]!.release, d.report)).toBeGreaterThanOrEqual(11 * 60));
    expect(p.creditMinutes).toBe(p.dutyPeriods.reduce((t, d) => t + dutyCredit(d), 0));
    expect(p.creditMinutes).toBeGreaterThanOrEqual(p.blockMinutes);
    expect(p.tafbMinutes).toBe(min(p.dutyPeriods[0]!.report, p.dutyPeriods[p.dutyPeriods.length - 1]!.release));
  });
});
