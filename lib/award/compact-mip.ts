/**
 * The compact MIP: the textbook baseline the column-generation engine
 * (solve.ts) is measured against. One HiGHS MIP, maximised, with per crew i:
 *
 *     x_ip ∈ {0,1} per eligible pairing p, r_i ∈ {0,1} reserve
 *     Σ_p x_ip + M r_i ≤ M                        reserve holds no pairings (M = |eligible_i|)
 *     x_ia + x_ib ≤ 1                             a before b and b not among a's successors
 *     min (1 − r_i) ≤ Σ_p c_p x_ip ≤ max          credit window
 *     z_id ≥ x_ip (p touches date d), Σ_d∈period z_id ≤ maxWorkedDays
 *
 * and per pairing Σ_i x_ip + u_p = d_p, u_p ≥ 0, and min ≤ Σ_i r_i ≤ max.
 *
 * Objective, lexicographic by weighting: −K Σ_p ((1 + P) c_p + 1) u_p (open
 * credit minutes, ties by open positions; P = Σ_p d_p, K = 1 + the largest
 * value the wish part can take, so one open minute outweighs every wish) plus
 * Σ_i W_i (B (1 − r_i) + Σ_r rankDecay^r y_ir) / best_i, with y_ir ≤ 1 − r_i and
 * - trip: y ≤ Σ_selected x / count, y ≤ 1 (exact);
 * - no-trip: y ≤ 1 − x_p for each selected p (exact);
 * - free-days: y ≤ 1 − Σ_named d z_d / |named| (exact: dates no eligible trip touches are free);
 * - credit: y ≤ credit/min and y ≤ 1; above the maximum, the chord
 *   y ≤ 1 − (credit − max)/C̄ of max/credit on [max, C̄] (C̄ the most credit a line can hold);
 * - rhythm and buddy are left out of the model: they count as met (an
 *   optimistic constant), since neither is linear in x without many more rows.
 * So the wish part never understates a line's score, and the rows above are
 * necessary for legality (the pairwise rules only get easier as the gap
 * grows), which makes the model a relaxation and its dual bound honest.
 *
 * The model only approximates legality: every line is re-checked with
 * checkCrewLine and, when illegal, loses pairings from the end until legal, or
 * becomes reserve; every line is then scored exactly by assembleAward.
 */
import type { Highs, ModelData } from "highs";
import type { Instance, Stats, TripSelection } from "../domain/index.ts";
import { AppError, matchesTripSelection, pairingDates } from "../domain/index.ts";
import { assembleAward, crewFigures, type Choice } from "./assemble.ts";
import { greedyChoices } from "./greedy.ts";
import { loadHighs } from "./master.ts";
import { checkCrewLine, prepareProblem, successorPositions, type AwardProblem } from "./problem.ts";
import { BEST_LINE_NODES, bestScores } from "./pricing.ts";
import type { AwardResult, AwardReport } from "./solve.ts";

export interface CompactMipOptions {
  /** HiGHS time limit (default: settings.timeLimitSeconds), counted from the call */
  timeLimitSeconds?: number;
  /** polled inside HiGHS; true stops the solve with the incumbent */
  shouldStop?: () => boolean;
}

type Terms = readonly (readonly [col: number, coefficient: number])[];

/** A MIP in row form, built column by column and row by row. */
class Mip {
  readonly cols: { cost: number; lower: number; upper: number; integer: boolean }[] = [];
  readonly rows: { lower: number; upper: number; terms: Terms }[] = [];
  col(cost: number, lower: number, upper: number, integer = false): number {
    return this.cols.push({ cost, lower, upper, integer }) - 1;
  }
  row(lower: number, upper: number, terms: Terms): void {
    this.rows.push({ lower, upper, terms });
  }
  data(sense: ModelData["sense"]): ModelData {
    const { cols, rows } = this;
    const starts = [0];
    for (const r of rows) starts.push(starts.at(-1)! + r.terms.length);
    const matrix = { format: "csr" as const, numRows: rows.length, numCols: cols.length, starts };
    return {
      numCols: cols.length, numRows: rows.length, sense,
      colCost: cols.map((c) => c.cost), colLower: cols.map((c) => c.lower), colUpper: cols.map((c) => c.upper),
      rowLower: rows.map((r) => r.lower), rowUpper: rows.map((r) => r.upper),
      matrix: { ...matrix, indices: rows.flatMap((r) => r.terms.map((t) => t[0])), values: rows.flatMap((r) => r.terms.map((t) => t[1])) },
      integrality: cols.map((c) => (c.integer ? 1 : 0)),
    };
  }
}

