import { describe, expect, it } from "vitest";
import { checkLine, extend, finish, presetRuleSet, start, type LineResult, type LineState, type Violation } from "@/lib/rules";
import { BASE, at, context, crew, duty, items, pairing } from "@/tests/support/rule-fixtures";

const violations = (r: LineResult): Violation[] => (r.legal ? [] : r.violations);
const ctx = context("2027-05-01", "2027-05-31");
const rules = presetRuleSet("us-flightcrew", { minCredit: 0 });
const trip = (id: string, date: string, time: string) => pairing(id, [duty(at(date, time), [BASE, "PLM", BASE], { minutes: 480 })]);

/** extend item by item, then finish: the first violation, or legal. */
function stepwise(state: LineState, ...ps: ReturnType<typeof trip>[]): Violation | "legal" {
  let s = state;
  for (const p of ps) {
    const r = extend(s, { kind: "pairing", pairing: p });
    if ("ruleId" in r) return r;
    s = r;
  }
  const f = finish(s);
  return f.legal ? "legal" : f.violations[0]!;
}

describe("fixed activities are part of the line", () => {
  it("a trip inside the crew member's leave is refused (no-overlap), by checkLine and by extend alike", () => {
    const member = crew({ fixedActivities: [{ kind: "vacation", start: at("2027-05-10", "00:00"), end: at("2027-05-18", "00:00"), label: "Annual leave" }] });
    const inLeave = trip("L1", "2027-05-12", "08:00");
    const v = violations(checkLine(member, rules, items(inLeave), ctx));
    expect(v.map((x) => x.ruleId)).toContain("no-overlap");
    expect(v.find((x) => x.ruleId === "no-overlap")!.text).toBe("trip L1 falls in the crew member's vacation; a line cannot hold both");
    expect(stepwise(start(member, rules, ctx), inLeave)).toMatchObject({ ruleId: "no-overlap" });
    // Leave is not duty: a trip the morning after it needs no 10 h rest from it.
    expect(checkLine(member, rules, items(trip("L2", "2027-05-18", "06:00")), ctx)).toEqual({ legal: true });
  });

  it("training is duty: 8 h after it is too little rest before a flight duty (14 CFR 117.25(e)), in both forms", () => {
    const member = crew({ fixedActivities: [{ kind: "training", start: at("2027-05-10", "13:00"), end: at("2027-05-10", "22:00") }] });
    const early = trip("T1", "2027-05-11", "06:00");
    const v = violations(checkLine(member, rules, items(early), ctx));
    expect(v[0]).toMatchObject({ ruleId: "rest-before-fdp", measured: 480, limit: 600 });
    expect(stepwise(start(member, rules, ctx), early)).toMatchObject({ ruleId: "rest-before-fdp", measured: 480 });
    // A trip before the training, then the training, is checked in time order at finish.
    const before = trip("T0", "2027-05-09", "08:00");
    expect(stepwise(start(member, rules, ctx), before)).toBe("legal");
    expect(checkLine(member, rules, items(before), ctx)).toEqual({ legal: true });
  });
});

describe("acclimation by steps (14 CFR 117.3: a theater is measured from where the crew member is acclimated)", () => {
  it("two hops of 31° and 50° leave the home theater (81° away): the next report reads the home clock, 30 min less (117.13(b))", async () => {
    const { STATIONS } = await import("@/seed/carrier");
    // An invented station at Cape Verde's longitude (-23.5°), 50° from EMR and 81° from HLV.
    const stations = [...STATIONS, { code: "CVX", name: "Cove Exeter", zone: "Atlantic/Cape_Verde", longitude: -23.5 }];
    const far = { ...ctx, stations };
    const only = { ...rules, rules: rules.rules.filter((r) => r.id === "fdp-limit") };
    // Day 1 lays over at EMR (31° from home); day 2 hops on to CVX (50° further); day 3 reports at CVX.
    const p = (minutes: number) =>
      pairing("X1", [
        duty(at("2027-05-09", "08:00"), [BASE, "EMR"], { minutes: 400, blocks: [230] }),
        duty(at("2027-05-10", "08:00", "America/New_York"), ["EMR", "CVX"], { minutes: 480, blocks: [300] }),
        // Reports 10:30 Cape Verde time = 05:30 Denver (MDT), 2 segments back towards home.
        duty(at("2027-05-11", "10:30", "Atlantic/Cape_Verde"), ["CVX", "EMR", BASE], { minutes, blocks: [300, 230] }),
      ]);
    // Table B, 0500–0559 row, 2 segments: 12 h; not acclimated: 11 h 30 min.
    expect(checkLine(crew(), only, items(p(690)), far)).toEqual({ legal: true });
    expect(violations(checkLine(crew(), only, items(p(691)), far))[0]).toMatchObject({ ruleId: "fdp-limit", measured: 691, limit: 690 });
  });
});
