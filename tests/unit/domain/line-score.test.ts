import { describe, expect, it } from "vitest";
import {
  awardSettingsSchema,
  lineScore,
  rankWeight,
  reserveLineScore,
  satisfaction,
  type ScoreContext,
  wishListSchema,
} from "../../../lib/domain/index.ts";
import { T101, T202, T303, ZONE } from "./carrier.ts";

const march: ScoreContext = { zone: ZONE, periodStart: "2027-03-01", periodEnd: "2027-03-31" };
const settings = awardSettingsSchema.parse({});

describe("rank weights", () => {
  it("fall as rankDecay^r from 1 at rank 0", () => {
    expect(rankWeight(0, 0.8)).toBe(1);
    expect(rankWeight(1, 0.8)).toBeCloseTo(0.8, 12);
    expect(rankWeight(3, 0.8)).toBeCloseTo(0.512, 12);
    expect(rankWeight(5, 1)).toBe(1);
  });
});

describe("lineScore", () => {
  const wishes = wishListSchema.parse([
    { kind: "trip", filter: { lengthDays: { min: 3 } } }, // 1
    { kind: "free-days", dates: ["2027-03-14", "2027-03-15"] }, // 0.5
    { kind: "credit", minMinutes: 2400, maxMinutes: 3000 }, // 1740 / 2400 = 0.725
  ]);

  it("is B + Σ rankDecay^r · score with the default settings", () => {
    // 1 + 1·1 + 0.8·0.5 + 0.64·0.725 = 2.864
    expect(lineScore(wishes, [T101, T202, T303], march, settings)).toBeCloseTo(2.864, 12);
  });

  it("follows the settings' base value and decay", () => {
    const flat = { rankDecay: 1, baseLineValue: 2 };
    expect(lineScore(wishes, [T101, T202, T303], march, flat)).toBeCloseTo(2 + 1 + 0.5 + 0.725, 12);
  });

  it("gives an empty bid the base value, which beats reserve", () => {
    expect(lineScore([], [T101], march, settings)).toBe(1);
    expect(lineScore([], [], march, settings)).toBeGreaterThan(reserveLineScore);
    expect(reserveLineScore).toBe(0);
  });
});

describe("satisfaction", () => {
  it("is score ÷ best, clamped to [0, 1]", () => {
    expect(satisfaction(2.864, 3.58)).toBeCloseTo(0.8, 12);
    expect(satisfaction(0, 2)).toBe(0);
    expect(satisfaction(5, 4)).toBe(1);
    expect(satisfaction(-1, 4)).toBe(0);
  });

  it("is 1 when no line-holder line exists (best 0)", () => {
    expect(satisfaction(0, 0)).toBe(1);
  });
});