/** The compact model of one award group, with the parts each objective is made of. */
interface CompactModel {
  m: Mip;
  /** K: one unit of coverage cost outweighs every wish (the balanced objective's weighting) */
  K: number;
  /** P = Σ_p d_p: open credit minutes first, ties by open positions */
  P: number;
  /** the balanced objective's constants, kept out of HiGHS */
  offset: number;
  noLineWeight: number;
  reserveCols: number[];
  xCols: number[][];
  /** the coverage cost Σ (1 + P) c_p u_p + u_p, as terms */
  coverTerms: [number, number][];
  /**
   * per crew member, their score in the model: lineBase_i + Σ terms (the
   * reserve column carries −lineBase_i, each wish column its rank weight);
   * empty terms when they have no legal line (best_i ≤ 0)
   */
  scoreTerms: [number, number][][];
  lineBase: number[];
}

function buildCompactModel(problem: AwardProblem, best: readonly number[], provenNoLine: readonly boolean[]): CompactModel {
  const { pairings, need, crew } = problem;
  const { settings } = problem.instance;
  const { zone, periodStart, periodEnd } = problem.score;
  const P = need.reduce((t, d) => t + d, 0);
  const scale = crew.map((c, i) => (best[i]! > 0 ? c.weight / best[i]! : 0));
  const K = 1 + crew.reduce((t, c, i) => t + scale[i]! * c.weighted.reduce((s, { weight }) => s + weight, c.baseValue), 0);
  const noLineWeight = crew.reduce((t, c, i) => t + (best[i]! <= 0 ? c.weight : 0), 0);
  let offset = noLineWeight;

  const m = new Mip();
  const coverTerms: [number, number][] = [];
  const cover = pairings.map((p, k) => {
    const u = m.col(-K * ((1 + P) * p.creditMinutes + 1), 0, need[k]!);
    coverTerms.push([u, (1 + P) * p.creditMinutes + 1]);
    return [[u, 1] as [number, number]];
  });
  const dates = pairings.map((p) => pairingDates(p, zone));
  const inPeriod = (d: string) => d >= periodStart && d <= periodEnd;
  const reserveCols: number[] = [];
  const xCols: number[][] = [];
  const scoreTerms: [number, number][][] = [];
  const lineBase: number[] = [];
  crew.forEach((c, i) => {
    const w = scale[i]!;
    // (A buddy unit's members' buddy wishes are met by any line they share.)
    const buddyMet = c.members.length > 1 ? 1 : 0;
    const base = c.weighted.reduce((t, { wish, weight }) => t + (wish.kind === "rhythm" ? 1 : wish.kind === "buddy" ? buddyMet : 0) * weight, c.baseValue);
    lineBase.push(base);
    offset += w * base;
    const r = m.col(-w * base, provenNoLine[i] ? 1 : 0, 1, true);
    reserveCols.push(r);
    const terms: [number, number][] = w === 0 ? [] : [[r, -base]];
    scoreTerms.push(terms);
    const x = c.eligible.map((k) => {
      const col = m.col(0, 0, 1, true);
      cover[k]!.push([col, c.members.length]);
      return col;
    });
    xCols.push(x);
    const M = x.length;
    if (M > 0) m.row(-Infinity, M, [...x.map((col) => [col, 1] as const), [r, M]]);
    c.eligible.forEach((_, a) => {
      const follows = new Set(successorPositions(problem, c, a));
      for (let b = a + 1; b < M; b++) if (!follows.has(b)) m.row(-Infinity, 1, [[x[a]!, 1], [x[b]!, 1]]);
    });
    const credit = x.map((col, j) => [col, pairings[c.eligible[j]!]!.creditMinutes] as const);
    if (problem.minCreditMinutes > 0) m.row(problem.minCreditMinutes, Infinity, [...credit, [r, problem.minCreditMinutes]]);
    if (M > 0 && Number.isFinite(problem.maxCreditMinutes)) m.row(-Infinity, problem.maxCreditMinutes, credit);
    const creditCap = Math.min(problem.maxCreditMinutes, credit.reduce((t, [, a]) => t + a, 0));
    // Date variables z_d ≥ x_p, made when a row needs them.
    const touching = new Map<string, number[]>();
    c.eligible.forEach((k, j) => dates[k]!.forEach((d) => touching.set(d, [...(touching.get(d) ?? []), j])));
    const dayCol = new Map<string, number>();
    const day = (d: string) => {
      let col = dayCol.get(d);
      if (col === undefined) {
        dayCol.set(d, (col = m.col(0, 0, 1)));
        for (const j of touching.get(d)!) m.row(0, Infinity, [[col, 1], [x[j]!, -1]]);
      }
      return col;
    };
    const periodDates = [...touching.keys()].filter(inPeriod);
    if (periodDates.length > c.maxWorkedDays) m.row(-Infinity, c.maxWorkedDays, periodDates.map((d) => [day(d), 1] as const));
    c.weighted.forEach(({ wish, weight }) => {
      if (wish.kind === "rhythm" || wish.kind === "buddy" || w === 0) return;
      const y = m.col(w * weight, 0, 1);
      terms.push([y, weight]);
      m.row(-Infinity, 1, [[y, 1], [r, 1]]);
      const selected = (sel: TripSelection) => x.filter((_, j) => matchesTripSelection(sel, pairings[c.eligible[j]!]!, zone));
      switch (wish.kind) {
        case "trip":
          m.row(-Infinity, 0, [[y, 1], ...selected(wish).map((col) => [col, -1 / wish.count] as const)]);
          break;
        case "no-trip":
          for (const col of selected(wish)) m.row(-Infinity, 1, [[y, 1], [col, 1]]);
          break;
        case "free-days": {
          const named = wish.dates.filter((d) => touching.has(d));
          if (named.length) m.row(-Infinity, 1, [[y, 1], ...named.map((d) => [day(d), 1 / wish.dates.length] as const)]);
          break;
        }
        case "credit":
          if (wish.minMinutes) m.row(-Infinity, 0, [[y, 1], ...credit.map(([col, a]) => [col, -a / wish.minMinutes!] as const)]);
          if (wish.maxMinutes !== undefined && creditCap > wish.maxMinutes) {
            m.row(-Infinity, 1 + wish.maxMinutes / creditCap, [[y, 1], ...credit.map(([col, a]) => [col, a / creditCap] as const)]);
          }
          break;
      }
    });
  });
  cover.forEach((terms, k) => m.row(need[k]!, need[k]!, terms));
  // Reserve lines count crew members: a buddy unit's reserve line is two.
  const members = crew.reduce((t, c) => t + c.members.length, 0);
  const noLine = crew.reduce((t, c, i) => t + (best[i]! <= 0 ? c.members.length : 0), 0);
  const reserveMax = Math.max(noLine, settings.reserve.max ?? members);
  if (settings.reserve.min > 0 || reserveMax < members) m.row(settings.reserve.min, reserveMax, reserveCols.map((col, i) => [col, crew[i]!.members.length] as const));
  return { m, K, P, offset, noLineWeight, reserveCols, xCols, coverTerms, scoreTerms, lineBase };
}

