// Worked examples: a legal 4-day trip under the full presets, and the same trip with one layover rest
// shortened by 5 minutes below 10 h (14 CFR 117.25(e); 14 CFR 121.467(b) as amended in 2022 — reference file).
import { describe, expect, it } from "vitest";
import { addMinutes, minutesBetween } from "@/lib/domain/time";
import { checkLine, presetRuleSet } from "@/lib/rules";
import { BASE, at, context, crew, duty, items, pairing } from "@/tests/support/rule-fixtures";

const ctx = context();

/** T4001, 4–7 May 2027: HLV–CRB–EMR, EMR–BKW–EMR, EMR–CRB–MRW, MRW–HLV; layovers 14 h, `secondRest`, 12 h. */
function fourDayTrip(secondRest: number) {
  const d1 = duty(at("2027-05-04", "06:00"), [BASE, "CRB", "EMR"]);
  const d2 = duty(addMinutes(d1.release, 14 * 60), ["EMR", "BKW", "EMR"]);
  const d3 = duty(addMinutes(d2.release, secondRest), ["EMR", "CRB", "MRW"]);
  const d4 = duty(addMinutes(d3.release, 12 * 60), ["MRW", BASE]);
  return pairing("T4001", [d1, d2, d3, d4]);
}

describe("worked example: a 4-day trip", () => {
  // Agreement rules stay in; the credit minimum is set to 0 because one trip is not a month's line.
  const flightcrew = presetRuleSet("us-flightcrew", { minCredit: 0 });
  const cabin = presetRuleSet("us-cabin", { minCredit: 0 });

  it("§117.25(e) / §117.13 / §117.11: the trip with a 10 h second layover is legal under us-flightcrew, agreement rules included", () => {
    const trip = fourDayTrip(600);
    expect(minutesBetween(trip.dutyPeriods[1]!.release, trip.dutyPeriods[2]!.report)).toBe(600);
    expect(checkLine(crew(), flightcrew, items(trip), ctx)).toEqual({ legal: true });
  });

  it("§117.25(e): the same trip with that rest 5 min shorter (9 h 55 min) breaks rest-before-fdp, and nothing else", () => {
    expect(checkLine(crew(), flightcrew, items(fourDayTrip(595)), ctx)).toEqual({
      legal: false,
      violations: [
        {
          ruleId: "rest-before-fdp",
          measured: 595,
          limit: 600,
          unit: "minutes",
          items: ["T4001"],
          text: "rest before trip T4001 is 9 h 55 min; at least 10 h is required (14 CFR 117.25(e))",
        },
      ],
    });
  });

  it("§121.467(b): the same pair under us-cabin: legal with 10 h, rest-after-duty with 9 h 55 min", () => {
    expect(checkLine(crew({ position: "flight_attendant" }), cabin, items(fourDayTrip(600)), ctx)).toEqual({ legal: true });
    const r = checkLine(crew({ position: "flight_attendant" }), cabin, items(fourDayTrip(595)), ctx);
    expect(r.legal ? [] : r.violations).toEqual([
      {
        ruleId: "rest-after-duty",
        measured: 595,
        limit: 600,
        unit: "minutes",
        items: ["T4001"],
        text: "rest before trip T4001 is 9 h 55 min; at least 10 h is required (14 CFR 121.467(b) (10 h since the 2022 amendment))",
      },
    ]);
  });
});
