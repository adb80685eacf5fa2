import { describe, expect, it } from "vitest";
import { instanceSchema, type Instance } from "@/lib/domain";
import { prepareProblem } from "@/lib/award";
import { chainBound, nowScore } from "@/lib/award/chain-bound";
import { mulberry32 as random } from "@/lib/award/improve";
import { priceLines } from "@/lib/award/pricing";
import { generatePeriod } from "@/seed/generator/generate-period";
import { enumerateLines } from "./oracle/enumerate-lines.ts";

const H = 60;

/** A tiny generated month for one position, its credit window replaced, in balanced mode. */
function tiny(seed: number, crew: number, pairings: number, days: number, minHours: number, maxHours: number): Instance {
  const instance = generatePeriod({ crew, pairings, days, seed, positions: ["captain"] }).instances[0]!;
  const rules = instance.ruleSet.rules.map((r) => (r.id === "credit-window" ? { ...r, params: { minMinutes: minHours * H, maxMinutes: maxHours * H } } : r));
  return instanceSchema.parse({ ...instance, ruleSet: { ...instance.ruleSet, rules }, settings: { ...instance.settings, mode: "balanced" } });
}

const CASES = [
  { seed: 1, crew: 5, pairings: 10, days: 7, min: 0, max: 30 },
  { seed: 3, crew: 5, pairings: 10, days: 7, min: 0, max: 30 },
  { seed: 5, crew: 4, pairings: 12, days: 10, min: 0, max: 40 },
  { seed: 6, crew: 4, pairings: 12, days: 10, min: 0, max: 40 },
  { seed: 7, crew: 6, pairings: 9, days: 8, min: 8, max: 30 },
  // Longer: trips that start on the day the previous one ends, days-off rules that bind.
  { seed: 11, crew: 8, pairings: 14, days: 14, min: 0, max: 60 },
  { seed: 12, crew: 8, pairings: 14, days: 12, min: 10, max: 50 },
];

describe("the chain bound of line generation", { timeout: 120_000 }, () => {
  // Against every legal line of an independent enumeration (tests/unit/award/oracle), at random duals.
  it("is never below the best legal line, at the root and after every prefix of every legal line, and pricing stays exact", () => {
    const problems: string[] = [];
    let compared = 0;
    let tight = 0;
    for (const spec of CASES) {
      const instance = tiny(spec.seed, spec.crew, spec.pairings, spec.days, spec.min, spec.max);
      const e = enumerateLines(instance);
      const problem = prepareProblem(instance);
      const rand = random(spec.seed * 101);
      problem.crew.forEach((c, i) => {
        const oracle = e.crew[i]!;
        expect(oracle.crew.id).toBe(c.crew.id);
        for (let trial = 0; trial < 6; trial++) {
          // Costs of either sign (duals of equality rows), and a score weight from none to large.
          const cost = Float64Array.from(problem.pairings, () => (rand() - 0.45) * 2);
          const scoreWeight = trial === 0 ? 0 : rand() * 3;
          const value = (line: readonly number[], score: number) => scoreWeight * score - line.reduce((t, k) => t + cost[k]!, 0);
          // Every third trial prices within a pool of trips (as a neighbourhood does).
          const pool = trial % 3 === 2 ? new Set(problem.pairings.flatMap((_, k) => (rand() < 0.6 ? [k] : []))) : undefined;
          const legal = oracle.lines.filter((l) => l.creditMinutes >= problem.minCreditMinutes && (!pool || l.pairings.every((k) => pool.has(k))));
          const best = legal.reduce((b, l) => Math.max(b, value(l.pairings, l.score)), -Infinity);
          const gain = Float64Array.from(c.eligible, (k) => -cost[k]!);
          const usable = Uint8Array.from(c.eligible, (k) => (!pool || pool.has(k) ? 1 : 0));
          // Half the trials tune the multipliers hard (no target), half gently (towards the best line).
          const bound = chainBound(problem, c, gain, usable, scoreWeight, trial % 2 ? -Infinity : best, trial % 2 ? 12 : 4);
          compared++;
          if (bound.root < best - 1e-9) problems.push(`seed ${spec.seed} ${c.crew.id}: root bound ${bound.root} below the best legal line ${best}`);
          if (bound.root <= best + 0.05 * Math.max(1, Math.abs(best))) tight++;
          // After each prefix of each legal line: the node's bound covers the whole line.
          for (const line of legal) {
            const positions = line.pairings.map((k) => c.position[k]!);
            if (positions.some((j) => j < 0)) {
              problems.push(`seed ${spec.seed} ${c.crew.id}: a legal line holds a trip the problem calls ineligible`);
              continue;
            }
            positions.sort((a, b) => a - b);
            const full = value(line.pairings, line.score);
            for (let cut = 1; cut <= positions.length; cut++) {
              const prefix = positions.slice(0, cut);
              const dayCount = new Uint16Array(problem.periodLength);
              const duty = new Set<number>();
              let credit = 0;
              let gainSum = 0;
              for (const j of prefix) {
                const k = c.eligible[j]!;
                for (const d of problem.periodDays[k]!) dayCount[d]!++;
                for (const d of problem.dutyDays[k]!) duty.add(d);
                credit += problem.pairings[k]!.creditMinutes;
                gainSum += gain[j]!;
              }
              const node =
                gainSum + scoreWeight * nowScore(problem, c, prefix, dayCount, credit, bound.theta) - bound.kappa * credit - bound.mu * duty.size + bound.constant + bound.suffix[prefix.at(-1)!]!;
              if (node < full - 1e-9) problems.push(`seed ${spec.seed} ${c.crew.id}: after [${prefix}] the bound ${node} is below the line's value ${full}`);
            }
          }
          // The search with the bound still finds the true best line and proves it.
          const r = priceLines(problem, c, { scoreWeight, cost, threshold: -Infinity, maxLines: 1, nodeLimit: 1_000_000, ...(pool ? { allowed: (k: number) => pool.has(k) } : {}) });
          const found = r.lines[0]?.value ?? -Infinity;
          if (!r.exhausted || Math.abs(found - best) > 1e-9) problems.push(`seed ${spec.seed} ${c.crew.id}: pricing found ${found} (exhausted ${r.exhausted}), the enumeration ${best}`);
          if (r.upperBound < best - 1e-9) problems.push(`seed ${spec.seed} ${c.crew.id}: pricing's upper bound ${r.upperBound} below ${best}`);
        }
      });
    }
    expect(problems).toEqual([]);
    expect(compared).toBeGreaterThan(100);
    // Not a vacuous bound: within 5 % of the best line in a fair share of the cases.
    expect(tight / compared).toBeGreaterThan(0.3);
  });
});