/** The group prepared, each crew member's best line alone, and the compact model, with the times of each. */
function prepareCompact(instance: Instance) {
  const t0 = performance.now();
  const problem = prepareProblem(instance);
  const t1 = performance.now();
  const alone = bestScores(problem, BEST_LINE_NODES);
  const best = alone.best;
  const t2 = performance.now();
  // Reserve is fixed where no line is legal, proven by an exhausted search.
  const provenNoLine = problem.crew.map((c, i) => best[i]! <= 0 && (alone.exhausted[i] || c.eligible.length === 0));
  return { t0, t1, t2, problem, best, compact: buildCompactModel(problem, best, provenNoLine) };
}

/** A HiGHS model status as the stats' stoppedBy (undefined: something else, reported as a warning). */
function stoppedBy(highs: Highs, code: number): Stats["stoppedBy"] | undefined {
  const codes = highs.constants.modelStatus;
  return code === codes.optimal ? "optimal" : code === codes.timeLimit ? "time-limit" : code === codes.interrupted ? "cancelled" : undefined;
}

/** The award's lines from a model solution, cut back to legal (or made reserve) where the model's approximation let an illegal line through. */
function linesFromSolution(problem: AwardProblem, model: CompactModel, sol: Float64Array | undefined, warnings: string[]): { choices: Choice[]; repaired: number } {
  if (!sol) {
    warnings.push("HiGHS found no integer solution; the greedy award is returned");
    return { choices: greedyChoices(problem, 20_000), repaired: 0 };
  }
  let repaired = 0;
  const choices = problem.crew.map((c, i): Choice => {
    if (sol[model.reserveCols[i]!]! > 0.5) return { reserve: true, pairings: [] };
    const line = c.eligible.filter((_, j) => sol[model.xCols[i]![j]!]! > 0.5); // already by report time
    const before = line.length;
    while (line.length && !checkCrewLine(problem, c, line).legal) line.pop();
    const legal = line.length > 0 || checkCrewLine(problem, c, []).legal;
    if (line.length < before || !legal) repaired++;
    return legal ? { reserve: false, pairings: line } : { reserve: true, pairings: [] };
  });
  if (repaired) warnings.push(`${repaired} lines of the compact model were illegal and were cut back or made reserve`);
  return { choices, repaired };
}

