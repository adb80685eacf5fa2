/**
 * The greedy award, a baseline with no lookahead: in seniority order, each
 * crew member takes the best-scoring legal line among the trips still open
 * (ties go to the line with more credit, then the earlier trips); a crew
 * member with no legal line holds reserve, and so do the most junior when the
 * settings ask for a reserve minimum. Also the engine's first integer solution.
 */
import type { Instance } from "../domain/index.ts";
import { assembleAward, crewFigures, type Choice } from "./assemble.ts";
import { extendAll, finish, start } from "../rules/index.ts";
import { prepareProblem, scoreLine, type AwardProblem } from "./problem.ts";
import { BEST_LINE_NODES, bestScores, HURRIED_NODES, priceLines } from "./pricing.ts";
import type { AwardResult } from "./solve.ts";

/** A tie-break per credit minute, far below the smallest wish weight that matters (0.8^49 ≈ 2e-5). */
const CREDIT_TIE = 1e-9;

export function greedyChoices(problem: AwardProblem, nodeLimit: number, hurry: () => boolean = () => false): (Choice & { score: number })[] {
  const left = [...problem.need];
  const cost = Float64Array.from(problem.pairings, (p) => -CREDIT_TIE * p.creditMinutes);
  const reserveFrom = reserveFromIndex(problem);
  return problem.crew.map((c, i) => {
    if (i >= reserveFrom) return { reserve: true, pairings: [], score: 0 };
    const size = c.members.length;
    const r = priceLines(problem, c, { scoreWeight: 1, cost, threshold: -Infinity, maxLines: 1, nodeLimit: hurry() ? HURRIED_NODES : nodeLimit, allowed: (k) => left[k]! >= size });
    const line = r.lines[0];
    if (!line) return { reserve: true, pairings: [], score: 0 };
    for (const k of line.pairings) left[k]! -= size;
    return { reserve: false, pairings: line.pairings, score: line.score };
  });
}

/**
 * The first index of the most junior bidders who hold reserve to meet the
 * settings' reserve minimum (counted in crew members: a buddy unit holds two).
 */
export function reserveFromIndex(problem: AwardProblem): number {
  let members = 0;
  let from = problem.crew.length;
  while (from > 0 && members < problem.instance.settings.reserve.min) members += problem.crew[--from]!.members.length;
  return from;
}

/** The greedy award in the engine's result format (no LP: bound and gap are absent). */
export function greedyAward(instance: Instance, options: { nodeLimit?: number } = {}): AwardResult {
  const t0 = performance.now();
  const nodeLimit = options.nodeLimit ?? 20_000;
  const problem = prepareProblem(instance);
  const t1 = performance.now();
  const { best } = bestScores(problem, BEST_LINE_NODES);
  const t2 = performance.now();
  const choices = greedyChoices(problem, nodeLimit / 4);
  const assembled = assembleAward(problem, choices, best);
  const t3 = performance.now();
  return {
    award: assembled.award,
    stats: { times: { prepare: t1 - t0, "best-lines": t2 - t1, greedy: t3 - t2 }, columns: 0, rounds: 0, objective: assembled.weightedSatisfaction },
    report: {
      method: "greedy",
      openCreditMinutes: assembled.openCreditMinutes,
      openPositions: assembled.openPositions,
      coverageLpBound: 0,
      objective: assembled.weightedSatisfaction,
      lpBound: Number.NaN,
      gap: Number.NaN,
      provenOptimal: false,
      illegalPairings: problem.illegal,
      fairnessShortfalls: [],
      ...crewFigures(problem, best),
      warnings: [],
    },
  };
}

/**
 * A coverage-first start for phase 1 (a heuristic, not a baseline): trips in
 * report order, each given to the crew member who can legally add it and holds
 * the least credit so far (ties to seniority); lines the line-level rules refuse
 * at the end (a credit minimum, say) become reserve. Set partitioning's LP is
 * often far from integral, and this first fit is a good incumbent where the
 * trips, not the crew, are scarce.
 */
export function firstFitChoices(problem: AwardProblem): (Choice & { score: number })[] {
  const { ruleSet } = problem.instance;
  const states = problem.crew.map((c) => c.members.map((m) => start(m, ruleSet, problem.engine)));
  const lines: number[][] = problem.crew.map(() => []);
  const credit = problem.crew.map(() => 0);
  const eligible = problem.crew.map((c) => new Set(c.eligible));
  const order = problem.pairings.map((_, k) => k).sort((a, b) => problem.startMs[a]! - problem.startMs[b]! || a - b);
  const reserveFrom = reserveFromIndex(problem);
  for (const k of order) {
    for (let n = 0; n < problem.need[k]!; ) {
      const left = problem.need[k]! - n;
      const candidates = problem.crew
        .map((_, i) => i)
        .filter((i) => i < reserveFrom && problem.crew[i]!.members.length <= left && eligible[i]!.has(k) && credit[i]! + problem.pairings[k]!.creditMinutes <= problem.maxCreditMinutes)
        .sort((a, b) => credit[a]! - credit[b]! || a - b);
      let filled = 0;
      for (const i of candidates) {
        if (lines[i]!.includes(k)) continue;
        const item = { kind: "pairing" as const, pairing: problem.pairings[k]! };
        const r = states[i]!.map((state) => extendAll(state, item));
        if (r.some((one) => one.violations.length)) continue;
        states[i] = r.map((one) => one.state);
        lines[i]!.push(k);
        credit[i]! += problem.pairings[k]!.creditMinutes;
        filled = problem.crew[i]!.members.length;
        break;
      }
      if (filled === 0) break; // no one can take another position of this trip
      n += filled;
    }
  }
  return problem.crew.map((c, i) => {
    if (lines[i]!.length === 0 || !states[i]!.every((state) => finish(state).legal)) return { reserve: true, pairings: [], score: 0 };
    return { reserve: false, pairings: lines[i]!, score: scoreLine(problem, c, lines[i]!) };
  });
}
