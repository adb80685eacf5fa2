import { describe, expect, it } from "vitest";
import { type ScoreContext, scoreWish, type Wish, wishSchema } from "../../../lib/domain/index.ts";
import { T101, T202, T303, T404, ZONE } from "./carrier.ts";

// Line A works 3 March (T101), 12–14 March (T202, over the spring-forward
// night), 20–21 March (T303, red-eye over midnight): credit 300 + 840 + 600 = 1740.
const lineA = [T101, T202, T303];
const march: ScoreContext = { zone: ZONE, periodStart: "2027-03-01", periodEnd: "2027-03-31" };

function score(wish: unknown, line = lineA, context = march): number {
  return scoreWish(wishSchema.parse(wish) as Wish, line, context);
}

describe("scoreWish: trip", () => {
  it("is 1 with at least `count` selected trips, else the fraction held", () => {
    expect(score({ kind: "trip", filter: { lengthDays: { min: 3 } } })).toBe(1);
    expect(score({ kind: "trip", filter: { lengthDays: { min: 3 } }, count: 2 })).toBe(0.5);
    expect(score({ kind: "trip", filter: { daysOfWeek: [6, 7] }, count: 4 })).toBe(0.5);
    expect(score({ kind: "trip", filter: { daysOfWeek: [6, 7] }, count: 1 })).toBe(1);
    expect(score({ kind: "trip", pairingIds: ["T404"] })).toBe(0);
    expect(score({ kind: "trip", pairingIds: ["T404"], filter: { layoverAt: ["MRW"] } })).toBe(1);
    expect(score({ kind: "trip", pairingIds: ["T101"] }, [])).toBe(0);
  });
});

describe("scoreWish: no-trip", () => {
  it("is 1 when the line holds none of the trips, else 0", () => {
    expect(score({ kind: "no-trip", filter: { redEye: true } })).toBe(0);
    expect(score({ kind: "no-trip", filter: { redEye: true } }, [T101, T202])).toBe(1);
    expect(score({ kind: "no-trip", filter: { reportBefore: "06:30" } })).toBe(0);
    expect(score({ kind: "no-trip", pairingIds: ["T404"] })).toBe(1);
    expect(score({ kind: "no-trip", filter: { deadhead: true } }, [])).toBe(1);
  });
});

describe("scoreWish: free-days", () => {
  it("is the fraction of the named dates left free", () => {
    // 13 worked, 15 free, 21 worked, 4 free.
    expect(score({ kind: "free-days", dates: ["2027-03-13", "2027-03-15", "2027-03-21", "2027-03-04"] })).toBe(0.5);
    expect(score({ kind: "free-days", dates: ["2027-03-05", "2027-03-06"] })).toBe(1);
  });

  it("leaves the 15th free after a release at 18:00 MDT, though that is the 15th in UTC", () => {
    expect(score({ kind: "free-days", dates: ["2027-03-14", "2027-03-15"] })).toBe(0.5);
  });

  it("counts the date after the red-eye's local midnight as worked", () => {
    expect(score({ kind: "free-days", dates: ["2027-03-21"] }, [T303])).toBe(0);
  });

  it("counts a date outside the period as free unless a trip runs into it", () => {
    const lateTrip = { ...T303 }; // 20–21 March
    const shortPeriod: ScoreContext = { zone: ZONE, periodStart: "2027-03-01", periodEnd: "2027-03-20" };
    expect(score({ kind: "free-days", dates: ["2027-03-21", "2027-04-02"] }, [lateTrip], shortPeriod)).toBe(0.5);
  });
});

