/**
 * The award engine: instance in, award out, in weighted balance or in strict
 * seniority (settings.mode).
 *
 * 1. prepare — eligibility and networks (problem.ts), each crew member's best
 *    line alone (best_i, for satisfaction), and the greedy award as a first
 *    integer solution;
 * 2. coverage — column generation on the master LP with objective −Σ c_p u_p
 *    (open credit minutes, ties by open positions), then an integer solve on the
 *    generated lines → U*;
 * 3. wishes — the master keeps Σ c_p u_p ≤ U* and maximises
 *    Σ_i W_i · s_iℓ/best_i (less a penalty on fairness-floor slack); column
 *    generation again, then the integer solve;
 * 4. closing the gap — when the integer solution falls short of the bound
 *    L(y) by g, every line whose value at y is within g of its crew member's
 *    term in L(y) is generated (no other line can be part of a better integer
 *    solution) and the integer solve repeated: when that enumeration
 *    completes, the award is optimal.
 *
 * Strict seniority replaces steps 3 and 4 with one step per crew member in
 * seniority order (strictSteps below; DEVELOPERS.md, "Strict seniority").
 *
 * The LP bound reported is the best Lagrangian bound L(y) of the pricing
 * rounds (Master.lagrangianBound: valid at any duals, even when pricing
 * stopped at its node limit), or the LP optimum when pricing is exhausted at
 * the LP's duals.
 * Deterministic: pricing and HiGHS both run in a fixed order with fixed seeds.
 */
import type { Instance, Stats } from "../domain/index.ts";
import { AppError } from "../domain/index.ts";
import { assembleAward, crewFigures, type Assembled, type Choice } from "./assemble.ts";
import { firstFitChoices, greedyChoices } from "./greedy.ts";
import { loadHighs, Master, type MasterColumn, type SolveOutcome } from "./master.ts";
import { checkCrewLine, prepareProblem, scoreLine, type AwardProblem } from "./problem.ts";
import { BEST_LINE_NODES, bestScores, priceLines } from "./pricing.ts";
import { improveByNeighbourhoods } from "./improve.ts";
import { compactMipAward, compactStrictAward } from "./compact-mip.ts";

export type AwardPhase = "prepare" | "coverage" | "wishes" | "integer" | "done";

export interface Progress {
  phase: AwardPhase;
  /** of the whole run, 0–100 */
  percent: number;
  message: string;
}

export interface AwardOptions {
  onProgress?: (progress: Progress) => void;
  /** polled between pricing calls and inside HiGHS; true cancels the run */
  shouldStop?: () => boolean;
  /** search nodes per pricing call (default 20,000) */
  nodeLimit?: number;
  /** search nodes of the quick pricing tried first in each round (default 1,000) */
  quickNodeLimit?: number;
  /** lines added per crew member and round (default 3) */
  linesPerRound?: number;
  /** lines enumerated per crew member when closing the gap (default 400) */
  closingLines?: number;
}

export interface AwardReport {
  method: "column-generation" | "greedy" | "compact-mip" | "compact-strict";
  openCreditMinutes: number;
  openPositions: number;
  /** phase 1's LP bound on open credit (minutes; a lower bound) */
  coverageLpBound: number;
  /** Σ W_i · satisfaction_i of the award, less the fairness penalty */
  objective: number;
  /** upper bound on `objective` over every award with the same coverage */
  lpBound: number;
  /** (lpBound − objective) / max(1, |lpBound|) */
  gap: number;
  /** the integer solve is proven optimal over all legal lines (strict: every step proven) */
  provenOptimal: boolean;
  /** strict seniority: how many steps each kind of certificate settled */
  strictSteps?: Partial<Record<StrictCertificate["method"], number>>;
  /** neighbourhoods re-solved after each phase's integer solve (improve.ts), and how many improved the award */
  neighbourhoods?: Record<"coverage" | "wishes", { tried: number; improved: number }>;
  illegalPairings: { pairingId: string; text: string }[];
  /** crew whose satisfaction fell below the fairness floor, and by how much */
  fairnessShortfalls: { crewId: string; shortfall: number }[];
  /** best_i per crew id (0: no legal line-holder line) */
  best: Record<string, number>;
  /** W_i per crew id */
  weights: Record<string, number>;
  warnings: string[];
  /**
   * the duals of the last master LP of phase 2, for audits (reduced profit =
   * coefficient·score − crew − Σ pairings); absent when phase 2 had nothing to
   * do because everyone held their best line
   */
  finalDuals?: { crew: Record<string, number>; pairings: Record<string, number>; scoreCoefficient: Record<string, number> };
}

/**
 * Strict seniority: why crew member k's score S*_k is the best possible given
 * the coverage and every more senior crew member's settled score, stored on
 * their awarded line (`certificate`). `bound` ≥ `score` bounds every award
 * that keeps the coverage and the seniors' floors:
 * - "no-legal-line": no line-holder line is legal for them (score 0);
 * - "best-alone": `bound` is their best line with every pairing free
 *   (an exhausted search), and `score` reaches it;
 * - "reserve-minimum": with only their lines scoring above `score`, too few
 *   crew could hold reserve for the group's minimum (the LP is infeasible);
 * - "coverage": with only their lines scoring above `score`, the master LP
 *   over every line of everyone (column generation; a Lagrangian bound, valid
 *   at any duals) leaves at least `openAbove` open, more than the coverage
 *   kept — so no award gives them more (`bound` = `score`);
 * - "enumeration": the same, proven by the integer solve over every line that
 *   could keep the coverage (gap closing) where the LP alone could not;
 * - "unproven": a limit stopped the step; `bound` is their best line alone
 *   (null when that search was not exhaustive).
 * `step` is the crew member's place in the sequence (1 = most senior).
 */
export interface StrictCertificate {
  step: number;
  method: "no-legal-line" | "best-alone" | "reserve-minimum" | "coverage" | "enumeration" | "unproven";
  score: number;
  /** null: unknown (the best line alone was not proven) */
  bound: number | null;
  /** "coverage" and "enumeration": the least open time (credit minutes and a share per position) of any award giving them more */
  openAbove?: number;
  /**
   * A buddy unit's step (both members carry it): the crew ids of its members, senior first; `score`
   * and `bound` are then of the unit's score, the sum of both members' scores of the shared line
   */
  unit?: string[];
}

const countSteps = (certificates: readonly StrictCertificate[]) => {
  const counts: Partial<Record<StrictCertificate["method"], number>> = {};
  for (const c of certificates) counts[c.method] = (counts[c.method] ?? 0) + 1;
  return counts;
};

