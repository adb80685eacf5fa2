import { describe, expect, it } from "vitest";
import { matchesTripFilter, matchesTripSelection, type TripFilter, tripFilterSchema } from "../../../lib/domain/index.ts";
import { allTrips, ZONE } from "./carrier.ts";

/** The ids of the carrier's trips that match `filter`. */
function matching(filter: TripFilter): string[] {
  const parsed = tripFilterSchema.parse(filter);
  return allTrips.filter((pairing) => matchesTripFilter(pairing, parsed, ZONE)).map((pairing) => pairing.id);
}

describe("matchesTripFilter", () => {
  it("length in days, as base-local dates occupied", () => {
    expect(matching({ lengthDays: { min: 3 } })).toEqual(["T202"]);
    expect(matching({ lengthDays: { min: 2, max: 2 } })).toEqual(["T303", "T404"]);
    expect(matching({ lengthDays: { max: 1 } })).toEqual(["T101"]);
  });

  it("layover at any of the stations named", () => {
    expect(matching({ layoverAt: ["BXT"] })).toEqual(["T202", "T404"]);
    expect(matching({ layoverAt: ["MRW", "QRL"] })).toEqual(["T202", "T303"]);
    expect(matching({ layoverAt: ["HVN"] })).toEqual([]);
  });

  it("report and release clock times, base local, at the trip's ends", () => {
    // First reports: T101 06:00, T202 07:00, T303 22:30, T404 09:00.
    expect(matching({ reportAfter: "07:00" })).toEqual(["T202", "T303", "T404"]);
    expect(matching({ reportBefore: "06:30" })).toEqual(["T101"]);
    // Last releases: T101 14:00, T202 18:00 (MDT, after the change), T303 21:30, T404 17:30.
    expect(matching({ releaseBefore: "18:00" })).toEqual(["T101", "T202", "T404"]);
    expect(matching({ releaseAfter: "18:00" })).toEqual(["T303"]);
  });

  it("days of the week touched (any of them)", () => {
    expect(matching({ daysOfWeek: [6, 7] })).toEqual(["T202", "T303"]);
    expect(matching({ daysOfWeek: [3] })).toEqual(["T101", "T404"]);
  });

  it("credit per duty day, legs per duty, red-eye and deadhead", () => {
    expect(matching({ minCreditPerDutyDay: 300 })).toEqual(["T101", "T303", "T404"]);
    expect(matching({ maxLegsPerDuty: 2 })).toEqual(["T101", "T202", "T303"]);
    expect(matching({ redEye: true })).toEqual(["T303"]);
    expect(matching({ redEye: false })).toEqual(["T101", "T202", "T404"]);
    expect(matching({ deadhead: true })).toEqual(["T404"]);
    expect(matching({ deadhead: false })).toEqual(["T101", "T202", "T303"]);
  });

  it("combines conditions with AND", () => {
    expect(matching({ daysOfWeek: [6, 7], redEye: false })).toEqual(["T202"]);
    expect(matching({ layoverAt: ["BXT"], deadhead: false, lengthDays: { max: 2 } })).toEqual([]);
  });

  it("selects named trips OR filtered ones", () => {
    const select = (ids: string[] | undefined, filter?: TripFilter) =>
      allTrips.filter((pairing) => matchesTripSelection({ pairingIds: ids, filter }, pairing, ZONE)).map((p) => p.id);
    expect(select(["T404"])).toEqual(["T404"]);
    expect(select(["T404"], { redEye: true })).toEqual(["T303", "T404"]);
    expect(select(undefined, { lengthDays: { min: 3 } })).toEqual(["T202"]);
  });
});

describe("tripFilterSchema", () => {
  it("refuses an empty filter and backward ranges", () => {
    expect(tripFilterSchema.safeParse({}).success).toBe(false);
    expect(tripFilterSchema.safeParse({ lengthDays: {} }).success).toBe(false);
    expect(tripFilterSchema.safeParse({ lengthDays: { min: 4, max: 2 } }).success).toBe(false);
    expect(tripFilterSchema.safeParse({ reportAfter: "6:00" }).success).toBe(false);
    expect(tripFilterSchema.safeParse({ daysOfWeek: [0] }).success).toBe(false);
    expect(tripFilterSchema.safeParse({ layoverAt: ["bxt"] }).success).toBe(false);
    expect(tripFilterSchema.safeParse({ colour: "red" }).success).toBe(false);
  });
});
