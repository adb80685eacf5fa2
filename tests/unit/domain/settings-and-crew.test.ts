import { describe, expect, it } from "vitest";
import { awardSettingsSchema, crewMemberSchema, ruleSetSchema } from "../../../lib/domain/index.ts";

describe("awardSettingsSchema", () => {
  it("fills every default from {}", () => {
    expect(awardSettingsSchema.parse({})).toEqual({
      mode: "strict",
      rankDecay: 0.8,
      baseLineValue: 1,
      seniorityWeight: 1,
      reserve: { min: 0 },
      timeLimitSeconds: 600,
    });
  });

  it("keeps values in their ranges", () => {
    for (const bad of [
      { rankDecay: 0 },
      { rankDecay: 1.1 },
      { baseLineValue: 0 },
      { seniorityWeight: -1 },
      { fairnessFloor: 1.5 },
      { reserve: { min: 3, max: 2 } },
      { reserve: { min: 1.5 } },
      { mode: "fair" },
      { timeLimitSeconds: 0 },
    ]) {
      expect(awardSettingsSchema.safeParse(bad).success, JSON.stringify(bad)).toBe(false);
    }
    expect(awardSettingsSchema.parse({ rankDecay: 1, reserve: { min: 2, max: 2 } }).reserve).toEqual({ min: 2, max: 2 });
  });
});

describe("crewMemberSchema", () => {
  const member = { id: "004711", name: "R. Okafor", seniority: 12, base: "HVN", position: "first_officer" };

  it("fills empty schedules and a carried weight of 1", () => {
    expect(crewMemberSchema.parse(member)).toEqual({
      ...member,
      qualifications: [],
      fixedActivities: [],
      carryIn: [],
      lookBack: { duties: [], dailyFlightMinutes: [] },
      carriedWeight: 1,
    });
  });

  it("refuses seniority 0, unknown positions, backward activities and repeated look-back dates", () => {
    expect(crewMemberSchema.safeParse({ ...member, seniority: 0 }).success).toBe(false);
    expect(crewMemberSchema.safeParse({ ...member, position: "navigator" }).success).toBe(false);
    const backwards = { kind: "vacation", start: "2027-03-10T07:00:00Z", end: "2027-03-09T07:00:00Z" };
    expect(crewMemberSchema.safeParse({ ...member, fixedActivities: [backwards] }).success).toBe(false);
    const days = [
      { date: "2027-02-27", minutes: 300 },
      { date: "2027-02-27", minutes: 200 },
    ];
    expect(crewMemberSchema.safeParse({ ...member, lookBack: { dailyFlightMinutes: days } }).success).toBe(false);
    expect(crewMemberSchema.safeParse({ ...member, carriedWeight: 0 }).success).toBe(false);
  });
});

describe("ruleSetSchema", () => {
  it("accepts rules with plain parameters and refuses a repeated id", () => {
    const rule = { id: "min-rest", params: { minutes: 600, atBase: true }, text: "At least 10 hours of rest between duties." };
    expect(ruleSetSchema.parse({ name: "Cabin", preset: "cabin", rules: [rule] }).rules[0]?.params.minutes).toBe(600);
    const twice = ruleSetSchema.safeParse({ name: "Cabin", preset: "cabin", rules: [rule, rule] });
    expect(twice.error?.issues[0]?.message).toBe('rules[1].id "min-rest" repeats rules[0]');
    expect(ruleSetSchema.safeParse({ name: "C", preset: "c", rules: [{ ...rule, params: { nested: {} } }] }).success).toBe(false);
  });
});
