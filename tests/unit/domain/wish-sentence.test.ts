import { describe, expect, it } from "vitest";
import { datesLabel, wishSchema, wishSentence } from "@/lib/domain/index";

const say = (raw: unknown) => wishSentence(wishSchema.parse(raw));

describe("each wish reads as one sentence", () => {
  it("free days run together into ranges", () => {
    expect(say({ kind: "free-days", dates: ["2026-12-26", "2026-12-24", "2026-12-25"] })).toBe("Keep 24–26 Dec free");
    expect(datesLabel(["2026-12-24", "2026-12-31", "2027-01-01", "2026-12-25"])).toBe("24–25 Dec, 31 Dec – 1 Jan");
  });

  it("trip and no-trip wishes name trips or describe them", () => {
    expect(say({ kind: "trip", pairingIds: ["T104"] })).toBe("Give me trip T104");
    expect(say({ kind: "trip", count: 2, filter: { lengthDays: { min: 3, max: 3 }, layoverAt: ["PLM", "EMR"] } })).toBe(
      "At least 2 of: trips of 3 days, laying over at PLM or EMR",
    );
    expect(say({ kind: "no-trip", filter: { reportBefore: "06:00" } })).toBe("Keep me off trips reporting before 06:00");
    expect(say({ kind: "no-trip", pairingIds: ["T1", "T2"], filter: { redEye: true, daysOfWeek: [7, 6] } })).toBe(
      "Keep me off trips T1, T2, or trips touching Sat or Sun, with a red-eye",
    );
  });

  it("rhythm, credit and buddy", () => {
    expect(say({ kind: "rhythm", maxDaysOn: 4, weekendsOff: true })).toBe("At most 4 days on in a row, and weekends free");
    expect(say({ kind: "rhythm", weekendsOff: true })).toBe("Weekends free");
    expect(say({ kind: "credit", minMinutes: 70 * 60, maxMinutes: 80 * 60 + 30 })).toBe("Credit between 70 and 80:30 h");
    expect(say({ kind: "credit", maxMinutes: 4800 })).toBe("Credit of at most 80 h");
    expect(say({ kind: "buddy", crewId: "4711" })).toBe("Fly the same trips as employee 4711");
  });
});
