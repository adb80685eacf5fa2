/**
 * Line generation for one crew member: the legal lines of highest value
 *
 *     value(ℓ) = scoreWeight · lineScore(ℓ) − Σ_{p ∈ ℓ} cost_p
 *
 * by depth-first branch and bound over the crew member's network (eligible
 * pairings in report order, arcs where lib/rules says one may follow the
 * other). Column generation calls it with the master's duals as costs; the
 * greedy baseline and the best-line computation call it with costs of zero.
 *
 * Exactness. The search prunes only on conditions that are necessary for
 * legality and cannot be mended by adding later trips (the pairwise rules of
 * the network, the credit maximum, the most days a line may work) and on a
 * bound no extension can beat. Every line it returns passes the full legality
 * engine: engine states along the current path are built lazily, only when a
 * line would be returned, and a duty or rest violation found there closes
 * the whole subtree (later trips cannot mend an earlier violation). When the
 * search finishes within its node limit, `exhausted` is true and the best
 * value found is the true maximum; otherwise `upperBound` is a valid bound.
 *
 * The bound of a node: its Σ −cost so far, plus what the trips ahead can add —
 * the least of the best Σ −cost of any chain of the network after its last
 * trip (computed backwards once), the credit still allowed times the best
 * −cost per credit minute ahead, and the days still allowed times the best
 * −cost per day ahead (both fractional knapsack bounds) — plus
 * scoreWeight × an optimistic score (wish by wish: what the trips still
 * ahead could at most make of it; see wishBound). The node's bound is the
 * smaller of that and the Lagrangian chain bound of chain-bound.ts, which
 * prices the credit window and the days worked with multipliers and counts
 * each free date and weekend once along the chain; it also orders the
 * children, and a node stops walking them once no child can beat the floor.
 * (Within a neighbourhood's small pool the chain bound is skipped.)
 */
import type { Wish } from "../domain/index.ts";
import { matchesTripSelection, periodWeekends, rankWeight } from "../domain/index.ts";
import { daysBetween } from "../domain/time.ts";
import { extendAll, finish, start, type LineState } from "../rules/index.ts";
import { chainAfter, chainBound, nowScore, type ChainBound } from "./chain-bound.ts";
import { scoreLine, successorPositions, type AwardProblem, type CrewProblem } from "./problem.ts";

export interface PriceRequest {
  /** weight of the line's score in its value (0: legality and costs only) */
  scoreWeight: number;
  /** cost of each pairing (by pairing index), per crew member flying it: a buddy unit pays it twice */
  cost: ArrayLike<number>;
  /** only lines of value above this are returned */
  threshold: number;
  /** how many lines to return at most (the best ones) */
  maxLines: number;
  /** search nodes before giving up on exhausting the search */
  nodeLimit: number;
  /** pairings that may be used (by pairing index); all eligible ones when absent */
  allowed?: (pairing: number) => boolean;
  /** subgradient steps tuning the chain bound's multipliers (chain-bound.ts; default 4) */
  boundSteps?: number;
  /** only lines scoring at least this (strict seniority's settled crew); value bounds are then over those lines */
  minScore?: number;
}

export interface PricedLine {
  /** pairing indices, by report time */
  pairings: number[];
  score: number;
  value: number;
}

export interface PriceResult {
  /** best first; every one legal and of value above the threshold */
  lines: PricedLine[];
  /** no legal line has a value above this */
  upperBound: number;
  exhausted: boolean;
  nodes: number;
}

interface WishPlan {
  weight: number;
  wish: Wish;
  /** trip wishes: matchesAfter[j] = selected trips among eligible positions ≥ j */
  matchesAfter?: Int32Array;
  /** trip and no-trip wishes: whether eligible position j is selected */
  selects?: Uint8Array;
  /** free-days wishes: the named dates inside the period, as day indices; and how many dates are named */
  days?: number[];
  named?: number;
  /** rhythm wishes: the period's weekends as day indices */
  weekends?: number[][];
}

const plans = new WeakMap<CrewProblem, WishPlan[]>();

