import { describe, expect, it } from "vitest";
import { bundleSchema, describeIssues, instanceSchema, invalidInput } from "../../../lib/domain/index.ts";
import { stations, T101, T202, T303 } from "./carrier.ts";

const period = { id: "HVN-2027-03", name: "March 2027", startDate: "2027-03-01", endDate: "2027-03-31", zone: "America/Denver" };
const crewMember = (id: string, seniority: number) => ({ id, name: `Crew ${id}`, seniority, base: "HVN", position: "captain" });

function instance(changes: Record<string, unknown> = {}) {
  return {
    schemaVersion: 1,
    period,
    group: { base: "HVN", position: "captain" },
    stations,
    pairings: [T101, T202, T303],
    crew: [crewMember("1001", 1), crewMember("1002", 2), crewMember("1003", 3)],
    bids: { "1002": [{ kind: "free-days", dates: ["2027-03-14"] }] },
    ruleSet: { name: "Flight deck", preset: "flightcrew", rules: [] },
    ...changes,
  };
}

function problems(input: unknown): string[] {
  const result = instanceSchema.safeParse(input);
  return result.success ? [] : describeIssues(result.error);
}

describe("instanceSchema", () => {
  it("accepts a consistent instance and fills default settings", () => {
    const parsed = instanceSchema.parse(instance());
    expect(parsed.settings.rankDecay).toBe(0.8);
    expect(parsed.crew[0]?.carriedWeight).toBe(1);
  });

  it("names the crew member whose base is not the group's", () => {
    const crew = [crewMember("1001", 1), crewMember("1002", 2), crewMember("1003", 3), { ...crewMember("1004", 4), base: "XYZ" }];
    expect(problems(instance({ crew }))).toEqual(['crew[3].base "XYZ" is not the group\'s base HVN']);
  });

  it("finds repeated pairing ids, crew ids and seniority numbers", () => {
    expect(problems(instance({ pairings: [T101, T202, T101] }))).toEqual(['pairings[2].id "T101" repeats pairings[0]']);
    const crew = [crewMember("1001", 1), crewMember("1001", 2), crewMember("1003", 2)];
    expect(problems(instance({ crew, bids: {} }))).toEqual([
      'crew[1].id "1001" repeats crew[0]',
      "crew[2].seniority 2 repeats crew[1]",
    ]);
  });

  it("refuses a bid for a crew member not in the instance, and a self-named buddy", () => {
    const bids = { "9999": [{ kind: "rhythm", maxDaysOn: 4 }], "1001": [{ kind: "buddy", crewId: "1001" }] };
    // Integer-like record keys come out in numeric order.
    expect(problems(instance({ bids }))).toEqual([
      'bids["1001"][0] names the crew member as their own buddy',
      'bids["9999"] is for a crew member not in this instance',
    ]);
  });

  it("allows a buddy outside the group and a wish for an unknown trip (they just score 0)", () => {
    const bids = { "1001": [{ kind: "buddy", crewId: "7777" }, { kind: "trip", pairingIds: ["T999"] }] };
    expect(problems(instance({ bids }))).toEqual([]);
  });

  it("checks stations, the base's zone and where pairings start", () => {
    expect(problems(instance({ stations: stations.filter((station) => station.code !== "MRW") }))).toEqual([
      'pairings[2] "T303" flies to or from "MRW", which is not a station of this instance',
    ]);
    expect(problems(instance({ period: { ...period, zone: "America/Chicago" } }))).toEqual([
      'period.zone "America/Chicago" is not the zone "America/Denver" of the base HVN',
    ]);
    // T303 reports on 20 March, after a period that ends on the 15th.
    expect(problems(instance({ period: { ...period, endDate: "2027-03-15" } }))).toEqual([
      'pairings[2] "T303" starts on 2027-03-20, outside the period 2027-03-01..2027-03-15',
    ]);
    expect(problems(instance({ group: { base: "QRL", position: "captain" } }))).toContain(
      'period.zone "America/Denver" is not the zone "America/Los_Angeles" of the base QRL',
    );
  });

  it("wants carry-in and look-back before the period, and a reserve minimum the crew can fill", () => {
    const late = {
      ...crewMember("1001", 1),
      carryIn: [{ pairingId: "T099", dutyPeriods: T101.dutyPeriods }],
      lookBack: { dailyFlightMinutes: [{ date: "2027-03-01", minutes: 120 }] },
    };
    expect(problems(instance({ crew: [late], bids: {}, settings: { reserve: { min: 2 } } }))).toEqual([
      'crew[0].carryIn[0] "T099" starts 2027-03-03T13:00:00Z, not before the period',
      "crew[0].lookBack.dailyFlightMinutes[0] is dated 2027-03-01, not before the period",
      "settings.reserve.min 2 is more than the 1 crew of this group",
    ]);
  });

  it("prefixes field errors with where they are", () => {
    expect(problems(instance({ bids: { "1002": [{ kind: "rhythm" }] } }))).toEqual([
      'bids["1002"][0]: a work pattern needs a limit on days on in a row, weekends off, or both',
    ]);
    const result = instanceSchema.safeParse(instance({ pairings: [{ ...T101, creditMinutes: -5 }] }));
    expect(result.success).toBe(false);
    if (result.success) return;
    expect(describeIssues(result.error)).toEqual(["pairings[0].creditMinutes: minutes cannot be negative"]);
    const error = invalidInput("instance", result.error);
    expect(error.code).toBe("invalid");
    expect(error.message).toBe("instance is not valid: pairings[0].creditMinutes: minutes cannot be negative");
  });
});

describe("bundleSchema", () => {
  const captains = instance();
  const officers = { ...instance(), group: { base: "HVN", position: "first_officer" }, crew: [], bids: {} };

  it("accepts one instance per award group of the period", () => {
    expect(bundleSchema.parse({ schemaVersion: 1, period, instances: [captains, officers] }).instances).toHaveLength(2);
  });

  it("refuses a repeated group and an instance of another period", () => {
    const other = { ...officers, period: { ...period, name: "March" } };
    const result = bundleSchema.safeParse({ schemaVersion: 1, period, instances: [captains, captains, other] });
    expect(result.error?.issues.map((issue) => issue.message)).toEqual([
      "instances[1].group HVN/captain repeats instances[0]",
      'instances[2].period differs from the bundle\'s period "HVN-2027-03"',
    ]);
    expect(bundleSchema.safeParse({ schemaVersion: 1, period, instances: [] }).success).toBe(false);
  });
});
