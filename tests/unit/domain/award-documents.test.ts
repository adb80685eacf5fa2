import { describe, expect, it } from "vitest";
import { awardSchema, explanationsSchema, statsSchema } from "../../../lib/domain/index.ts";

const line = {
  crewId: "1001",
  kind: "line",
  pairings: ["T101", "T202"],
  reserveDays: [],
  creditMinutes: 1140,
  score: 2.4,
  satisfaction: 0.9,
  grantedWishes: [0, 2],
};
const reserve = { ...line, crewId: "1003", kind: "reserve", pairings: [], reserveDays: ["2027-03-02"], creditMinutes: 0, score: 0, satisfaction: 0, grantedWishes: [] };
const award = {
  schemaVersion: 1,
  periodId: "HVN-2027-03",
  group: { base: "HVN", position: "captain" },
  lines: [line, reserve],
  openPairings: [{ pairingId: "T303", positionsOpen: 1, openCreditMinutes: 600 }],
  reserveReasons: [{ crewId: "1003", reason: "reserve-minimum", text: "The group needs one reserve line." }],
};

describe("awardSchema", () => {
  it("accepts lines, open time and reserve reasons", () => {
    expect(awardSchema.parse(award).lines).toHaveLength(2);
  });

  it("refuses a reserve line with pairings, two lines for one crew member, and a reason for a line holder", () => {
    expect(awardSchema.safeParse({ ...award, lines: [line, { ...reserve, pairings: ["T303"] }] }).success).toBe(false);
    expect(awardSchema.safeParse({ ...award, lines: [line, { ...line, kind: "line", reserveDays: ["2027-03-02"] }] }).success).toBe(false);
    const twice = awardSchema.safeParse({ ...award, lines: [line, line, reserve] });
    expect(twice.error?.issues[0]?.message).toBe("lines[1]: 1001 has two lines");
    const wrongReason = awardSchema.safeParse({ ...award, reserveReasons: [{ ...award.reserveReasons[0], crewId: "1001" }] });
    expect(wrongReason.error?.issues[0]?.message).toBe("reserveReasons[0]: 1001 holds no reserve line");
    expect(awardSchema.safeParse({ ...award, lines: [{ ...line, satisfaction: 1.2 }, reserve] }).success).toBe(false);
  });
});

describe("explanationsSchema", () => {
  const explanations = {
    schemaVersion: 1,
    crew: {
      "1002": [
        { rank: 0, outcome: "granted", grantedBy: { pairingIds: ["T202"] }, text: "Your 3-day trip is T202." },
        {
          rank: 1,
          outcome: "not-granted",
          reasons: [{ kind: "held-by-seniority", seniorityNumbers: [1] }, { kind: "traded-for-own-wish", rank: 0 }],
          text: "A more senior line holds these dates.",
        },
        { rank: 2, outcome: "partly", reasons: [{ kind: "not-legal", ruleId: "min-rest", text: "10 hours of rest" }], text: "…" },
      ],
    },
  };

  it("keys explanations by crew id and wish rank", () => {
    const parsed = explanationsSchema.parse(explanations);
    expect(parsed.crew["1002"]?.[1]?.reasons[0]).toEqual({ kind: "held-by-seniority", seniorityNumbers: [1] });
    expect(parsed.crew["1002"]?.[0]?.grantedBy).toEqual({ pairingIds: ["T202"], dates: [] });
  });

  it("refuses ranks out of order, reasons on a granted wish and unknown reason kinds", () => {
    const [first, second] = explanations.crew["1002"];
    expect(explanationsSchema.safeParse({ ...explanations, crew: { "1002": [second, first] } }).success).toBe(false);
    const grantedWithReason = { ...first, reasons: [{ kind: "needed-for-coverage" }] };
    expect(explanationsSchema.safeParse({ ...explanations, crew: { "1002": [grantedWithReason] } }).success).toBe(false);
    const unknown = { ...second, rank: 0, reasons: [{ kind: "asked-too-late" }] };
    expect(explanationsSchema.safeParse({ ...explanations, crew: { "1002": [unknown] } }).success).toBe(false);
  });
});

describe("statsSchema", () => {
  it("accepts times in ms and counts, and refuses negative times", () => {
    const stats = { times: { pricing: 812.5, master: 240 }, columns: 5400, rounds: 12, gap: 0.004, stoppedBy: "optimal" };
    expect(statsSchema.parse(stats)).toEqual(stats);
    expect(statsSchema.safeParse({ ...stats, times: { pricing: -1 } }).success).toBe(false);
  });
});
