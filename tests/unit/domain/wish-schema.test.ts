import { describe, expect, it } from "vitest";
import { bidSchema, maxWishes, wishListSchema, wishSchema } from "../../../lib/domain/index.ts";

describe("wishSchema", () => {
  it("parses each kind and fills the trip count", () => {
    expect(wishSchema.parse({ kind: "trip", pairingIds: ["T412"] })).toEqual({ kind: "trip", pairingIds: ["T412"], count: 1 });
    expect(wishSchema.parse({ kind: "no-trip", filter: { reportBefore: "06:00" } }).kind).toBe("no-trip");
    expect(wishSchema.parse({ kind: "free-days", dates: ["2027-12-24", "2027-12-25"] }).kind).toBe("free-days");
    expect(wishSchema.parse({ kind: "rhythm", maxDaysOn: 4 }).kind).toBe("rhythm");
    expect(wishSchema.parse({ kind: "credit", minMinutes: 4200, maxMinutes: 4800 }).kind).toBe("credit");
    expect(wishSchema.parse({ kind: "buddy", crewId: "004711" }).kind).toBe("buddy");
  });

  it("refuses wishes that ask for nothing or contradict themselves", () => {
    const bad = [
      { kind: "trip" },
      { kind: "trip", pairingIds: [] },
      { kind: "trip", pairingIds: ["T1"], count: 0 },
      { kind: "no-trip", filter: {} },
      { kind: "free-days", dates: [] },
      { kind: "free-days", dates: ["2027-12-24", "2027-12-24"] },
      { kind: "free-days", dates: ["2027-02-30"] },
      { kind: "rhythm" },
      { kind: "rhythm", weekendsOff: false },
      { kind: "credit" },
      { kind: "credit", minMinutes: 4800, maxMinutes: 4200 },
      { kind: "buddy" },
      { kind: "vacation", dates: ["2027-12-24"] },
    ];
    for (const wish of bad) expect(wishSchema.safeParse(wish).success, JSON.stringify(wish)).toBe(false);
  });

  it("explains what a rhythm wish is missing", () => {
    expect(wishSchema.safeParse({ kind: "rhythm", weekendsOff: false }).error?.issues[0]?.message).toBe(
      "a work pattern needs a limit on days on in a row, weekends off, or both",
    );
  });
});

describe("wish lists and bids", () => {
  const freeDay = { kind: "free-days", dates: ["2027-03-14"] };

  it(`holds at most ${maxWishes} wishes and one buddy`, () => {
    expect(wishListSchema.safeParse(Array.from({ length: maxWishes }, () => freeDay)).success).toBe(true);
    expect(wishListSchema.safeParse(Array.from({ length: maxWishes + 1 }, () => freeDay)).success).toBe(false);
    const twoBuddies = [
      { kind: "buddy", crewId: "1" },
      { kind: "buddy", crewId: "2" },
    ];
    expect(wishListSchema.safeParse(twoBuddies).error?.issues[0]?.message).toBe("a bid may name one buddy at most");
  });

  it("refuses a bid naming its own crew member as buddy", () => {
    const bid = { crewId: "004711", periodId: "2027-03", wishes: [freeDay, { kind: "buddy", crewId: "004711" }] };
    const result = bidSchema.safeParse(bid);
    expect(result.error?.issues[0]?.path).toEqual(["wishes", 1, "crewId"]);
    expect(bidSchema.safeParse({ ...bid, wishes: [freeDay, { kind: "buddy", crewId: "000815" }] }).success).toBe(true);
  });
});
