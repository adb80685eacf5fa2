import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Instance } from "@/lib/domain";
import { awardSchema, canonicalJson, instanceSchema, lineScore } from "@/lib/domain";
import { checkLine } from "@/lib/rules";
import { greedyAward, prepareProblem, solveAward, solveAwardInThread, type Progress } from "@/lib/award";
import { priceLines, wishBounds } from "@/lib/award/pricing";
import { generatePeriod } from "@/seed/generator/generate-period";

const H = 60;

/** A small generated month at one base, its credit window fitted to the period's length and the mode balanced. */
function small(seed: number, crew: number, pairings: number, days: number, maxCreditHours: number): Instance {
  const instance = generatePeriod({ crew, pairings, days, seed, positions: ["captain"] }).instances[0]!;
  const rules = instance.ruleSet.rules.map((r) => (r.id === "credit-window" ? { ...r, params: { minMinutes: 0, maxMinutes: maxCreditHours * H } } : r));
  return instanceSchema.parse({ ...instance, ruleSet: { ...instance.ruleSet, rules }, settings: { ...instance.settings, mode: "balanced" } });
}

describe("the pricing search", () => {
  const instance = small(21, 4, 24, 10, 40);
  const problem = prepareProblem(instance);

  it("bounds every extension of a line from above (the bound it prunes with never cuts off a better line)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: problem.crew.length - 1 }), fc.array(fc.nat(), { minLength: 1, maxLength: 8 }), fc.nat(), (who, picks, cut) => {
        const c = problem.crew[who]!;
        if (c.eligible.length === 0) return;
        // A random chain of eligible positions in time order, cut into a prefix and the rest.
        const chain = [...new Set(picks.map((x) => x % c.eligible.length))].sort((a, b) => a - b);
        const prefix = chain.slice(0, cut % (chain.length + 1));
        const from = prefix.length ? prefix.at(-1)! + 1 : 0;
        const extension = chain.filter((j) => j >= from);
        const days = new Uint16Array(problem.periodLength);
        let credit = 0;
        for (const j of prefix) {
          for (const d of problem.periodDays[c.eligible[j]!]!) days[d]!++;
          credit += problem.pairings[c.eligible[j]!]!.creditMinutes;
        }
        const { ahead, here } = wishBounds(problem, c, prefix, days, credit, from);
        const score = (js: number[]) => lineScore(c.memberWishes[0]!, js.map((j) => problem.pairings[c.eligible[j]!]!), problem.score, instance.settings);
        expect(ahead).toBeGreaterThanOrEqual(score([...prefix, ...extension]) - 1e-12);
        expect(here).toBeGreaterThanOrEqual(score(prefix) - 1e-12);
      }),
      { numRuns: 300, seed: 7 },
    );
  });

  it("returns only lines the legality engine calls legal, best first", () => {
    const zero = new Float64Array(problem.pairings.length);
    for (const c of problem.crew) {
      const r = priceLines(problem, c, { scoreWeight: 1, cost: zero, threshold: -Infinity, maxLines: 20, nodeLimit: 50_000 });
      expect(r.lines.length).toBeGreaterThan(0);
      for (const line of r.lines) {
        const items = line.pairings.map((k) => ({ kind: "pairing" as const, pairing: problem.pairings[k]! }));
        expect(checkLine(c.crew, instance.ruleSet, items, problem.engine).legal).toBe(true);
      }
      const values = r.lines.map((l) => l.value);
      expect(values).toEqual([...values].sort((a, b) => b - a));
    }
  });
});

describe("the award engine", () => {
  const instance = small(22, 4, 14, 8, 30);

  it("gives the same award twice, byte for byte (determinism, stats aside)", async () => {
    const a = await solveAward(instance);
    const b = await solveAward(instance);
    expect(canonicalJson(a.award)).toBe(canonicalJson(b.award));
    expect(a.stats.stoppedBy).toBe("optimal");
  });

  it("covers at least as much as the greedy award and scores at least as high at the same coverage", async () => {
    const engine = await solveAward(instance);
    const greedy = greedyAward(instance);
    awardSchema.parse(greedy.award);
    expect(engine.report.openCreditMinutes).toBeLessThanOrEqual(greedy.report.openCreditMinutes);
    if (engine.report.openCreditMinutes === greedy.report.openCreditMinutes) {
      expect(engine.report.objective).toBeGreaterThanOrEqual(greedy.report.objective - 1e-9);
    }
  });

  it("awards in strict mode too: the same award twice, byte for byte, with a certificate on every line", async () => {
    const strict = { ...instance, settings: { ...instance.settings, mode: "strict" as const } };
    const first = await solveAward(strict);
    const again = await solveAward(strict);
    expect(canonicalJson(again.award)).toBe(canonicalJson(first.award));
    expect(first.award.lines.every((l) => typeof l.certificate?.method === "string")).toBe(true);
    // The most senior crew member is settled first, and nothing is better for them than the seniors' and coverage's limits allow.
    expect(first.award.lines[0]!.certificate).toMatchObject({ step: 1 });
  });

  it("runs in a worker thread with progress, and the same award as in-process", async () => {
    const seen: Progress[] = [];
    const threaded = await solveAwardInThread(instance, { onProgress: (p) => seen.push(p) });
    const direct = await solveAward(instance);
    expect(canonicalJson(threaded.award)).toBe(canonicalJson(direct.award));
    expect(seen.map((p) => p.phase)).toContain("coverage");
    expect(seen.at(-1)).toMatchObject({ phase: "done", percent: 100 });
    const percents = seen.map((p) => p.percent);
    expect(percents).toEqual([...percents].sort((a, b) => a - b));
  }, 60_000);

  it("cancels a run in its worker thread", async () => {
    const big = small(23, 20, 120, 31, 95);
    const controller = new AbortController();
    const run = solveAwardInThread({ ...big, settings: { ...big.settings, timeLimitSeconds: 600 } }, {
      onProgress: (p) => {
        if (p.phase === "coverage") controller.abort();
      },
      signal: controller.signal,
    });
    const started = performance.now();
    await expect(run).rejects.toThrow(/cancelled/);
    // Cancelled well before its 600 s limit.
    expect(performance.now() - started).toBeLessThan(120_000);
  }, 150_000);
});