function wishPlans(problem: AwardProblem, c: CrewProblem): WishPlan[] {
  let known = plans.get(c);
  if (known) return known;
  const { zone, periodStart, periodEnd } = problem.score;
  const dayIndex = (date: string) => daysBetween(periodStart, date);
  const inPeriod = (d: number) => d >= 0 && d < problem.periodLength;
  known = c.weighted.map(({ wish, weight }): WishPlan => {
    switch (wish.kind) {
      case "trip":
      case "no-trip": {
        const selects = Uint8Array.from(c.eligible, (k) => (matchesTripSelection(wish, problem.pairings[k]!, zone) ? 1 : 0));
        const matchesAfter = new Int32Array(c.eligible.length + 1);
        for (let j = c.eligible.length - 1; j >= 0; j--) matchesAfter[j] = matchesAfter[j + 1]! + selects[j]!;
        return { weight, wish, selects, matchesAfter };
      }
      case "free-days":
        return { weight, wish, days: wish.dates.map(dayIndex).filter(inPeriod), named: wish.dates.length };
      case "rhythm":
        return { weight, wish, weekends: periodWeekends(periodStart, periodEnd).map((w) => w.map(dayIndex)) };
      default:
        return { weight, wish };
    }
  });
  plans.set(c, known);
  return known;
}

/** The longest run of worked days (dayCount > 0) in the period. */
function longestRun(dayCount: ArrayLike<number>): number {
  let run = 0;
  let longest = 0;
  for (let d = 0; d < dayCount.length; d++) {
    run = dayCount[d]! > 0 ? run + 1 : 0;
    if (run > longest) longest = run;
  }
  return longest;
}

/**
 * Upper bounds on the score of any line that extends the current one — `path`
 * (eligible positions), working the period days `dayCount` marks, with
 * `credit` — with trips at positions ≥ `from` (`ahead`), and of the current
 * line itself (`here`). Wish by wish, a part cannot grow past: trip — what is
 * held plus every selected trip still ahead; no-trip — 0 once one is held;
 * free days — the share of named dates not yet worked inside the period; rhythm
 * — its score on the period days worked so far (runs only lengthen and weekends
 * only fill); a credit maximum already exceeded — its present score; a credit
 * minimum — 1; buddy — 1 in a buddy unit (the members share the line), else 0. Dates outside the period
 * are taken as free, which can only raise the bound. The exact score is always
 * lineScore's; a property test checks these bounds against it.
 */
export function wishBounds(
  problem: AwardProblem,
  c: CrewProblem,
  path: readonly number[],
  dayCount: ArrayLike<number>,
  credit: number,
  from: number,
): { ahead: number; here: number } {
  let ahead = c.baseValue;
  let here = ahead;
  let longest = -1;
  for (const plan of wishPlans(problem, c)) {
    const { wish } = plan;
    let part: number;
    let partHere: number | undefined;
    switch (wish.kind) {
      case "trip": {
        let held = 0;
        for (const j of path) held += plan.selects![j]!;
        part = Math.min(1, (held + plan.matchesAfter![from]!) / wish.count);
        partHere = Math.min(1, held / wish.count);
        break;
      }
      case "no-trip":
        part = path.some((j) => plan.selects![j] === 1) ? 0 : 1;
        break;
      case "free-days": {
        let worked = 0;
        for (const d of plan.days!) if (dayCount[d]! > 0) worked++;
        part = (plan.named! - worked) / plan.named!;
        break;
      }
      case "rhythm": {
        const parts: number[] = [];
        if (wish.maxDaysOn !== undefined) {
          if (longest < 0) longest = longestRun(dayCount);
          parts.push(longest <= wish.maxDaysOn ? 1 : wish.maxDaysOn / longest);
        }
        if (wish.weekendsOff === true) {
          const weekends = plan.weekends!;
          const free = weekends.filter((w) => w.every((d) => !(dayCount[d]! > 0))).length;
          parts.push(weekends.length === 0 ? 1 : free / weekends.length);
        }
        part = parts.length === 0 ? 1 : parts.reduce((t, x) => t + x, 0) / parts.length;
        break;
      }
      case "credit":
        part = wish.maxMinutes !== undefined && credit > wish.maxMinutes ? wish.maxMinutes / credit : 1;
        break;
      case "buddy":
        part = c.members.length > 1 ? 1 : 0;
        break;
    }
    ahead += plan.weight * part;
    here += plan.weight * (partHere ?? part);
  }
  return { ahead, here };
}

