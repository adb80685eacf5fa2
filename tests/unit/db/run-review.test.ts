import { describe, expect, it } from "vitest";
import { greedyAward } from "@/lib/award";
import { pairingDates } from "@/lib/domain/pairing-facts";
import { reviewRun } from "@/lib/db/run-review";
import { tinyInstance } from "../award/oracle/tiny-instance.ts";

const H = 60;

describe("the run review", () => {
  const instance = tinyInstance({ crew: 5, seed: 3, days: 7, pairings: 10 }, { minCreditMinutes: 0, maxCreditMinutes: 30 * H });
  const { award } = greedyAward(instance);

  it("passes every line of a legal award, and names a line lib/rules refuses", () => {
    expect(reviewRun(instance, award)).toMatchObject({ legal: award.lines.length, lines: award.lines.length, problems: [] });
    // Every trip on the most senior crew member's line: overlaps and the credit maximum break it.
    const all = { ...award, lines: award.lines.map((l, i) => (i === 0 ? { ...l, kind: "line" as const, reserveDays: [], pairings: instance.pairings.map((p) => p.id) } : l)) };
    const review = reviewRun(instance, all);
    expect(review.legal).toBe(award.lines.length - 1);
    expect(review.problems.map((p) => p.crewId)).toEqual([award.lines[0]!.crewId]);
    expect(review.problems[0]!.texts.length).toBeGreaterThan(0);
  });

  it("spreads each open trip's open credit over every base-local day it touches", () => {
    const everythingOpen = { ...award, openPairings: instance.pairings.map((p) => ({ pairingId: p.id, positionsOpen: 1, openCreditMinutes: p.creditMinutes })) };
    const { openByDay } = reviewRun(instance, everythingOpen);
    expect(openByDay).toHaveLength(7);
    expect([openByDay[0]!.date, openByDay.at(-1)!.date]).toEqual([instance.period.startDate, instance.period.endDate]);
    const inPeriod = (d: string) => d >= instance.period.startDate && d <= instance.period.endDate;
    const expected = instance.pairings.reduce((t, p) => t + p.creditMinutes * pairingDates(p, instance.period.zone).filter(inPeriod).length, 0);
    expect(openByDay.reduce((t, d) => t + d.openCreditMinutes, 0)).toBe(expected);
  });
});
