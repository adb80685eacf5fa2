import { describe, expect, it } from "vitest";
import { carryWishes, wishListSchema } from "@/lib/domain/index";

describe("last period's bid as a starting point", () => {
  it("keeps patterns, credit, buddy and filters; leaves named trips and dates behind", () => {
    const old = wishListSchema.parse([
      { kind: "free-days", dates: ["2026-12-24"] },
      { kind: "trip", pairingIds: ["T104"] },
      { kind: "no-trip", pairingIds: ["T110"], filter: { redEye: true } },
      { kind: "rhythm", maxDaysOn: 4 },
      { kind: "credit", minMinutes: 4200 },
      { kind: "buddy", crewId: "4135" },
    ]);
    const { wishes, leftBehind } = carryWishes(old);
    expect(wishes).toEqual([
      { kind: "no-trip", filter: { redEye: true } },
      { kind: "rhythm", maxDaysOn: 4 },
      { kind: "credit", minMinutes: 4200 },
      { kind: "buddy", crewId: "4135" },
    ]);
    expect(leftBehind).toHaveLength(3);
    expect(leftBehind[1]).toContain("T104");
    expect(wishListSchema.safeParse(wishes).success).toBe(true);
  });
});