export interface AwardResult {
  award: Assembled["award"];
  stats: Stats;
  report: AwardReport;
}

const TOL = 1e-7;
/** groups up to this many crew × pairings are also solved with the compact model, for up to COMPACT_SECONDS */
const COMPACT_SIZE = 3_000;
const COMPACT_SECONDS = 30;
/** a last round of pricing, before column generation gives up on proving the LP optimum, searches this many times deeper */
const DEEPER = 10;
/** Wentges smoothing weight of the dual centre */
const SMOOTHING = 0.5;
/** LP penalty per unit of over-cover, in units of the pairing's own open-time cost (phase 1) */
const SURPLUS = 2;
/** per unit of satisfaction below the floor, in units of W (large against any W_i) */
const FAIRNESS_PENALTY = 100;
/**
 * Strict seniority: a settled crew member's floor is S*_i − FLOOR_MARGIN, so that
 * HiGHS's tolerances never make a later step infeasible; scores are sums of
 * wish weights 0.8^r (DESIGN.md), and lines whose scores differ by less than
 * this are taken as equally good.
 */
const FLOOR_MARGIN = 1e-6;
/** a strict step may use up to this many times its even share of the time left */
const STEP_SHARE = 3;
/** open time (in credit minutes) a strict probe's bound must exceed U* by to prove anything: far below one minute */
const COVERAGE_TOL = 1e-3;
/** a strict step's score reaches a bound within this (the floors' margin with room for HiGHS's tolerances) */
const SCORE_TOL = 2 * FLOOR_MARGIN;

class Clock {
  readonly times: Record<string, number> = {};
  private t0 = performance.now();
  constructor(private limitMs: number) {}
  /** From now on, shares are of the time left (what preparing took is not shared out again). */
  rebase(): void {
    const now = performance.now();
    this.limitMs = Math.max(0, this.limitMs - (now - this.t0));
    this.t0 = now;
  }
  phase<T>(name: string, run: () => T): T {
    const start = performance.now();
    try {
      return run();
    } finally {
      this.times[name] = (this.times[name] ?? 0) + (performance.now() - start);
    }
  }
  /** the share of the time limit that will have gone `seconds` from now */
  shareAfter(seconds: number): number {
    return this.limitMs > 0 ? (performance.now() - this.t0 + seconds * 1000) / this.limitMs : 1;
  }
  /** seconds left before `share` of the time limit has gone (1: the whole limit) */
  remainingSeconds(share = 1): number {
    return Math.max(0, (this.limitMs * share - (performance.now() - this.t0)) / 1000);
  }
  expired(share = 1): boolean {
    return this.remainingSeconds(share) <= 0;
  }
}

