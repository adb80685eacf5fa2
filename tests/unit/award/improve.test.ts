/**
 * Improving an award by neighbourhoods (lib/award/improve.ts): never worse,
 * always a valid award (one legal line each, no trip over-covered, open time
 * kept), and it does improve a weak start — the greedy award — both for wishes
 * and, in coverage mode, for open time.
 */
import { describe, expect, it } from "vitest";
import type { Instance } from "@/lib/domain";
import { instanceSchema } from "@/lib/domain";
import { checkLine } from "@/lib/rules";
import { prepareProblem, type AwardProblem } from "@/lib/award/problem";
import { greedyChoices } from "@/lib/award/greedy";
import { bestScores } from "@/lib/award/pricing";
import { loadHighs, type MasterColumn } from "@/lib/award/master";
import { awardValue, improveByNeighbourhoods, type ImproveInput } from "@/lib/award/improve";
import { generatePeriod } from "@/seed/generator/generate-period";

const H = 60;

function instanceOf(seed: number, crew: number, pairings: number, days: number): Instance {
  const instance = generatePeriod({ crew, pairings, days, seed, positions: ["captain"] }).instances[0]!;
  const rules = instance.ruleSet.rules.map((r) => (r.id === "credit-window" ? { ...r, params: { minMinutes: 0, maxMinutes: 50 * H } } : r));
  return instanceSchema.parse({ ...instance, ruleSet: { ...instance.ruleSet, rules }, settings: { ...instance.settings, mode: "balanced" } });
}

async function setUp(seed: number, coverage: boolean) {
  const problem = prepareProblem(instanceOf(seed, 8, 30, 10));
  const { best } = bestScores(problem, 40_000);
  const need = new Map<number, number>();
  problem.need.forEach((d, k) => d > 0 && need.set(k, d));
  const openCost = new Map([...need.keys()].map((k) => [k, problem.pairings[k]!.creditMinutes + 0.01]));
  const start: MasterColumn[] = greedyChoices(problem, 5_000).map((g, i) => ({ crew: i, pairings: g.pairings, reserve: g.reserve, score: g.score }));
  const input: ImproveInput = {
    problem,
    highs: await loadHighs(),
    need,
    openCost,
    coefficient: (col) => (col.reserve || best[col.crew]! <= 0 ? 0 : problem.crew[col.crew]!.weight * Math.min(1, col.score / best[col.crew]!)),
    scoreWeight: (i, yf) => (best[i]! <= 0 ? 0 : (problem.crew[i]!.weight - yf) / best[i]!),
    fullCoefficient: (i) => (best[i]! <= 0 ? 0 : problem.crew[i]!.weight),
    reserve: { min: 0, max: problem.crew.length },
    start,
    deadline: performance.now() + 120_000,
    maxTries: 20,
    stop: () => false,
    ...(coverage ? { coverage: { tieBreak: 1e-4 } } : {}),
  };
  return { problem, input, start };
}

function openTime(problem: AwardProblem, need: ReadonlyMap<number, number>, columns: readonly MasterColumn[]): number {
  const left = new Map(need);
  for (const col of columns) for (const p of col.pairings) left.set(p, left.get(p)! - 1);
  return [...left].reduce((t, [p, open]) => t + open * problem.pairings[p]!.creditMinutes, 0);
}

/** One line per crew member, each legal under lib/rules, and no trip held more often than it needs. */
function expectValidAward(problem: AwardProblem, need: ReadonlyMap<number, number>, columns: readonly MasterColumn[]) {
  expect(columns.map((c) => c.crew)).toEqual(problem.crew.map((_, i) => i));
  const held = new Map<number, number>();
  for (const col of columns) {
    for (const p of col.pairings) held.set(p, (held.get(p) ?? 0) + 1);
    if (col.reserve) continue;
    const c = problem.crew[col.crew]!;
    const items = col.pairings.map((k) => ({ kind: "pairing" as const, pairing: problem.pairings[k]! }));
    const verdict = checkLine(c.crew, problem.instance.ruleSet, items, problem.engine);
    expect(verdict.legal ? [] : verdict.violations.map((v) => v.text)).toEqual([]);
  }
  for (const [p, count] of held) expect(count).toBeLessThanOrEqual(need.get(p)!);
}

describe("improving an award by neighbourhoods", () => {
  it("raises the greedy award's satisfaction without giving up coverage, lines legal", async () => {
    const gains: number[] = [];
    for (const seed of [3, 4, 5]) {
      const { problem, input, start } = await setUp(seed, false);
      const result = improveByNeighbourhoods(input);
      expectValidAward(problem, input.need, result.columns);
      expect(openTime(problem, input.need, result.columns)).toBeLessThanOrEqual(openTime(problem, input.need, start));
      const gain = awardValue(input, result.columns) - awardValue(input, start);
      expect(gain).toBeGreaterThanOrEqual(-1e-9);
      expect(gain).toBeCloseTo(result.gain, 9);
      gains.push(gain);
    }
    // The greedy award has no lookahead: somewhere a swap among a few crew beats it.
    expect(Math.max(...gains)).toBeGreaterThan(0.01);
  }, 120_000);

  it("in coverage mode covers trips the greedy award left open", async () => {
    const reductions: number[] = [];
    for (const seed of [3, 4, 5]) {
      const { problem, input, start } = await setUp(seed, true);
      const result = improveByNeighbourhoods(input);
      expectValidAward(problem, input.need, result.columns);
      const before = openTime(problem, input.need, start);
      const after = openTime(problem, input.need, result.columns);
      expect(after).toBeLessThanOrEqual(before);
      reductions.push(before - after);
    }
    expect(Math.max(...reductions)).toBeGreaterThan(0);
  }, 120_000);

  it("gives the same answer twice (deterministic)", async () => {
    const a = improveByNeighbourhoods((await setUp(4, false)).input);
    const b = improveByNeighbourhoods((await setUp(4, false)).input);
    expect(b.columns).toEqual(a.columns);
  }, 120_000);
});