export async function compactMipAward(instance: Instance, options: CompactMipOptions = {}): Promise<AwardResult> {
  const { settings } = instance;
  if (settings.mode !== "balanced") throw new AppError("invalid", `settings.mode is "${settings.mode}"; compactMipAward awards in "balanced" mode (compactStrictAward: strict seniority)`);
  const limitSeconds = options.timeLimitSeconds ?? settings.timeLimitSeconds;
  const { t0, t1, t2, problem, best, compact } = prepareCompact(instance);
  const { crew } = problem;
  const warnings: string[] = [];
  const { K, P, offset, noLineWeight } = compact;

  // Solve.
  const highs = await loadHighs();
  const model = highs.createModel();
  let status: Stats["stoppedBy"];
  let dualBound = Number.NaN;
  let x: Float64Array | undefined;
  try {
    model.passModel(compact.m.data(highs.constants.objectiveSense.maximize));
    const seconds = Math.max(0.01, limitSeconds - (performance.now() - t0) / 1000);
    model.options.set({ output_flag: false, random_seed: settings.seed ?? 0, time_limit: seconds, mip_rel_gap: 0, mip_abs_gap: 1e-7 });
    const result = model.run({ [highs.constants.callbackType.mipInterrupt]: (e: { interrupt(): void }) => void (options.shouldStop?.() && e.interrupt()) });
    status = stoppedBy(highs, result.modelStatus);
    if (!status) warnings.push(`HiGHS ended with model status ${result.modelStatus}`);
    dualBound = Number(model.info.get("mip_dual_bound"));
    if (Number(model.info.get("primal_solution_status")) === highs.constants.solutionStatus.feasible) x = model.getSolution().colValue;
  } finally {
    model.dispose();
  }
  const t3 = performance.now();

  // Lines: from the MIP, made legal; the greedy award when HiGHS found no solution.
  const { choices, repaired } = linesFromSolution(problem, compact, x, warnings);
  const assembled = assembleAward(problem, choices, best);
  const objective = assembled.weightedSatisfaction;

  // The bound. D (HiGHS's dual bound plus the constants kept out of HiGHS) is ≥ −K·cov + wishes
  // + C0 for every model solution, wishes ≥ 0, and every legal award is one (a relaxation): so
  // every legal award has cov ≥ minCov = ⌈(C0 − D)/K⌉, and one of coverage cost cov has weighted
  // satisfaction ≤ D + K·cov. That is the engine's lpBound (a bound at the optimal coverage)
  // only when this award's coverage is proven optimal (cov = minCov); otherwise NaN.
  const D = dualBound + offset;
  const cov = (1 + P) * assembled.openCreditMinutes + assembled.openPositions;
  const minCov = Number.isFinite(D) ? Math.max(0, Math.ceil((noLineWeight - D) / K - 1e-6)) : 0;
  const raw = D + K * cov;
  const why =
    settings.fairnessFloor !== undefined ? "the compact baseline ignores the fairness floor"
    : !Number.isFinite(D) ? "HiGHS gave no dual bound"
    : cov > minCov ? `the award's coverage is not proven optimal (open credit ≥ ${Math.floor(minCov / (1 + P))} min is all that is proven${repaired ? ", and the repair cut lines" : ""})`
    : raw < objective - 1e-6 - 1e-9 * K * cov ? "the MIP bound is below the award: the model was not a relaxation here"
    : undefined;
  if (why) warnings.push(`lpBound is NaN (not comparable): ${why}`);
  const lpBound = why ? Number.NaN : Math.min(crew.reduce((t, c) => t + c.weight, 0), Math.max(objective, raw));
  const gap = why ? Number.NaN : (lpBound - objective) / Math.max(1, Math.abs(lpBound));
  const stats: Stats = {
    times: { prepare: t1 - t0, "best-lines": t2 - t1, "compact-mip": t3 - t2, assemble: performance.now() - t3 },
    columns: 0,
    rounds: 0,
    ...(Number.isNaN(gap) ? {} : { gap, lpBound }),
    objective,
    stoppedBy: status,
  };
  return {
    award: assembled.award,
    stats,
    report: {
      method: "compact-mip",
      openCreditMinutes: assembled.openCreditMinutes,
      openPositions: assembled.openPositions,
      coverageLpBound: Math.floor(minCov / (1 + P)),
      objective,
      lpBound,
      gap,
      provenOptimal: status === "optimal" && gap <= 1e-7,
      illegalPairings: problem.illegal,
      fairnessShortfalls: [],
      ...crewFigures(problem, best),
      warnings,
    },
  };
}