const alones = new WeakMap<CrewProblem, Float64Array>();

/** For each eligible position: the score of the line holding that trip alone, less the empty line's. */
function scoreAlone(problem: AwardProblem, c: CrewProblem): Float64Array {
  let known = alones.get(c);
  if (!known) {
    const empty = scoreLine(problem, c, []);
    known = Float64Array.from(c.eligible, (k) => scoreLine(problem, c, [k]) - empty);
    alones.set(c, known);
  }
  return known;
}

/** The best legal lines of one crew member under `request`. */
export function priceLines(problem: AwardProblem, c: CrewProblem, request: PriceRequest): PriceResult {
  const { eligible, position } = c;
  const next = problem.next;
  const m = eligible.length;
  const allowed = request.allowed;
  const usable = Uint8Array.from(eligible, (k) => (allowed && !allowed(k) ? 0 : 1));
  // A buddy unit's line fills one position per member on each of its trips.
  const size = c.members.length;
  const gain = Float64Array.from(eligible, (k) => -size * request.cost[k]!);
  // The usable positions, last first (a pool of a few trips makes the whole search small).
  const backwards: number[] = [];
  for (let j = m - 1; j >= 0; j--) if (usable[j]) backwards.push(j);
  // after[j]: the best Σ gain of a chain that follows position j (0: stop there).
  const after = chainAfter(problem, c, gain, usable);
  // The Lagrangian chain bound (chain-bound.ts): far tighter where duals and wishes pull apart.
  // Not within a pool of a few trips (a neighbourhood's search, small already): there its passes over
  // every position cost more than they prune (measured on generated L, where the neighbourhoods then
  // covered fewer trips in the time allowed).
  const pooled = allowed !== undefined;
  const chain = pooled ? neutralBound(m) : chainBound(problem, c, gain, usable, request.scoreWeight, request.threshold, request.boundSteps ?? 4);
  // Best gain per credit minute and per period day at positions ≥ j (positive gains only).
  const perCredit = new Float64Array(m + 1);
  const perDay = new Float64Array(m + 1);
  for (let j = m - 1; j >= 0; j--) {
    const k = eligible[j]!;
    const g = usable[j] ? Math.max(0, gain[j]!) : 0;
    perCredit[j] = Math.max(perCredit[j + 1]!, g / Math.max(1, problem.pairings[k]!.creditMinutes));
    perDay[j] = Math.max(perDay[j + 1]!, g / Math.max(1, problem.dutyDays[k]!.length));
  }
  const ahead = (chain: number, from: number, creditUsed: number, daysUsed: number) =>
    Math.min(chain, (problem.maxCreditMinutes - creditUsed) * perCredit[from]!, (c.maxWorkedDays - daysUsed) * perDay[from]!);
  let rootChain = 0;
  for (const j of backwards) if (gain[j]! + after[j]! > rootChain) rootChain = gain[j]! + after[j]!;
  const alone = request.scoreWeight > 0 ? scoreAlone(problem, c) : undefined;
  // Children are tried best first: the chain bound's value of the trip and what can follow it, plus half
  // of what the trip alone does to the crew member's score (a guide for the order only: measured on the
  // benchmark's month, this order finds positive lines within far fewer nodes than either part alone).
  // Without costs (a best line alone) the trip's own score guides better: in the chain bound's order a
  // 5,000-node search on generated L found no line at all for most crew, and the neighbourhoods stalled.
  let zeroCost = true;
  for (const j of backwards) if (gain[j] !== 0) zeroCost = false;
  const key = new Float64Array(m);
  for (const j of backwards) {
    key[j] = pooled || zeroCost ? gain[j]! + after[j]! + (alone ? request.scoreWeight * alone[j]! : 0) : chain.step(j, -10) + chain.suffix[j]! + (alone ? 0.5 * request.scoreWeight * alone[j]! : 0);
  }
  const order = (js: readonly number[]) => js.filter((j) => usable[j]).sort((a, b) => key[b]! - key[a]! || a - b);
  const rootChildren = order(backwards);
  // Each list of children comes with boundFrom[x]: the most any child from index x on can add to the
  // node's chain base — step(j, −10) + suffix[j] + regainMax — so the walk over it stops once that
  // cannot beat the floor. In a monotone network a position's children are the root's list from
  // chain.tail[j] on, already in order.
  const withBounds = (list: number[]) => {
    const boundFrom = new Float64Array(list.length + 1).fill(-Infinity);
    for (let x = list.length - 1; x >= 0; x--) {
      const j = list[x]!;
      boundFrom[x] = Math.max(boundFrom[x + 1]!, chain.step(j, -10) + chain.suffix[j]! + chain.regainMax);
    }
    return { list, boundFrom };
  };
  const tail = chain.tail;
  const root = withBounds(rootChildren);
  const childrenOf = new Map<number, { list: number[]; boundFrom: Float64Array }>();
  const children = (j: number) => {
    let known = childrenOf.get(j);
    if (!known) {
      const list = tail ? rootChildren.filter((b) => b >= tail[j]!) : order(successorPositions(problem, c, j));
      childrenOf.set(j, (known = withBounds(list)));
    }
    return known;
  };

  const { scoreWeight, maxLines, nodeLimit } = request;
  const minScore = request.minScore ?? -Infinity;
  const pairings = problem.pairings;
  const found: PricedLine[] = [];
  let floor = request.threshold;
  const admit = (line: PricedLine) => {
    found.push(line);
    found.sort((a, b) => b.value - a.value || compareLines(a.pairings, b.pairings));
    if (found.length > maxLines) found.pop();
    if (found.length === maxLines) floor = Math.max(request.threshold, found.at(-1)!.value);
  };

  const path: number[] = [];
  // Period days the path occupies (for wishes) and works on duty (for the days-off and days-on rules).
  const dayCount = new Uint16Array(problem.periodLength);
  const dutyCount = new Uint16Array(problem.periodLength);
  /** The longest run of duty days through `days` (a trip's) were they added: a run only lengthens as trips are added. */
  const runWith = (days: readonly number[]) => {
    let longest = 0;
    for (const d of days) {
      let lo = d;
      let hi = d;
      while (lo > 0 && (dutyCount[lo - 1]! > 0 || days.includes(lo - 1))) lo--;
      while (hi < dutyCount.length - 1 && (dutyCount[hi + 1]! > 0 || days.includes(hi + 1))) hi++;
      longest = Math.max(longest, hi - lo + 1);
    }
    return longest;
  };
  let worked = 0;
  let credit = 0;
  let gainSum = 0;
  let nodes = 0;
  let stopped = false;
  // With the node limit reached: the best bound among the subtrees not yet searched.
  let frontier = -Infinity;
  // states[d]: the engine after path[0..d-1]; states[0] is the fresh line.
  // For a buddy unit, one state per member: the line must be legal for both.
  const states: (LineState[] | undefined)[] = [c.members.map((m) => start(m, problem.instance.ruleSet, problem.engine))];

  /** The engine's state after the whole path, or the depth whose trip breaks a duty rule. */
  const engineState = (): LineState[] | number => {
    for (let d = 1; d <= path.length; d++) {
      if (states[d]) continue;
      const item = { kind: "pairing" as const, pairing: pairings[eligible[path[d - 1]!]!]! };
      const next: LineState[] = [];
      for (const before of states[d - 1]!) {
        const r = extendAll(before, item);
        if (r.violations.length) return d;
        next.push(r.state);
      }
      states[d] = next;
    }
    return states[path.length]!;
  };

  /** Visits the current path as a line, then its extensions; returns the depth to unwind to (dead prefix) or Infinity. */
  const visit = (from: number, chainAfter: number): number => {
    nodes++;
    const bounds = scoreWeight > 0 || minScore > -Infinity ? wishBounds(problem, c, path, dayCount, credit, from) : undefined;
    // No extension of the path can reach the least score asked for.
    if (bounds && bounds.ahead < minScore) return Infinity;
    const optimistic = scoreWeight > 0 ? bounds!.ahead : 0;
    // The chain bound's base at this node: what the line so far is worth to it.
    const base = pooled ? Infinity : gainSum + scoreWeight * nowScore(problem, c, path, dayCount, credit, chain.theta) - chain.kappa * credit - chain.mu * worked + chain.constant;
    const lastDay = path.length ? chain.lastDay[path.at(-1)!]! : -10;
    const chained = path.length ? base + chain.suffix[path.at(-1)!]! : chain.root;
    if (Math.min(chained, gainSum + ahead(chainAfter, from, credit, worked) + scoreWeight * optimistic) <= floor) return Infinity;
    // The path itself as a line (below the credit minimum it cannot be legal).
    const here = scoreWeight > 0 ? bounds!.here : 0;
    if (credit >= problem.minCreditMinutes && gainSum + scoreWeight * here > floor && (bounds?.here ?? 0) >= minScore) {
      const score = scoreLine(problem, c, path.map((j) => eligible[j]!));
      const value = scoreWeight * score + gainSum;
      if (value > floor && score >= minScore) {
        const state = engineState();
        if (typeof state === "number") return state;
        if (state.every((one) => finish(one).legal)) admit({ pairings: path.map((j) => eligible[j]!), score, value });
      }
    }
    const { list: next, boundFrom } = path.length === 0 ? root : children(path.at(-1)!);
    // What the unvisited children from index `from` on could reach (a bound; days ahead are not charged).
    const rest = (fromIndex: number) => {
      for (let x = fromIndex; x < next.length; x++) {
        const j = next[x]!;
        if (base + boundFrom[x]! <= frontier) break;
        const k = eligible[j]!;
        const b = gainSum + gain[j]! + ahead(after[j]!, j + 1, credit + pairings[k]!.creditMinutes, worked) + scoreWeight * optimistic;
        const bc = base + chain.step(j, lastDay) + chain.suffix[j]!;
        if (Math.min(b, bc) > frontier) frontier = Math.min(b, bc);
      }
    };
    for (let index = 0; index < next.length; index++) {
      const j = next[index]!;
      if (base + boundFrom[index]! <= floor) break;
      if (nodes >= nodeLimit) {
        stopped = true;
        rest(index);
        return Infinity;
      }
      const k = eligible[j]!;
      const p = pairings[k]!;
      if (credit + p.creditMinutes > problem.maxCreditMinutes) continue;
      const days = problem.periodDays[k]!;
      const onDuty = problem.dutyDays[k]!;
      let newDays = 0;
      for (const d of onDuty) if (dutyCount[d] === 0) newDays++;
      if (worked + newDays > c.maxWorkedDays) continue;
      if (onDuty.length > 0 && runWith(onDuty) > problem.maxDaysOn) continue;
      if (gainSum + gain[j]! + ahead(after[j]!, j + 1, credit + p.creditMinutes, worked + newDays) + scoreWeight * optimistic <= floor) continue;
      if (base + chain.step(j, lastDay) + chain.suffix[j]! <= floor) continue;
      // push
      path.push(j);
      for (const d of days) dayCount[d]!++;
      for (const d of onDuty) dutyCount[d]!++;
      worked += newDays;
      credit += p.creditMinutes;
      gainSum += gain[j]!;
      states[path.length] = undefined;
      const dead = visit(j + 1, after[j]!);
      // pop
      gainSum -= gain[j]!;
      credit -= p.creditMinutes;
      worked -= newDays;
      for (const d of onDuty) dutyCount[d]!--;
      for (const d of days) dayCount[d]!--;
      path.pop();
      states.length = path.length + 1;
      if (dead <= path.length) return dead;
      if (stopped) {
        rest(index + 1);
        return Infinity;
      }
    }
    return Infinity;
  };
  visit(0, rootChain);

  // Every line not returned was pruned below the floor (≤ the threshold or the best found) or lies in an unsearched subtree.
  const best = found[0]?.value ?? -Infinity;
  return { lines: found, upperBound: Math.min(chain.root, Math.max(best, request.threshold, stopped ? frontier : -Infinity)), exhausted: !stopped, nodes };
}