describe("scoreWish: rhythm", () => {
  it("most days on in a row: 1 within it, else max ÷ longest run", () => {
    expect(score({ kind: "rhythm", maxDaysOn: 3 })).toBe(1);
    expect(score({ kind: "rhythm", maxDaysOn: 2 })).toBeCloseTo(2 / 3, 12);
    expect(score({ kind: "rhythm", maxDaysOn: 1 })).toBeCloseTo(1 / 3, 12);
    // T303 and T404 are apart (21 → 24); T202 alone is the run of three.
    expect(score({ kind: "rhythm", maxDaysOn: 2 }, [T303, T404])).toBe(1);
  });

  it("weekends off: the fraction of the period's weekends wholly free", () => {
    // March 2027 weekends: 6–7 free, 13–14 worked (T202), 20–21 worked (T303), 27–28 free.
    expect(score({ kind: "rhythm", weekendsOff: true })).toBe(0.5);
    expect(score({ kind: "rhythm", weekendsOff: true }, [T101, T404])).toBe(1);
    // A period from Sunday 7 to Friday 12 March has one weekend, the lone Sunday 7th.
    const shortPeriod: ScoreContext = { zone: ZONE, periodStart: "2027-03-07", periodEnd: "2027-03-12" };
    expect(score({ kind: "rhythm", weekendsOff: true }, lineA, shortPeriod)).toBe(1);
    const noWeekend: ScoreContext = { zone: ZONE, periodStart: "2027-03-08", periodEnd: "2027-03-12" };
    expect(score({ kind: "rhythm", weekendsOff: true }, lineA, noWeekend)).toBe(1);
  });

  it("several parts: their mean", () => {
    expect(score({ kind: "rhythm", maxDaysOn: 2, weekendsOff: true })).toBeCloseTo((2 / 3 + 1 / 2) / 2, 12);
  });
});

describe("scoreWish: credit", () => {
  it("is 1 inside the range, credit ÷ min below it, max ÷ credit above it", () => {
    expect(score({ kind: "credit", minMinutes: 1000, maxMinutes: 2000 })).toBe(1);
    expect(score({ kind: "credit", minMinutes: 2400, maxMinutes: 3000 })).toBe(1740 / 2400);
    expect(score({ kind: "credit", maxMinutes: 1500 })).toBe(1500 / 1740);
    expect(score({ kind: "credit", minMinutes: 1740 })).toBe(1);
    expect(score({ kind: "credit", minMinutes: 600 }, [])).toBe(0);
    expect(score({ kind: "credit", maxMinutes: 600 }, [])).toBe(1);
  });
});

describe("scoreWish: buddy", () => {
  it("is the fraction of the crew member's trips the buddy also flies", () => {
    const withBuddy = { ...march, buddyLine: ["T202", "T404"] };
    expect(score({ kind: "buddy", crewId: "004711" }, lineA, withBuddy)).toBeCloseTo(1 / 3, 12);
    expect(score({ kind: "buddy", crewId: "004711" }, [T202, T404], withBuddy)).toBe(1);
  });

  it("is 0 for an empty line and without a mutual buddy line", () => {
    expect(score({ kind: "buddy", crewId: "004711" }, [], { ...march, buddyLine: ["T202"] })).toBe(0);
    expect(score({ kind: "buddy", crewId: "004711" }, lineA, march)).toBe(0);
  });
});

describe("every score lies in [0, 1]", () => {
  const wishes: unknown[] = [
    { kind: "trip", filter: { redEye: false }, count: 5 },
    { kind: "no-trip", filter: { layoverAt: ["QRL"] } },
    { kind: "free-days", dates: ["2027-03-12", "2027-03-31"] },
    { kind: "rhythm", maxDaysOn: 1, weekendsOff: true },
    { kind: "credit", minMinutes: 4000 },
    { kind: "credit", maxMinutes: 0 },
  ];
  it.each([[[]], [[T101]], [lineA], [[T101, T202, T303, T404]]])("for line %#", (line) => {
    for (const wish of wishes) {
      const value = score(wish, line);
      expect(value).toBeGreaterThanOrEqual(0);
      expect(value).toBeLessThanOrEqual(1);
    }
  });
});