/** How far the stacked objectives of compactStrictAward got. */
export interface StackedProgress {
  /** crew members (with a legal line) whose step ended proven optimal in the model, in seniority order */
  settled: number;
  /** crew members with a legal line: the steps after coverage */
  steps: number;
  /** the coverage step ended proven optimal */
  coverage: boolean;
  /** why the stacking stopped short, when it did */
  stoppedAt?: string;
}

/**
 * Strict seniority with the compact model and stacked objectives: the
 * textbook way, and the baseline strict mode of the engine (solve.ts) is
 * measured against. The same model as compactMipAward; first its coverage
 * cost is minimised and kept as a row (≤ the optimum); then, in seniority
 * order, each crew member's model score is maximised and kept as a floor
 * (≥ the optimum − 1e-6), every solve starting from the last one's solution.
 * The lines are then made legal and scored exactly as compactMipAward's.
 *
 * A step that ends at the time limit keeps its incumbent and ends the
 * stacking: `progress` says how far it got. The model is a relaxation
 * (rhythm and buddy wishes count as met, legality is approximated), so its
 * lexicographic optimum can differ from the engine's: a comparison counts
 * only instances where both reach the same scores.
 */
export async function compactStrictAward(instance: Instance, options: CompactMipOptions = {}): Promise<AwardResult & { progress: StackedProgress }> {
  const { settings } = instance;
  if (settings.mode !== "strict") throw new AppError("invalid", `settings.mode is "${settings.mode}"; compactStrictAward awards in "strict" mode`);
  const limitSeconds = options.timeLimitSeconds ?? settings.timeLimitSeconds;
  const { t0, t1, t2, problem, best, compact } = prepareCompact(instance);
  const { crew } = problem;
  const warnings: string[] = [];
  const numCols = compact.m.cols.length;
  const steps = crew.map((_, i) => i).filter((i) => compact.scoreTerms[i]!.length > 0);
  const progress: StackedProgress = { settled: 0, steps: steps.length, coverage: false };

  const highs = await loadHighs();
  const model = highs.createModel();
  let x: Float64Array | undefined;
  let status: Stats["stoppedBy"] = "optimal";
  try {
    model.passModel(compact.m.data(highs.constants.objectiveSense.maximize));
    model.options.set({ output_flag: false, random_seed: settings.seed ?? 0, mip_rel_gap: 0, mip_abs_gap: 1e-7 });
    /** Maximises Σ terms; the objective value, or undefined when the step did not end proven optimal. */
    const step = (terms: readonly (readonly [number, number])[], name: string): number | undefined => {
      const cost = new Float64Array(numCols);
      for (const [col, a] of terms) cost[col] = cost[col]! + a;
      model.changeColsCost({ kind: "range", from: 0, to: numCols - 1 }, cost);
      if (x) model.setSolution({ colValue: x });
      const seconds = limitSeconds - (performance.now() - t0) / 1000;
      if (seconds <= 0) {
        progress.stoppedAt = `the time limit, before ${name}`;
        status = "time-limit";
        return undefined;
      }
      model.options.set({ time_limit: seconds });
      const result = model.run({ [highs.constants.callbackType.mipInterrupt]: (e: { interrupt(): void }) => void (options.shouldStop?.() && e.interrupt()) });
      if (Number(model.info.get("primal_solution_status")) === highs.constants.solutionStatus.feasible) x = model.getSolution().colValue;
      const ended = stoppedBy(highs, result.modelStatus);
      if (ended === "optimal") return model.getObjectiveValue();
      status = ended;
      progress.stoppedAt = `${ended ?? `HiGHS model status ${result.modelStatus}`}, in ${name}`;
      return undefined;
    };
    const coverage = step(compact.coverTerms.map(([col, a]) => [col, -a] as const), "the coverage step");
    if (coverage !== undefined) {
      progress.coverage = true;
      // Coverage costs are integers: keep the optimum, with room for HiGHS's tolerances.
      model.addRow(-Infinity, -coverage + 0.5, { indices: Int32Array.from(compact.coverTerms.map(([col]) => col)), values: Float64Array.from(compact.coverTerms.map(([, a]) => a)) });
      for (const i of steps) {
        const terms = compact.scoreTerms[i]!;
        const score = step(terms, `the step of seniority ${crew[i]!.crew.seniority}`);
        if (score === undefined) break;
        model.addRow(score - FLOOR_MARGIN, Infinity, { indices: Int32Array.from(terms.map(([col]) => col)), values: Float64Array.from(terms.map(([, a]) => a)) });
        progress.settled++;
      }
    }
  } finally {
    model.dispose();
  }
  const t3 = performance.now();
  if (progress.stoppedAt) warnings.push(`the stacked objectives stopped at ${progress.stoppedAt}: ${progress.settled} of ${progress.steps} crew members settled`);
  const { choices } = linesFromSolution(problem, compact, x, warnings);
  const assembled = assembleAward(problem, choices, best);
  const report: AwardReport = {
    method: "compact-strict",
    openCreditMinutes: assembled.openCreditMinutes,
    openPositions: assembled.openPositions,
    coverageLpBound: Number.NaN,
    objective: assembled.weightedSatisfaction,
    lpBound: Number.NaN,
    gap: Number.NaN,
    provenOptimal: false, // a relaxation's optimum: proven for the model only
    illegalPairings: problem.illegal,
    fairnessShortfalls: [],
    ...crewFigures(problem, best),
    warnings,
  };
  const stats: Stats = {
    times: { prepare: t1 - t0, "best-lines": t2 - t1, "compact-strict": t3 - t2, assemble: performance.now() - t3 },
    columns: 0,
    rounds: progress.settled,
    objective: assembled.weightedSatisfaction,
    stoppedBy: status,
  };
  return { award: assembled.award, stats, report, progress };
}

/** The margin of each stacked floor: the engine's FLOOR_MARGIN (solve.ts), so both keep the same scores. */
const FLOOR_MARGIN = 1e-6;