/** A chain bound that bounds nothing (pooled searches): every test against it passes. */
function neutralBound(m: number): ChainBound {
  return {
    root: Infinity,
    suffix: new Float64Array(m),
    step: () => 0,
    lastDay: new Int32Array(m),
    regainMax: 0,
    tail: undefined,
    kappa: 0,
    mu: 0,
    theta: new Float64Array(0),
    constant: 0,
  };
}

function compareLines(a: readonly number[], b: readonly number[]): number {
  for (let k = 0; k < Math.min(a.length, b.length); k++) if (a[k] !== b[k]) return a[k]! - b[k]!;
  return a.length - b.length;
}

/** Searches of this many nodes stand in for the full ones once the caller's time is up. */
export const HURRIED_NODES = 200;

/** Search nodes for each crew member's best line alone, the same for every method so satisfactions compare. */
export const BEST_LINE_NODES = 40_000;

/**
 * The best line-holder score of each crew member alone (0 when none is legal),
 * and whether each is proven: the search was exhaustive, or its bound is no
 * higher than the line found (a line meeting every wish can leave the search
 * walking subtrees whose bounds tie it in floating point, up to its node limit:
 * on the published base pub2:BAB, 7 of 9 searches).
 */
export function bestScores(
  problem: AwardProblem,
  nodeLimit: number,
  hurry: () => boolean = () => false,
): { best: number[]; exhausted: boolean[]; lines: (number[] | undefined)[] } {
  const zero = new Float64Array(problem.pairings.length);
  const best: number[] = [];
  const exhausted: boolean[] = [];
  const lines: (number[] | undefined)[] = [];
  for (const c of problem.crew) {
    const r = priceLines(problem, c, { scoreWeight: 1, cost: zero, threshold: 0, maxLines: 1, nodeLimit: hurry() ? HURRIED_NODES : nodeLimit });
    best.push(r.lines[0]?.score ?? 0);
    lines.push(r.lines[0]?.pairings);
    exhausted.push(r.exhausted || r.upperBound <= (r.lines[0]?.score ?? 0));
  }
  return { best, exhausted, lines };
}


