import { describe, expect, it } from "vitest";
import { addDays, addMinutes } from "@/lib/domain/time";
import { checkLine, presetRuleSet, requiredDaysOff, type LineResult, type Violation } from "@/lib/rules";
import { BASE, at, context, crew, duty, items, only, pairing } from "@/tests/support/rule-fixtures";

// Agreement rules are common practice in collective agreements (no published source);
// the figures are the presets' defaults, each a parameter of the rule set.
const violations = (r: LineResult): Violation[] => (r.legal ? [] : r.violations);
const may = context("2027-05-01", "2027-05-31"); // 31 days
const dayTrip = (date: string, id = `D${date.slice(8)}`, credit?: number) =>
  pairing(id, [duty(at(date, "08:00"), [BASE, "PLM", BASE], { minutes: 480 })], credit === undefined ? {} : { creditMinutes: credit });

describe("agreement rules (common practice, parameters of the rule set)", () => {
  it("credit window: 65 h minimum for a line holder, not for a reserve line; 95 h maximum for both", () => {
    const rule = only("us-flightcrew", "credit-window");
    const line = (last: number) => items(dayTrip("2027-05-03", "A", 3000), dayTrip("2027-05-10", "B", last));
    expect(violations(checkLine(crew(), rule, line(900), may))).toEqual([]); // 50 h + 15 h = 65 h
    expect(violations(checkLine(crew(), rule, line(899), may))[0]).toMatchObject({ ruleId: "credit-window", measured: 3899, limit: 3900 });
    expect(violations(checkLine(crew(), rule, line(899), may, { reserve: true }))).toEqual([]);
    expect(violations(checkLine(crew(), rule, line(2701), may, { reserve: true }))[0]).toMatchObject({ measured: 5701, limit: 5700 });
  });

  it("days off: 10 per 30 days, so 11 in a 31-day month; a reserve line 12 per 30, so 13", () => {
    expect(requiredDaysOff(presetRuleSet("us-flightcrew").rules, 30, false)).toBe(10);
    expect(requiredDaysOff(presetRuleSet("us-flightcrew").rules, 31, false)).toBe(11);
    expect(requiredDaysOff(presetRuleSet("us-flightcrew").rules, 30, true)).toBe(12);
    expect(requiredDaysOff(presetRuleSet("eu-crew").rules, 31, true)).toBe(13);
    const rule = only("us-flightcrew", "min-days-off");
    // Day trips on 20 of 31 dates leave 11 days off; on 21 dates, 10.
    const dates = Array.from({ length: 21 }, (_, k) => addDays("2027-05-01", k));
    expect(violations(checkLine(crew(), rule, items(...dates.slice(0, 20).map((d) => dayTrip(d))), may))).toEqual([]);
    expect(violations(checkLine(crew(), rule, items(...dates.map((d) => dayTrip(d))), may))[0]).toMatchObject({ ruleId: "min-days-off", measured: 10, limit: 11 });
  });

  it("days on in a row: 6 pass, 7 do not", () => {
    const rule = only("us-flightcrew", "max-days-on");
    const run = (n: number) => items(...Array.from({ length: n }, (_, k) => dayTrip(addDays("2027-05-10", k))));
    expect(violations(checkLine(crew(), rule, run(6), may))).toEqual([]);
    expect(violations(checkLine(crew(), rule, run(7), may))[0]).toMatchObject({ ruleId: "max-days-on", measured: 7, limit: 6 });
  });

  it("rest at base between trips: 12 h passes, 11 h 59 min fails; a layover inside a trip is not judged by it", () => {
    const rule = only("us-flightcrew", "rest-at-base");
    const first = dayTrip("2027-05-03", "A");
    const release = first.dutyPeriods[0]!.release;
    const next = (rest: number) => pairing("B", [duty(addMinutes(release, rest), [BASE, "PLM", BASE], { minutes: 480 })]);
    expect(violations(checkLine(crew(), rule, items(first, next(720)), may))).toEqual([]);
    expect(violations(checkLine(crew(), rule, items(first, next(719)), may))[0]).toMatchObject({ ruleId: "rest-at-base", measured: 719, limit: 720, items: ["A", "B"] });
    const twoDays = pairing("C", [duty(at("2027-05-03", "08:00"), [BASE, "PLM", "CBS"], { minutes: 480 }), duty(at("2027-05-04", "02:00"), ["CBS", "PLM", BASE], { minutes: 300 })]);
    expect(violations(checkLine(crew(), rule, items(twoDays), may))).toEqual([]);
  });

  it("whole calendar days free between trips, when an agreement asks for them", () => {
    const rs = presetRuleSet("us-flightcrew", { daysBetweenTrips: 1 });
    const rule = { ...rs, rules: rs.rules.filter((r) => r.id === "days-between-trips") };
    expect(violations(checkLine(crew(), rule, items(dayTrip("2027-05-03"), dayTrip("2027-05-05")), may))).toEqual([]);
    expect(violations(checkLine(crew(), rule, items(dayTrip("2027-05-03"), dayTrip("2027-05-04")), may))[0]).toMatchObject({ ruleId: "days-between-trips", measured: 0, limit: 1 });
  });
});

describe("days on in a row reach back before the period", () => {
  it("four look-back days at the end of April and three trips on 1–3 May make 7 in a row", async () => {
    const { pastDuty } = await import("@/tests/support/rule-fixtures");
    const rule = only("us-flightcrew", "max-days-on");
    const member = crew({ lookBack: { duties: ["2027-04-27", "2027-04-28", "2027-04-29", "2027-04-30"].map((d) => pastDuty(at(d, "08:00"), 480, 240)) } });
    const three = items(dayTrip("2027-05-01"), dayTrip("2027-05-02"), dayTrip("2027-05-03"));
    expect(violations(checkLine(member, rule, three, may))[0]).toMatchObject({ ruleId: "max-days-on", measured: 7, limit: 6 });
    // With a day off on 30 April, the run in May is 3 days.
    const rested = crew({ lookBack: { duties: ["2027-04-26", "2027-04-27", "2027-04-28", "2027-04-29"].map((d) => pastDuty(at(d, "08:00"), 480, 240)) } });
    expect(violations(checkLine(rested, rule, three, may))).toEqual([]);
  });
});