export async function solveAward(instance: Instance, options: AwardOptions = {}): Promise<AwardResult> {
  const settings = instance.settings;
  const strict = settings.mode === "strict";
  const clock = new Clock(settings.timeLimitSeconds * 1000);
  const nodeLimit = options.nodeLimit ?? 20_000;
  const quickNodes = Math.min(nodeLimit, options.quickNodeLimit ?? 1_000);
  const linesPerRound = options.linesPerRound ?? 3;
  const roundLimit = settings.iterationLimit ?? Infinity;
  const warnings: string[] = [];
  const cancelled = () => options.shouldStop?.() === true;
  // Shares of the time left once the first solutions stand (clock.rebase):
  // column generation for coverage until 15 %, its integer solve until 20 %,
  // covering by neighbourhoods until 40 %; for wishes until 50 %, the final
  // integer solve until 55 %, improving it by neighbourhoods the rest.
  // (Measured on generated L: a pricing round of column generation takes
  // seconds there, while neighbourhoods cover and improve the most per second.)
  let share = 0.15;
  const stop = () => cancelled() || clock.expired(share);
  const progress = (phase: AwardPhase, percent: number, message: string) => options.onProgress?.({ phase, percent, message });
  let stoppedBy: Stats["stoppedBy"] = "optimal";
  const noteStop = () => {
    if (cancelled()) stoppedBy = "cancelled";
    else if (clock.expired(share)) stoppedBy = "time-limit";
  };

  progress("prepare", 0, "Reading the instance and building each crew member's network");
  const problem = clock.phase("prepare", () => prepareProblem(instance));
  const n = problem.crew.length;
  progress("prepare", 5, "Finding each crew member's best line alone");
  // Best lines alone and the greedy award may take up to 10 % and 15 % of the time; then they hurry.
  const alone = clock.phase("best-lines", () => bestScores(problem, BEST_LINE_NODES, () => clock.expired(0.1)));
  const best = alone.best;
  if (alone.exhausted.some((e) => !e)) {
    warnings.push(`best line alone not proven for ${alone.exhausted.filter((e) => !e).length} crew (search limit); satisfaction is measured against the best line found`);
  }
  const greedy = clock.phase("greedy", () => greedyChoices(problem, nodeLimit / 4, () => clock.expired(0.15)));
  if (cancelled()) throw new AppError("conflict", "the award run was cancelled");
  // The shares below are of the time left once the first solutions stand.
  clock.rebase();

  const highs = await loadHighs();
  const need = new Map<number, number>();
  problem.need.forEach((d, k) => {
    if (d > 0 && !problem.illegal.some((x) => x.pairingId === problem.pairings[k]!.id)) need.set(k, d);
  });
  const totalPositions = [...need.values()].reduce((t, d) => t + d, 0);
  const openCost = new Map([...need.keys()].map((k) => [k, problem.pairings[k]!.creditMinutes + 1 / (1 + totalPositions)]));
  // Reserve lines count crew members (a buddy unit holding reserve holds two).
  const sizes = problem.crew.map((c) => c.members.length);
  const members = sizes.reduce((t, x) => t + x, 0);
  const noLine = best.reduce((t, b, i) => t + (b <= 0 ? sizes[i]! : 0), 0);
  const { min: reserveMin, max: reserveMaxSetting } = settings.reserve;
  let reserveMax = reserveMaxSetting ?? members;
  if (noLine > reserveMax) {
    warnings.push(`${noLine} crew have no legal line, more than the reserve maximum ${reserveMax}: they hold reserve anyway`);
    reserveMax = noLine;
  }
  const master = new Master(highs, n, need, { min: reserveMin, max: reserveMax }, sizes);
  try {
    // Phase 1 values a line at tieBreak × its phase-2 value: integer coverage
    // values differ by at least δ = 1/(1 + positions) minutes (credit is whole
    // minutes, δ per open position), and Σ_i W_i · tieBreak < δ/2, so the
    // coverage optimum is unchanged while ties among equally covering awards go
    // to wishes — which also breaks the symmetry of crew with equal networks.
    const totalWeight = problem.crew.reduce((t, c) => t + c.weight, 0);
    const tieBreak = 0.5 / (1 + totalPositions) / Math.max(1, totalWeight);
    // Phase 2's objective coefficient of a column: W_i × satisfaction (clamped
    // at 1, as satisfaction is, when the best line alone was not proven).
    const fairnessCoefficient = (col: Pick<MasterColumn, "crew" | "score" | "reserve">) =>
      col.reserve ? 0 : best[col.crew]! <= 0 ? 1 : Math.min(1, col.score / best[col.crew]!);
    const wishCoefficient = (col: Pick<MasterColumn, "crew" | "score" | "reserve">) =>
      col.reserve || best[col.crew]! <= 0 ? 0 : problem.crew[col.crew]!.weight * fairnessCoefficient(col);
    let phase: "coverage" | "wishes" | "strict" | "probe" = "coverage";
    // Strict seniority: the crew member whose score the current step maximises, and the scores S*_i settled so far.
    let stepCrew = -1;
    const settled: number[] = [];
    const strictCost = (col: Pick<MasterColumn, "crew" | "score" | "reserve">) => (col.crew === stepCrew && !col.reserve ? col.score : 0);
    const costOf = (col: MasterColumn) =>
      phase === "coverage" ? tieBreak * wishCoefficient(col) : phase === "wishes" ? wishCoefficient(col) : phase === "strict" ? strictCost(col) : 0;
    const addColumn = (col: MasterColumn) => master.add(col, costOf(col), phase === "wishes" ? fairnessCoefficient(col) : 0);

    problem.crew.forEach((_, i) => addColumn({ crew: i, pairings: [], reserve: true, score: 0 }));
    problem.crew.forEach((c, i) => {
      const line = alone.lines[i];
      if (line) addColumn({ crew: i, pairings: line, reserve: false, score: best[i]! });
    });
    const greedyColumns = greedy.map((g, i): MasterColumn => ({ crew: i, pairings: g.pairings, reserve: g.reserve, score: g.score }));
    greedyColumns.forEach(addColumn);
    const fitColumns = clock
      .phase("first-fit", () => firstFitChoices(problem))
      .map((g, i): MasterColumn => ({ crew: i, pairings: g.pairings, reserve: g.reserve, score: g.score }));
    fitColumns.forEach(addColumn);
    // A small group is also solved with the compact model (compact-mip.ts): on
    // the published bases it reaches every crew member's best line in seconds,
    // where the neighbourhoods stall at a local optimum. Its lines are legal
    // (repaired and re-checked there) and scored exactly, so they join the
    // master as one more first solution.
    let compactColumns: MasterColumn[] | undefined;
    if (n * problem.pairings.length <= COMPACT_SIZE && !cancelled()) {
      progress("prepare", 8, "A small group: solving it whole with the compact model as well");
      const seconds = Math.min(COMPACT_SECONDS, clock.remainingSeconds(0.2));
      const started = performance.now();
      // In strict mode, with stacked objectives (compactStrictAward): its award
      // keeps the coverage and the seniors' scores step by step, where the
      // balanced award trades a senior's score for the juniors' (on the
      // published base BAC the steps stayed unproven below the stacked award).
      const options = { timeLimitSeconds: seconds, shouldStop: cancelled };
      const compact = strict ? await compactStrictAward(instance, options) : await compactMipAward(instance, options);
      clock.times.compact = performance.now() - started;
      // (A buddy unit's line is its junior member's: crew.id.)
      const crewIndex = new Map(problem.crew.map((c, i) => [c.crew.id, i]));
      const pairingIndex = new Map(problem.pairings.map((p, k) => [p.id, k]));
      compactColumns = compact.award.lines.filter((line) => crewIndex.has(line.crewId)).map((line): MasterColumn => {
        const i = crewIndex.get(line.crewId)!;
        const pairings = line.pairings.map((id) => pairingIndex.get(id)!).sort((a, b) => problem.startMs[a]! - problem.startMs[b]! || a - b);
        return line.kind === "reserve" ? { crew: i, pairings: [], reserve: true, score: 0 } : { crew: i, pairings, reserve: false, score: scoreLine(problem, problem.crew[i]!, pairings) };
      }).sort((a, b) => a.crew - b.crew);
      compactColumns.forEach(addColumn);
    }

    let rounds = 0;
    let neighbourhoods = { tried: 0, improved: 0 };
    let coverNeighbourhoods = { tried: 0, improved: 0 };
    let lastDuals: Float64Array = new Float64Array(0);

    /** Duals with a bound: L(y) = `value`, each crew member's line term (`Master.lagrangianBound`). */
    interface Bounded {
      y: Float64Array;
      line: number[];
      value: number;
    }

    /**
     * Column generation to the LP optimum (or a limit); returns the last LP, the
     * best Lagrangian bound with its duals, and whether the last pricing was
     * exhaustive at the LP's own duals (then the LP is optimal over all lines).
     * Set-partitioning LPs are degenerate and their duals jump about, so most
     * rounds price at smoothed duals (Wentges 1997: α·centre + (1 − α)·current,
     * the centre being the duals of the best bound so far) and keep only the
     * lines of positive reduced profit at the current duals. Every round that
     * prices all crew yields a bound (Master.lagrangianBound), smoothed or not.
     * A round that finds nothing prices at the current duals (quick, then deep,
     * then ten times deeper), which alone can end the phase.
     */
    const generate = (from: number, to: number): { lp: SolveOutcome; bound: number; bounded?: Bounded; exhausted: boolean } => {
      let bounded: Bounded | undefined;
      let mode: "smooth" | "plain" | "deep" | "deeper" = "plain";
      // With pricing exhausted at its duals, the LP's optimum is the LP bound itself (without L(y)'s tolerances).
      const result = (lp: SolveOutcome, exhausted: boolean) => ({
        lp,
        bound: Math.min(bounded?.value ?? Infinity, exhausted ? lp.objective : Infinity),
        ...(bounded ? { bounded } : {}),
        exhausted,
      });
      for (let round = 0; ; round++) {
        const lp = clock.phase(`${phase}-lp`, () => master.solveLp(clock.remainingSeconds(share), stop, phase === "probe"));
        // A strict probe's LP is infeasible only by the reserve row (open time makes every other row feasible): nothing to bound.
        if (lp.status === "infeasible") return { lp, bound: -Infinity, exhausted: true };
        if (lp.status !== "optimal") {
          noteStop();
          return result(lp, false);
        }
        const y = (lastDuals = master.project(master.duals()));
        // Once the coverage LP leaves less than half an open position's tie-break open, its bound on
        // open time is 0 and cannot fall further: the integer solve takes over (an award that then
        // leaves nothing open is proven optimal for coverage without more pricing).
        if (phase === "coverage" && lp.objective >= -0.5 / (1 + totalPositions)) return result(lp, false);
        // A strict probe whose LP keeps the coverage cannot prove anything by more pricing: the integer solve
        // decides — unless it failed to keep the coverage on the lines so far (probeAbove's second try).
        if (phase === "probe" && !probePricesOut && lp.objective >= -coverageLimit) return result(lp, false);
        const centre = bounded?.y;
        const at: Float64Array = mode === "smooth" && centre ? centre.map((v, r) => SMOOTHING * v + (1 - SMOOTHING) * y[r]!) : y;
        const cost = pairingCosts(at);
        const current = pairingCosts(y);
        let added = 0;
        let exhausted = true;
        let complete = true;
        const line: number[] = [];
        clock.phase(`${phase}-pricing`, () => {
          for (const [i, c] of problem.crew.entries()) {
            if (stop()) {
              // A round cut short prices only some crew: it bounds nothing.
              exhausted = complete = false;
              break;
            }
            const yi = y[master.crewRow[i]!]!;
            const offset = lineOffset(i, at);
            const request = { scoreWeight: scoreWeight(i, at), cost, threshold: at[master.crewRow[i]!]! + TOL - offset, maxLines: linesPerRound, nodeLimit: quickNodes, ...settledScore(i) };
            let r = priceLines(problem, c, request);
            if ((mode === "deep" || mode === "deeper") && r.lines.length === 0 && !r.exhausted) {
              r = priceLines(problem, c, { ...request, nodeLimit: mode === "deep" ? nodeLimit : nodeLimit * DEEPER });
            }
            exhausted &&= r.exhausted;
            line.push(r.upperBound + offset);
            const weight = scoreWeight(i, y);
            const offsetNow = lineOffset(i, y);
            for (const l of r.lines) {
              let profit = weight * l.score - yi + offsetNow;
              for (const k of l.pairings) profit -= sizes[i]! * current[k]!; // (a buddy unit fills two positions)
              if (profit <= TOL) continue;
              if (addColumn({ crew: i, pairings: l.pairings, reserve: false, score: l.score })) added++;
              // A line the master holds already but pricing values higher (a score above an unproven best
              // line is clamped in the master): pricing's top lines say nothing of the LP's optimality.
              else exhausted = false;
            }
          }
        });
        rounds++;
        const value = complete ? master.lagrangianBound(at, line) : Infinity;
        if (value < (bounded?.value ?? Infinity)) bounded = { y: at, line, value };
        const fraction = Math.min(1, round / 30);
        progress(
          phase === "coverage" ? "coverage" : "wishes",
          from + (to - from) * fraction,
          `${phase === "coverage" ? "Covering the trips" : phase === "wishes" ? "Granting wishes" : `Seniority ${problem.crew[stepCrew]!.crew.seniority}`}: round ${rounds}, ${master.columns.length} lines, LP ${lp.objective.toFixed(3)}`,
        );
        // (Strict seniority counts the limit per probe.)
        if ((phase === "probe" ? round + 1 : rounds) >= roundLimit) {
          stoppedBy = "iteration-limit";
          return result(lp, false);
        }
        if (added > 0) {
          // Smoothed and plain rounds alternate, so the centre keeps moving to better bounds.
          mode = mode !== "smooth" && bounded ? "smooth" : "plain";
          continue;
        }
        if (mode === "smooth") mode = "plain";
        else if (mode === "plain" && !exhausted) mode = "deep";
        else if (mode === "deep" && !exhausted) mode = "deeper";
        else {
          if (!exhausted) noteStop();
          return result(lp, exhausted);
        }
      }
    };

    /** Pricing's least score for a settled crew member (strict seniority: Master.settle). */
    const settledScore = (i: number): { minScore?: number } => (master.minScore[i] === undefined ? {} : { minScore: master.minScore[i] });
    const pairingCosts = (y: Float64Array) => {
      const cost = new Float64Array(problem.pairings.length);
      for (const [p, row] of master.coverRow) cost[p] = y[row]!;
      return cost;
    };
    /**
     * What pricing's value leaves out of a line's value at y (crew dual aside): for a crew member without a
     * line of their own (best ≤ 0) every line counts fully in their fairness row, at score weight 0.
     */
    const lineOffset = (i: number, y: Float64Array) => {
      const fair = master.fairRow[i];
      return phase === "wishes" && best[i]! <= 0 && fair !== undefined ? -y[fair]! : 0;
    };
    const scoreWeight = (i: number, y: Float64Array) => {
      if (best[i]! <= 0) return 0;
      if (phase === "coverage") return (tieBreak * problem.crew[i]!.weight) / best[i]!;
      // Strict: c_ℓ = s_ℓ for the step's crew member, 0 for everyone else; a probe prices open time only.
      if (phase === "strict") return i === stepCrew ? 1 : 0;
      if (phase === "probe") return 0;
      const fair = master.fairRow[i];
      const yf = fair === undefined ? 0 : y[fair]!;
      return (problem.crew[i]!.weight - yf) / best[i]!;
    };

    /**
     * The integer solve, then closing the gap: with L(y) − z_MIP = g, a better
     * solution can use only lines whose value at y is within g of their crew
     * member's term in L(y); when every such line is enumerated and the
     * integer solve repeated, the result is optimal. Returns the chosen columns.
     */
    const integer = (bound: number, bounded: Bounded | undefined, exhausted: boolean, start: readonly MasterColumn[] | undefined, target?: { value: number; share: number }) => {
      // With a target (strict seniority) the solve stops at the first award reaching it, within its own share of the time.
      const limit = clock.remainingSeconds(share) * (target?.share ?? 1);
      // (A strict probe's integer problem may have no solution on the lines so far: the reserve minimum.)
      let mip = clock.phase(`${phase}-mip`, () => master.solveMip(limit, stop, 1e-9, start, target?.value, phase === "probe"));
      let proven = false;
      if (mip.status === "infeasible") return { mip, proven: false, chosen: [...(start ?? greedyColumns)] };
      if (mip.status !== "optimal" && mip.status !== "target") noteStop();
      // (An infinite bound proves nothing: Infinity − z ≤ 1e-7·Infinity would hold.)
      if (mip.status === "optimal" && Number.isFinite(bound) && bound - mip.objective <= 1e-7 * Math.max(1, Math.abs(bound))) proven = true;
      else if (exhausted && bounded && mip.status === "optimal") {
        const gapAbs = bounded.value - mip.objective;
        const { y, line } = bounded;
        const cost = pairingCosts(y);
        let complete = true;
        let added = 0;
        clock.phase(`${phase}-closing`, () => {
          for (const [i, c] of problem.crew.entries()) {
            if (stop()) {
              complete = false;
              break;
            }
            const cap = options.closingLines ?? 400;
            const term = master.crewTerm(y, line[i]!, i);
            const r = priceLines(problem, c, { scoreWeight: scoreWeight(i, y), cost, threshold: term - gapAbs - TOL - lineOffset(i, y), maxLines: cap, nodeLimit: nodeLimit * 5, ...settledScore(i) });
            if (!r.exhausted || r.lines.length >= cap) complete = false;
            for (const l of r.lines) if (addColumn({ crew: i, pairings: l.pairings, reserve: false, score: l.score })) added++;
          }
        });
        const chosen = chosenColumns();
        if (added > 0) mip = clock.phase(`${phase}-mip`, () => master.solveMip(clock.remainingSeconds(share), stop, 1e-9, chosen));
        proven = complete && mip.status === "optimal";
      }
      const chosen = chosenColumns();
      const fallback = [...(start ?? greedyColumns)];
      const valid = feasible(chosen);
      if (mip.status === "optimal" && valid) return { mip, proven, chosen };
      // Stopped early: keep the better of what the solve holds and the solution it started from.
      if (valid && value(chosen) >= value(fallback) - 1e-9) return { mip, proven: false, chosen };
      if (phase !== "probe") warnings.push(`the ${phase} integer solve stopped without improving on its starting solution`);
      return { mip, proven: false, chosen: fallback };
    };
    /** Positions each pairing still needs under a full solution (negative: over-covered). */
    const openAfter = (cols: readonly MasterColumn[]) => {
      const left = new Map(need);
      for (const col of cols) for (const p of col.pairings) left.set(p, left.get(p)! - sizes[col.crew]!);
      return left;
    };
    const coverageOf = (cols: readonly MasterColumn[]) => [...openAfter(cols)].reduce((t, [p, open]) => t + openCost.get(p)! * open, 0);
    let coverageLimit = Infinity;
    /** a strict probe's second try: price to the LP optimum, so that the integer solve's gap can be closed */
    let probePricesOut = false;
    /** One line per crew member, no trip over-covered, reserve within bounds, coverage kept. */
    const feasible = (cols: readonly MasterColumn[]) => {
      if (cols.length !== n || new Set(cols.map((col) => col.crew)).size !== n) return false;
      if ([...openAfter(cols).values()].some((open) => open < 0)) return false;
      const reserves = cols.reduce((t, col) => t + (col.reserve ? sizes[col.crew]! : 0), 0);
      if (cols.some((col) => settled[col.crew] !== undefined && (col.reserve ? 0 : col.score) < settled[col.crew]! - FLOOR_MARGIN - 1e-9)) return false;
      // (A strict probe asks whether the coverage can be kept: its solutions are weighed by value, not refused here.)
      return reserves >= reserveMin && reserves <= reserveMax && (phase === "probe" || coverageOf(cols) <= coverageLimit);
    };
    /** The phase's objective of a full solution (larger is better). */
    const value = (cols: readonly MasterColumn[]) =>
      phase === "coverage"
        ? -coverageOf(cols) + tieBreak * cols.reduce((t, col) => t + wishCoefficient(col), 0)
        : phase === "wishes"
          ? cols.reduce((t, col) => t + wishCoefficient(col), 0)
          : phase === "strict"
            ? cols.reduce((t, col) => t + strictCost(col), 0)
            : -coverageOf(cols);
    const chosenColumns = () => {
      const x = master.values();
      return master.columns.filter((_, k) => x[k]! > 0.5);
    };

    // Phase 1: coverage. It starts from the best covering of the greedy award,
    // the first fit and the compact model's award; one that leaves nothing open
    // is optimal already.
    const startColumns = [fitColumns, ...(compactColumns ? [compactColumns] : [])].reduce(
      (bestSoFar, cols) => (feasible(cols) && value(cols) > value(bestSoFar) + 1e-9 ? cols : bestSoFar),
      greedyColumns,
    );
    const coveredAlready = feasible(startColumns) && [...openAfter(startColumns).values()].every((open) => open === 0);
    master.setCoverageObjective(openCost);
    master.setSurplusPenalty((p) => SURPLUS * openCost.get(p)!);
    const cover = coveredAlready ? undefined : generate(10, 40);
    // A lower bound on open credit: −(phase 1's upper bound), less the positions' share δ·P and
    // the wishes' tie-break (below δ/2).
    const coverageLpBound = cover && Number.isFinite(cover.bound) ? Math.max(0, -cover.bound - (totalPositions + 0.5) / (1 + totalPositions)) : 0;
    share = 0.2;
    const cover1 = cover ? integer(cover.bound, cover.bounded, cover.exhausted, startColumns) : { proven: true, chosen: startColumns };
    share = 0.4;
    const neighbourhoodInput = (start: MasterColumn[]) => ({
      problem,
      highs,
      need,
      openCost,
      coefficient: wishCoefficient,
      scoreWeight: (i: number, yf: number) => (best[i]! <= 0 ? 0 : (problem.crew[i]!.weight - yf) / best[i]!),
      fullCoefficient: (i: number) => (best[i]! <= 0 ? 0 : problem.crew[i]!.weight),
      reserve: { min: reserveMin, max: reserveMax },
      start: [...start].sort((a, b) => a.crew - b.crew),
      deadline: performance.now() + clock.remainingSeconds(share) * 1000,
      stop: cancelled,
      nodeLimit: quickNodes * 2,
      // With an iteration limit a run does the same work on any machine: it bounds the neighbourhoods too.
      ...(Number.isFinite(roundLimit) ? { maxTries: roundLimit } : {}),
    });
    if (!cover1.proven && [...openAfter(cover1.chosen).values()].some((open) => open > 0) && !stop()) {
      progress("coverage", 38, "Covering open trips a few crew members at a time");
      const better = clock.phase("coverage-neighbourhoods", () => improveByNeighbourhoods({ ...neighbourhoodInput(cover1.chosen), coverage: { tieBreak } }));
      coverNeighbourhoods = { tried: better.tried, improved: better.improved };
      if (better.improved > 0 && feasible(better.columns)) {
        cover1.chosen = better.columns;
        better.columns.forEach(addColumn); // phase 2's master must hold the coverage it is asked to keep
      }
    }
    // Phase 1's integer optimum, counted from the lines chosen (Σ c_p u_p).
    const coverage = coverageOf(cover1.chosen);
    // Coverage is proven optimal by phase 1's own proof, or by an award that leaves nothing open.
    const coverageProven = cover1.proven || [...openAfter(cover1.chosen).values()].every((open) => open === 0);

    coverageLimit = coverage + 1e-7; // HiGHS's primal feasibility tolerance; looser lets the LP bound drift

    /**
     * Strict seniority (AWARD-MODEL.md): in seniority order, crew member k's
     * score is maximised over every award that keeps the coverage and every
     * settled senior's score (a floor S*_i − FLOOR_MARGIN, not a fixed line),
     * then settled. Each step is as cheap as its evidence allows:
     *
     * 1. the incumbent already gives k their best line alone (proven by the
     *    exhausted search of pricing.ts) — nothing can be better;
     * 2. the integer solve on the lines generated so far, from the incumbent,
     *    stopping at k's best line alone if it reaches it (the witness is that
     *    award), then swaps with more junior colleagues that raise k's score;
     * 3. else coverage probes above k's score z (probeAbove): one proves that
     *    no award gives k more, or finds one that does (z rises, probe again),
     *    or decides nothing and the step stays unproven.
     *
     * After the last step, passes of swaps in seniority order until none is
     * left (only unproven steps can gain by one).
     *
     * Every step starts from the previous step's award, which meets all the
     * floors, and the master keeps its lines and basis from step to step. A
     * settled crew member keeps only their lines of score S*_i − FLOOR_MARGIN
     * or more (Master.settle), and pricing looks only for such lines.
     */
    const strictSteps = () => {
      phase = "strict";
      master.setWishObjective(openCost, coverageLimit, () => 0);
      let incumbent = [...cover1.chosen].sort((x, y) => x.crew - y.crew);
      const certificates: StrictCertificate[] = [];
      const scoreOf = (col: MasterColumn) => (col.reserve ? 0 : col.score);
      /**
       * Can crew member k score `target` or more with the seniors' scores and
       * the coverage kept? k keeps only such lines (Master.restrict) and the
       * master minimises open time instead (Master.probeCoverage): when even
       * the relaxation — or the integer solve over every line that could do
       * better (gap closing) — must leave more open than U*, no award gives k
       * `target`; when the integer solve keeps the coverage, it is a better award.
       */
      /**
       * A start for a probe's integer solve: the award so far with k on the
       * line the probe's LP uses most, and every unsettled crew member whose
       * line shares a trip with it on reserve (while the reserve maximum
       * allows; else on their best pool line that fits) — open time it then
       * reduces. Undefined when a settled crew member's line is in the way.
       */
      const probeStart = (k: number, award: readonly MasterColumn[]): MasterColumn[] | undefined => {
        const x = master.values();
        let pick: MasterColumn | undefined;
        let most = 0;
        master.columns.forEach((col, c) => {
          if (col.crew === k && !col.reserve && x[c]! > most && col.score >= (master.minScore[k] ?? -Infinity)) {
            most = x[c]!;
            pick = col;
          }
        });
        if (!pick) return undefined;
        const taken = new Set(pick.pairings);
        let reserves = award.reduce((t, col) => t + (col.reserve && col.crew !== k ? sizes[col.crew]! : 0), 0);
        const out: MasterColumn[] = [];
        for (const col of award) {
          if (col.crew === k) {
            out.push(pick);
            continue;
          }
          if (!col.pairings.some((p) => taken.has(p))) {
            out.push(col);
            continue;
          }
          if (settled[col.crew] !== undefined) return undefined;
          if (reserves + sizes[col.crew]! <= reserveMax) {
            const reserve = master.columns.find((c) => c.crew === col.crew && c.reserve);
            if (!reserve) return undefined;
            out.push(reserve);
            reserves += sizes[col.crew]!;
            continue;
          }
          return undefined;
        }
        return reserves >= reserveMin ? out : undefined;
      };
      /**
       * Crew member i's version of a line (a reserve line, or these pairings) when lib/rules
       * calls it legal for i as a whole line, scored by lineScore; undefined otherwise.
       */
      const lineFor = (i: number, col: MasterColumn, above = -Infinity): MasterColumn | undefined => {
        const c = problem.crew[i]!;
        // (A buddy unit's line fills two positions of each trip: it trades lines with another unit only.)
        if (sizes[i] !== sizes[col.crew]) return undefined;
        if (col.reserve) return above < 0 && checkCrewLine(problem, c, [], true).legal ? { crew: i, pairings: [], reserve: true, score: 0 } : undefined;
        if (col.pairings.some((p) => c.position[p]! < 0)) return undefined;
        // Scored before the legality check, which costs far more (the final swap passes ask it O(n²) times).
        const score = scoreLine(problem, c, col.pairings);
        if (score <= above || !checkCrewLine(problem, c, col.pairings).legal) return undefined;
        return { crew: i, pairings: col.pairings, reserve: false, score };
      };
      /**
       * Swaps that raise crew member i's score: i takes a more junior colleague's line
       * that is legal for i, the colleague takes i's (legal for them) — the coverage and
       * everyone else's lines unchanged, so the award gets lexicographically better.
       * Repeats with the best swap until none is left; returns the number made.
       */
      const swapUp = (i: number, award: MasterColumn[]): number => {
        let made = 0;
        for (;;) {
          const mine = scoreOf(award[i]!);
          let bestSwap: [MasterColumn, MasterColumn, number] | undefined;
          for (let j = i + 1; j < n; j++) {
            if (Master.key({ ...award[j]!, crew: i }) === Master.key(award[i]!)) continue;
            if (award[j]!.reserve) continue;
            const taken = lineFor(i, award[j]!, Math.max(mine + SCORE_TOL, bestSwap?.[0].score ?? -Infinity));
            if (!taken) continue;
            const given = lineFor(j, award[i]!);
            if (given) bestSwap = [taken, given, j];
          }
          if (!bestSwap) return made;
          const [taken, given, j] = bestSwap;
          award[i] = taken;
          award[j] = given;
          addColumn(taken);
          addColumn(given);
          made++;
        }
      };
      let incumbentNow: MasterColumn[] = [];
      const probeAbove = (
        k: number,
        target: number,
        from: number,
      ): { kind: "impossible"; method: "best-alone" | "reserve-minimum" | "coverage" | "enumeration"; openAbove: number } | { kind: "better"; chosen: MasterColumn[] } | { kind: "undecided" } => {
        // The master needs a line of k's that scores `target` to start from: k's best such lines alone.
        const seeds = priceLines(problem, problem.crew[k]!, { scoreWeight: 1, cost: new Float64Array(problem.pairings.length), threshold: -Infinity, maxLines: linesPerRound, nodeLimit, minScore: target });
        if (seeds.lines.length === 0) return seeds.exhausted ? { kind: "impossible", method: "best-alone", openAbove: Infinity } : { kind: "undecided" };
        phase = "probe";
        for (const l of seeds.lines) addColumn({ crew: k, pairings: l.pairings, reserve: false, score: l.score });
        master.restrict(k, target);
        master.setCrewCosts(k, () => 0);
        master.probeCoverage(openCost, coverageLimit);
        try {
          // First on the lines the LP needs to keep the coverage; when the integer solve on them cannot, once
          // more with pricing to the LP's optimum, so that the gap to its bound can be closed (the first try's
          // integer optimum over the lines so far proves nothing: a line not yet generated may keep the coverage).
          for (let attempt = 0; attempt < 2; attempt++) {
            probePricesOut = attempt === 1;
            const step = generate(from, from + 50 / n);
            if (step.lp.status === "infeasible") return { kind: "impossible", method: "reserve-minimum", openAbove: Infinity };
            // −bound is a lower bound on open time (in openCost's units) for every award giving k `target`.
            if (-step.bound > coverageLimit + COVERAGE_TOL) return { kind: "impossible", method: "coverage", openAbove: -step.bound };
            if (stop()) return { kind: "undecided" };
            const solved = integer(step.bound, step.bounded, step.exhausted, probeStart(k, incumbentNow), { value: -coverageLimit, share: 0.5 });
            const keeps = solved.mip.status !== "infeasible" && solved.mip.status !== "other";
            const byCrew = solved.chosen.find((col) => col.crew === k);
            if (keeps && feasible(solved.chosen) && coverageOf(solved.chosen) <= coverageLimit && byCrew && !byCrew.reserve && byCrew.score >= target) {
              return { kind: "better", chosen: solved.chosen };
            }
            if (solved.proven && -solved.mip.objective > coverageLimit + COVERAGE_TOL) return { kind: "impossible", method: "enumeration", openAbove: -solved.mip.objective };
            if (stop() || step.exhausted) break;
          }
          return { kind: "undecided" };
        } finally {
          probePricesOut = false;
          master.probeCoverage(undefined, coverageLimit);
          master.release(k);
          phase = "strict";
          master.setCrewCosts(k, strictCost);
        }
      };
      for (let k = 0; k < n; k++) {
        if (cancelled()) break;
        stepCrew = k;
        master.setCrewCosts(k, strictCost);
        const had = scoreOf(incumbent[k]!);
        share = Math.min(1, clock.shareAfter(clock.remainingSeconds(1) * Math.min(1, STEP_SHARE / (n - k))));
        const from = 45 + (50 * k) / n;
        progress("wishes", from, `Seniority ${problem.crew[k]!.crew.seniority}: ${k} of ${n} crew settled`);
        let certificate: StrictCertificate;
        if (best[k]! <= 0) {
          certificate = { step: k + 1, method: "no-legal-line", score: 0, bound: 0 };
        } else if (alone.exhausted[k] && had >= best[k]! - SCORE_TOL) {
          certificate = { step: k + 1, method: "best-alone", score: had, bound: best[k]! };
        } else if (clock.expired(1)) {
          // Past the time limit, the rest keep the incumbent's line (the swap passes below still
          // raise them where a swap can): every step's integer solve and probe cost a little
          // even with no time, which on L added 26 s past the limit.
          certificate = { step: k + 1, method: "unproven", score: had, bound: alone.exhausted[k] ? Math.max(had, best[k]!) : null };
          noteStop();
        } else {
          const first = integer(Infinity, undefined, false, incumbent, { value: alone.exhausted[k] ? best[k]! - SCORE_TOL : Infinity, share: 0.4 });
          let chosen = [...first.chosen].sort((x, y) => x.crew - y.crew);
          swapUp(k, chosen);
          let z = value(chosen);
          let found: StrictCertificate | undefined;
          // Probe above z until a probe proves nothing better exists, finds nothing, or time runs out.
          while (!found) {
            if (alone.exhausted[k] && z >= best[k]! - SCORE_TOL) {
              found = { step: k + 1, method: "best-alone", score: z, bound: best[k]! };
              break;
            }
            if (stop()) break;
            incumbentNow = chosen;
            const probe = probeAbove(k, z + SCORE_TOL, from);
            // (No line of k's scores `target` at all: z is their best line alone.)
            if (probe.kind === "impossible") found = { step: k + 1, method: probe.method, score: z, bound: z, ...(Number.isFinite(probe.openAbove) ? { openAbove: probe.openAbove } : {}) };
            else if (probe.kind === "better") {
              chosen = [...probe.chosen].sort((x, y) => x.crew - y.crew);
              swapUp(k, chosen);
              z = value(chosen);
            } else break;
          }
          certificate = found ?? { step: k + 1, method: "unproven", score: z, bound: alone.exhausted[k] ? Math.max(z, best[k]!) : null };
          incumbent = [...chosen].sort((x, y) => x.crew - y.crew);
        }
        certificates.push(certificate);
        stepCrew = -1;
        master.setCrewCosts(k, strictCost);
        const score = scoreOf(incumbent[k]!);
        settled[k] = score;
        if (score > 0) master.settle(k, score - FLOOR_MARGIN);
      }
      share = 1;
      if (certificates.length < n) noteStop();
      // A last pass of swaps in seniority order: only an unproven step can gain by one (a proven
      // one has no better award), and a colleague whose line changes keeps their old bound, which
      // still holds (their seniors' scores only rose), but is unproven now.
      // (Passes repeat until one makes no swap: each swap raises the award lexicographically, so they end.)
      stepCrew = -1;
      for (let swapped = true; swapped; ) {
        swapped = false;
        for (let i = 0; i < certificates.length; i++) {
          const before = incumbent.map(scoreOf);
          if (swapUp(i, incumbent) === 0) continue;
          swapped = true;
          incumbent.forEach((col, j) => {
            const cert = certificates[j];
            if (!cert || Math.abs(scoreOf(col) - before[j]!) <= 1e-12) return;
            const bound = cert.method === "unproven" ? cert.bound : Math.max(cert.bound ?? -Infinity, scoreOf(col));
            certificates[j] = { ...cert, method: "unproven", score: scoreOf(col), bound };
          });
        }
      }
      return { chosen: incumbent, certificates };
    };

    // Phase 2, balanced: wishes with the coverage kept.
    const balancedWishes = () => {
      phase = "wishes";
      const floor = settings.fairnessFloor;
      master.setWishObjective(
        openCost,
        coverageLimit,
        (col) => wishCoefficient(col),
        floor !== undefined ? { floor, penalty: FAIRNESS_PENALTY, coefficient: fairnessCoefficient, crewCount: n } : undefined,
      );
      const wishStart = compactColumns && feasible(compactColumns) && value(compactColumns) > value(cover1.chosen) + 1e-9 ? compactColumns : cover1.chosen;
      // A start that gives everyone their best line alone cannot be beaten: phase 2 has nothing to do.
      const reachable = problem.crew.reduce((t, c, i) => t + (best[i]! > 0 ? c.weight : 0), 0);
      const atBest = value(wishStart) >= reachable - 1e-9 * Math.max(1, reachable);
      share = 0.5;
      const wishes: { bound: number; bounded?: Bounded; exhausted: boolean } = atBest ? { bound: reachable, exhausted: false } : generate(45, 75);
      share = 0.55;
      progress("integer", 78, "Choosing one line per crew member");
      const final: { proven: boolean; chosen: MasterColumn[] } = atBest ? { proven: false, chosen: wishStart } : integer(wishes.bound, wishes.bounded, wishes.exhausted, wishStart);
      share = 1;
      if (!atBest && !final.proven && !stop()) {
        progress("integer", 88, "Improving the award a few crew members at a time");
        const improvedAward = clock.phase("neighbourhoods", () =>
          improveByNeighbourhoods({
            ...neighbourhoodInput(final.chosen),
            ...(floor !== undefined ? { fairness: { floor, penalty: FAIRNESS_PENALTY, coefficient: fairnessCoefficient } } : {}),
          }),
        );
        neighbourhoods = { tried: improvedAward.tried, improved: improvedAward.improved };
        if (improvedAward.improved > 0 && feasible(improvedAward.columns)) final.chosen = improvedAward.columns;
      }
      return { wishes, final, atBest };
    };

    const floor = strict ? undefined : settings.fairnessFloor;
    if (strict && settings.fairnessFloor !== undefined) warnings.push("the fairness floor applies in balanced mode only; strict seniority leaves it aside");
    const strictResult = strict ? strictSteps() : undefined;
    const balanced = strict ? undefined : balancedWishes();
    const final = strictResult ?? balanced!.final;
    const atBest = balanced?.atBest ?? false;

    // The award.
    const byCrew = new Map(final.chosen.map((col) => [col.crew, col]));
    const choices: Choice[] = problem.crew.map((_, i) => {
      const col = byCrew.get(i);
      if (!col) throw new AppError("internal", `the integer solve left crew ${problem.crew[i]!.crew.id} without a line`);
      return { reserve: col.reserve, pairings: col.pairings };
    });
    const assembled = clock.phase("assemble", () => assembleAward(problem, choices, best));
    strictResult?.certificates.forEach((cert, i) => {
      const { members } = problem.crew[i]!;
      const unit = members.length > 1 ? { unit: members.map((m) => m.id) } : {};
      assembled.entryLines[i]!.forEach((x) => (assembled.award.lines[x]!.certificate = { ...cert, ...unit }));
    });
    const fairnessShortfalls =
      floor === undefined
        ? []
        : assembled.award.lines.flatMap((l) => (l.satisfaction < floor - 1e-9 ? [{ crewId: l.crewId, shortfall: floor - l.satisfaction }] : []));
    const constant = problem.crew.reduce((t, c, i) => t + (best[i]! <= 0 ? c.weight : 0), 0);
    const penalty = fairnessShortfalls.reduce((t, s) => t + FAIRNESS_PENALTY * s.shortfall, 0);
    const objective = assembled.weightedSatisfaction - penalty;
    // Every satisfaction is at most 1, so Σ_i W_i bounds the objective too (the weaker pricing bounds can exceed it).
    const allSatisfied = problem.crew.reduce((t, c) => t + c.weight, 0);
    // Strict: each crew member's satisfaction is at most their step's bound over best_i (1 for crew not reached).
    const strictBound = strictResult
      ? problem.crew.reduce((t, c, i) => {
          const cert = strictResult.certificates[i];
          return t + c.weight * (best[i]! <= 0 || !cert || cert.bound === null ? 1 : Math.min(1, cert.bound / best[i]!));
        }, 0)
      : 0;
    const lpBound = strictResult ? Math.max(objective, strictBound) : Math.max(objective, Math.min(allSatisfied, balanced!.wishes.bound + constant));
    const everyoneAtBest = objective >= allSatisfied - 1e-9 * Math.max(1, allSatisfied);
    const gap = Number.isFinite(lpBound) ? (lpBound - objective) / Math.max(1, Math.abs(lpBound)) : Infinity;
    const y = lastDuals;
    const finalDuals = {
      crew: Object.fromEntries(problem.crew.map((c, i) => [c.crew.id, y[master.crewRow[i]!]!])),
      pairings: Object.fromEntries([...master.coverRow].map(([p, row]) => [problem.pairings[p]!.id, y[row]!])),
      scoreCoefficient: Object.fromEntries(problem.crew.map((c, i) => [c.crew.id, scoreWeight(i, y)])),
    };
    progress("done", 100, `Done: ${assembled.openPositions} open positions, gap ${(gap * 100).toFixed(2)} %`);
    const stats: Stats = {
      times: clock.times,
      columns: master.columns.length,
      rounds,
      ...(Number.isFinite(gap) ? { gap, lpBound } : {}),
      objective,
      stoppedBy,
    };
    return {
      award: assembled.award,
      stats,
      report: {
        method: "column-generation",
        openCreditMinutes: assembled.openCreditMinutes,
        openPositions: assembled.openPositions,
        coverageLpBound,
        objective,
        lpBound,
        gap,
        provenOptimal: strictResult
          ? coverageProven && strictResult.certificates.length === n && strictResult.certificates.every((c) => c.method !== "unproven")
          : coverageProven && ((everyoneAtBest && alone.exhausted.every(Boolean)) || (balanced!.wishes.exhausted && balanced!.final.proven)),
        ...(strictResult ? { strictSteps: countSteps(strictResult.certificates) } : {}),
        neighbourhoods: { coverage: coverNeighbourhoods, wishes: neighbourhoods },
        illegalPairings: problem.illegal,
        fairnessShortfalls,
        ...crewFigures(problem, best),
        warnings,
        ...(atBest || strict ? {} : { finalDuals }),
      },
    };
  } finally {
    master.dispose();
  }
}
