import { describe, expect, it } from "vitest";
import type { Award, Instance } from "@/lib/domain";
import { awardSchema } from "@/lib/domain";
import { solveAward } from "@/lib/award";
import { loadKasirzadeh } from "@/seed/published/kasirzadeh-2017";
import { lineProblems } from "./oracle/published-limits.ts";

// The published network: A. Kasirzadeh, M. Saddoune, F. Soumis, "Airline crew
// scheduling: models, algorithms, and data sets", EURO Journal on
// Transportation and Logistics 6 (2017) 111–137, instance 1 (fixtures in
// tests/fixtures/kasirzadeh-2017). Its published result leaves 0 % of legs open.
// Bases BAA (7 pilots, 22 pairings) and BAC (6, 24) run here; BAB (20, 126)
// runs in the benchmark (npm run bench), which reports its open time.

describe("the award on the published network (Kasirzadeh, Saddoune & Soumis 2017, instance 1)", () => {
  const { instances } = loadKasirzadeh("tests/fixtures/kasirzadeh-2017/instance1", { seed: 7 });
  const small = instances.filter((i) => i.group.base === "BAA" || i.group.base === "BAC");

  it("has the two small bases to test", () => {
    expect(small.map((i) => [i.group.base, i.crew.length, i.pairings.length])).toEqual([
      ["BAA", 7, 22],
      ["BAC", 6, 24],
    ]);
  });

  it.each(small.map((i) => [i.group.base, i] as const))("base %s: every pairing covered, every line legal on an independent re-check", async (_base, original) => {
    const instance: Instance = { ...original, settings: { ...original.settings, mode: "balanced", timeLimitSeconds: 120 } };
    const { award, report } = await solveAward(instance);
    const parsed: Award = awardSchema.parse(award);
    // As in the published result: no open legs, hence no open pairings.
    expect(parsed.openPairings).toEqual([]);
    expect(report.openCreditMinutes).toBe(0);
    const byId = new Map(instance.pairings.map((p) => [p.id, p]));
    const flown = new Map<string, number>();
    for (const line of parsed.lines) {
      const pairings = line.pairings.map((id) => byId.get(id)!);
      expect(lineProblems(pairings), `${line.crewId}'s line`).toEqual([]);
      for (const id of line.pairings) flown.set(id, (flown.get(id) ?? 0) + 1);
    }
    // Each pairing flown exactly as often as it needs captains (once).
    expect([...flown.values()].every((n) => n === 1)).toBe(true);
    expect(flown.size).toBe(instance.pairings.length);
  }, 150_000);
});
