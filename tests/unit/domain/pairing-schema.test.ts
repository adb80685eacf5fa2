import { describe, expect, it } from "vitest";
import { dutyPeriodSchema, legSchema, pairingSchema, stationSchema } from "../../../lib/domain/index.ts";
import { T202 } from "./carrier.ts";

const messages = (result: { error?: { issues: { message: string }[] } | undefined }) =>
  result.error?.issues.map((issue) => issue.message) ?? [];

describe("stationSchema", () => {
  const haven = { code: "HVN", name: "Haven Field", zone: "America/Denver", longitude: -104.9 };

  it("accepts a station and refuses bad codes, zones and longitudes", () => {
    expect(stationSchema.parse(haven)).toEqual(haven);
    expect(stationSchema.safeParse({ ...haven, code: "hvn" }).success).toBe(false);
    expect(stationSchema.safeParse({ ...haven, code: "HAVEN" }).success).toBe(false);
    expect(stationSchema.safeParse({ ...haven, zone: "America/Haven" }).success).toBe(false);
    expect(stationSchema.safeParse({ ...haven, longitude: 181 }).success).toBe(false);
    expect(stationSchema.safeParse({ ...haven, elevation: 1600 }).success).toBe(false);
  });
});

describe("legSchema and dutyPeriodSchema", () => {
  const leg = {
    flightNumber: "LK1",
    from: "HVN",
    to: "QRL",
    departure: "2027-03-03T14:00:00Z",
    arrival: "2027-03-03T16:30:00Z",
    blockMinutes: 150,
  };

  it("defaults deadhead to false and refuses an arrival before the departure", () => {
    expect(legSchema.parse(leg).deadhead).toBe(false);
    const backwards = legSchema.safeParse({ ...leg, arrival: "2027-03-03T13:00:00Z" });
    expect(messages(backwards)).toEqual([
      "flight LK1: arrival 2027-03-03T13:00:00Z is not after its departure 2027-03-03T14:00:00Z",
    ]);
  });

  it("says which end of a duty period misses its legs", () => {
    const late = dutyPeriodSchema.safeParse({ report: "2027-03-03T14:30:00Z", release: "2027-03-03T16:00:00Z", legs: [leg] });
    expect(messages(late)).toEqual([
      "report 2027-03-03T14:30:00Z is after the first departure 2027-03-03T14:00:00Z (flight LK1)",
      "release 2027-03-03T16:00:00Z is before the last arrival 2027-03-03T16:30:00Z (flight LK1)",
    ]);
    expect(late.error?.issues.map((issue) => issue.path)).toEqual([["report"], ["release"]]);
  });

  it("refuses legs that do not follow each other", () => {
    const jump = { ...leg, flightNumber: "LK2", from: "BXT", to: "HVN", departure: "2027-03-03T16:00:00Z", arrival: "2027-03-03T18:00:00Z" };
    const result = dutyPeriodSchema.safeParse({ report: "2027-03-03T13:00:00Z", release: "2027-03-03T18:30:00Z", legs: [leg, jump] });
    expect(messages(result)).toEqual([
      "flight LK2 departs BXT but flight LK1 arrived at QRL",
      "flight LK2 departs 2027-03-03T16:00:00Z, before flight LK1 arrives 2027-03-03T16:30:00Z",
    ]);
    expect(dutyPeriodSchema.safeParse({ report: leg.departure, release: leg.arrival, legs: [] }).success).toBe(false);
  });
});

describe("pairingSchema", () => {
  it("round-trips a valid pairing", () => {
    expect(pairingSchema.parse(T202)).toEqual(T202);
  });

  it("wants a trip to leave from and return to its base", () => {
    const result = pairingSchema.safeParse({ ...T202, base: "QRL" });
    expect(messages(result)).toEqual([
      "pairing T202 starts at HVN, not at its base QRL",
      "pairing T202 ends at HVN, not at its base QRL",
    ]);
  });

  it("wants duty periods in order, each starting where the last one ended", () => {
    const [first, second, third] = T202.dutyPeriods;
    const swapped = pairingSchema.safeParse({ ...T202, dutyPeriods: [first, third, second] });
    expect(messages(swapped)).toContain(
      "pairing T202: duty 3 reports 2027-03-13T16:00:00Z, before duty 2 is released 2027-03-15T00:00:00Z",
    );
    expect(messages(swapped)).toContain("pairing T202: duty 2 starts at BXT, but duty 1 ended at QRL");
  });

  it("refuses negative crew needs, unknown positions and a missing trip number", () => {
    expect(pairingSchema.safeParse({ ...T202, crewNeeded: { captain: -1 } }).success).toBe(false);
    expect(pairingSchema.safeParse({ ...T202, crewNeeded: { navigator: 1 } }).success).toBe(false);
    expect(pairingSchema.safeParse({ ...T202, id: "" }).success).toBe(false);
    expect(pairingSchema.parse({ ...T202, crewNeeded: { purser: 1 } }).crewNeeded).toEqual({ purser: 1 });
  });
});

describe("an unreadable time inside a pairing", () => {
  it("is reported at its path; the cross-field checks do not throw on it", () => {
    const bad = structuredClone(T202) as unknown as { dutyPeriods: { report: string; legs: { arrival: string }[] }[] };
    bad.dutyPeriods[0]!.report = "half past nine";
    bad.dutyPeriods[0]!.legs[0]!.arrival = "tomorrow";
    const result = pairingSchema.safeParse(bad);
    expect(result.success).toBe(false);
    const paths = result.error!.issues.map((issue) => issue.path.join("."));
    expect(paths).toContain("dutyPeriods.0.report");
    expect(paths).toContain("dutyPeriods.0.legs.0.arrival");
  });
});