const unitBests = new WeakMap<AwardProblem, Map<number, number[]>>();

/**
 * Each bidder's members' best scores alone (`best`, by AwardProblem.crew
 * index: each bidder's best line alone): a crew member's is `best`; a buddy
 * unit member's is their own best score over the lines the unit may share
 * (searched once per problem, BEST_LINE_NODES nodes), since the unit flies one
 * line together.
 */
export function memberBests(problem: AwardProblem, best: readonly number[]): number[][] {
  let known = unitBests.get(problem);
  if (!known) unitBests.set(problem, (known = new Map()));
  const zero = new Float64Array(problem.pairings.length);
  return problem.crew.map((c, i) => {
    if (c.members.length === 1) return [best[i]!];
    let scores = known.get(i);
    if (!scores) {
      const { rankDecay, baseLineValue } = problem.instance.settings;
      scores = c.memberWishes.map((wishes) => {
        const alone: CrewProblem = { ...c, memberWishes: [wishes], weighted: wishes.map((wish, r) => ({ wish, weight: rankWeight(r, rankDecay) })), baseValue: baseLineValue };
        return priceLines(problem, alone, { scoreWeight: 1, cost: zero, threshold: 0, maxLines: 1, nodeLimit: BEST_LINE_NODES }).lines[0]?.score ?? 0;
      });
      known.set(i, scores);
    }
    return scores;
  });
}
