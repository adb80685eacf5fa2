/**
 * A Lagrangian chain bound for line generation: an upper bound on
 *
 *     value(ℓ) = scoreWeight · lineScore(ℓ) − Σ_{p ∈ ℓ} cost_p
 *
 * over every legal line of one crew member, and, for each eligible position j,
 * on what any continuation can add to a line whose last trip is j. It is a
 * longest path over the crew member's network with
 *
 * - the credit window and the most days worked moved into the objective with
 *   multipliers (κ for credit: κ ≥ 0 prices the maximum, κ < 0 the minimum;
 *   μ ≥ 0 for days): κ·(limit − credit) and μ·(maxDays − days) are ≥ 0 on every
 *   legal line, so adding them can only raise its value;
 * - each wish's part replaced by one that is never below it and adds up trip by
 *   trip: a trip wish min(1, h/k) ≤ θ + (1 − θ)·h/k for any θ ∈ [0, 1]; a free
 *   date or a free weekend is lost once, by the first trip that touches it
 *   (exact: see below); the other parts (no trip from a set, credit range,
 *   longest run, buddy) are taken at their best, 1 — or at what the line so far
 *   has already fixed, since they only fall as trips are added;
 * - every other line rule dropped (a relaxation: fewer lines are excluded).
 *
 * Days are counted exactly along a chain: a trip starts after the previous one
 * ends, so the only period day it can share with the chain so far is the last
 * day of the previous trip, and the only weekend it can share is the one
 * holding that day. So a trip's new days, dates and weekends depend on the
 * previous trip alone, and the longest path is exact for them.
 *
 * The network of a group is "monotone" on every instance seen (a trip that may
 * follow another is followed in turn by every later-starting one: the pairwise
 * rules are minimum rests and gaps); then a position's successors are a tail of
 * the positions in report order and the longest path is a suffix maximum, a
 * linear pass. Otherwise the arcs are walked one by one.
 *
 * The multipliers are tuned by a few subgradient steps (Polyak steps towards
 * the threshold the caller cares about) and remembered per crew member, so that
 * later calls — the next pricing round — start from them. Any multipliers give
 * a valid bound; tuning only tightens it.
 */
import type { Wish } from "../domain/index.ts";
import { matchesTripSelection, periodWeekends } from "../domain/index.ts";
import { daysBetween } from "../domain/time.ts";
import type { AwardProblem, CrewProblem } from "./problem.ts";

/** The crew member's wishes compiled for the bound: trip-wish selections, date and weekend losses. */
interface Compiled {
  /** positions in report order: first and last period day (−1 / −2 when the trip has none inside the period) */
  firstDay: Int32Array;
  lastDay: Int32Array;
  /** the first position whose first period day is ≥ d, for d = 0 … periodLength + 1 */
  fromDay: Int32Array;
  /** successors of position j are positions ≥ tail[j] (monotone network), or undefined */
  tail: Int32Array | undefined;
  /** trip wishes: rank weight, count, selected positions */
  trips: { weight: number; count: number; selects: Uint8Array }[];
  /** per period day: the loss in score when the day is first worked (free-days wishes) */
  dayLoss: Float64Array;
  /** per period day: its weekend's index, or −1 */
  weekendOf: Int32Array;
  /** the loss in score when a weekend is first touched (rhythm wishes with weekends off) */
  weekendLoss: number;
  /** the score of the empty line with every trip wish's part at θ = 0 (θ adds weight·θ) and every other part at 1 */
  emptyScore: number;
  /** per position: its fresh part without multipliers or trip bonuses: −Σ day losses − weekend losses (score units) */
  freshLoss: Float64Array;
  /** per position: duty days inside the period */
  dutyCount: Int32Array;
  /** each wish compiled for nowScore, in rank order */
  parts: Part[];
}

type Part =
  | { kind: "trip"; weight: number; trip: number }
  | { kind: "no-trip"; weight: number; selects: Uint8Array }
  | { kind: "free-days"; weight: number; days: number[]; named: number }
  | { kind: "rhythm"; weight: number; maxDaysOn: number | undefined; weekends: number[][] | undefined }
  | { kind: "credit"; weight: number; maxMinutes: number | undefined }
  | { kind: "constant"; weight: number };

const compiledByCrew = new WeakMap<CrewProblem, Compiled>();

function compile(problem: AwardProblem, c: CrewProblem): Compiled {
  const known = compiledByCrew.get(c);
  if (known) return known;
  const { eligible } = c;
  const m = eligible.length;
  const L = problem.periodLength;
  const { zone, periodStart, periodEnd } = problem.score;
  const firstDay = new Int32Array(m);
  const lastDay = new Int32Array(m);
  for (let j = 0; j < m; j++) {
    const days = problem.periodDays[eligible[j]!]!;
    firstDay[j] = days.length ? days[0]! : L + 1;
    lastDay[j] = days.length ? days.at(-1)! : -2;
  }
  const fromDay = new Int32Array(L + 3);
  for (let d = 0, j = 0; d < fromDay.length; d++) {
    while (j < m && firstDay[j]! < d) j++;
    fromDay[d] = j;
  }
  const tail = crewTails(problem, c);
  const trips: Compiled["trips"] = [];
  const dayLoss = new Float64Array(L);
  const weekendOf = new Int32Array(L).fill(-1);
  const weekends = periodWeekends(periodStart, periodEnd).map((w) => w.map((date) => daysBetween(periodStart, date)));
  weekends.forEach((w, index) => w.forEach((d) => d >= 0 && d < L && (weekendOf[d] = index)));
  let weekendLoss = 0;
  let emptyScore = c.baseValue;
  const parts: Part[] = [];
  const inPeriod = (d: number) => d >= 0 && d < L;
  const shared = c.members.length > 1; // a buddy unit: its members' buddy wishes are met by any line they share
  c.weighted.forEach(({ wish, weight }: { wish: Wish; weight: number }) => {
    switch (wish.kind) {
      case "trip":
        parts.push({ kind: "trip", weight, trip: trips.length });
        break;
      case "no-trip":
        parts.push({ kind: "no-trip", weight, selects: Uint8Array.from(eligible, (k) => (matchesTripSelection(wish, problem.pairings[k]!, zone) ? 1 : 0)) });
        break;
      case "free-days":
        parts.push({ kind: "free-days", weight, days: wish.dates.map((date) => daysBetween(periodStart, date)).filter(inPeriod), named: wish.dates.length });
        break;
      case "rhythm":
        parts.push({ kind: "rhythm", weight, maxDaysOn: wish.maxDaysOn, weekends: wish.weekendsOff === true ? weekends.map((w) => w.filter(inPeriod)) : undefined });
        break;
      case "credit":
        parts.push({ kind: "credit", weight, maxMinutes: wish.maxMinutes });
        break;
      case "buddy":
        parts.push({ kind: "constant", weight: shared ? weight : 0 });
        break;
    }
    switch (wish.kind) {
      case "trip":
        trips.push({ weight, count: wish.count, selects: Uint8Array.from(eligible, (k) => (matchesTripSelection(wish, problem.pairings[k]!, zone) ? 1 : 0)) });
        return; // its empty-line part is weight·θ, added by the caller
      case "free-days":
        for (const date of wish.dates) {
          const d = daysBetween(periodStart, date);
          if (d >= 0 && d < L) dayLoss[d] = dayLoss[d]! + weight / wish.dates.length;
        }
        break;
      case "rhythm": {
        const parts = (wish.maxDaysOn !== undefined ? 1 : 0) + (wish.weekendsOff === true ? 1 : 0);
        if (wish.weekendsOff === true && weekends.length > 0) weekendLoss += weight / parts / weekends.length;
        break;
      }
      case "buddy":
        if (!shared) return; // 0 outside a buddy unit
        break;
      default:
        break;
    }
    emptyScore += weight;
  });
  const freshLoss = new Float64Array(m);
  const dutyCount = new Int32Array(m);
  for (let j = 0; j < m; j++) {
    const k = eligible[j]!;
    let loss = 0;
    let lastWeekend = -1;
    for (const d of problem.periodDays[k]!) {
      loss += dayLoss[d]!;
      const w = weekendOf[d]!;
      if (w >= 0 && w !== lastWeekend) loss += weekendLoss;
      if (w >= 0) lastWeekend = w;
    }
    freshLoss[j] = loss;
    dutyCount[j] = problem.dutyDays[k]!.length;
  }
  const compiled: Compiled = { firstDay, lastDay, fromDay, tail, trips, dayLoss, weekendOf, weekendLoss, emptyScore, freshLoss, dutyCount, parts };
  compiledByCrew.set(c, compiled);
  return compiled;
}

/** The group's monotone tails (problem.ts) in one crew member's positions: the first successor position of each (m when none). */
function crewTails(problem: AwardProblem, c: CrewProblem): Int32Array | undefined {
  const tails = problem.tails;
  if (!tails) return undefined;
  const { eligible } = c;
  const m = eligible.length;
  const ranks = Int32Array.from(eligible, (k) => tails.rank[k]!);
  const tail = new Int32Array(m);
  for (let j = 0; j < m; j++) {
    // The first position whose rank is at least the first successor's (positions are in rank order).
    const want = tails.first[eligible[j]!]!;
    let lo = j + 1;
    let hi = m;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (ranks[mid]! < want) lo = mid + 1;
      else hi = mid;
    }
    tail[j] = lo;
  }
  return tail;
}

export interface ChainBound {
  /** no legal line has a value above this */
  root: number;
  /**
   * bound(j): for a line whose last trip is at position j, with `now` the
   * bound on its score so far (nowScore), its Σ −cost `gain`, credit and days
   * worked, no extension is worth more than
   *   gain + scoreWeight·now − κ·credit − μ·days + constant + suffix[j]
   */
  suffix: Float64Array;
  /** what position b adds when it follows a trip whose last period day is `last` (with the multipliers) */
  step: (b: number, last: number) => number;
  /** each position's last period day (−2 when it has none inside the period): the `last` of `step` */
  lastDay: Int32Array;
  /** step(b, last) ≤ step(b, −10) + regainMax for every b and last */
  regainMax: number;
  /** the first successor position of each position in a monotone network, else undefined */
  tail: Int32Array | undefined;
  kappa: number;
  mu: number;
  /** θ per trip wish, in the order of the crew member's trip wishes */
  theta: Float64Array;
  constant: number;
}

interface Multipliers {
  kappa: number;
  mu: number;
  theta: Float64Array;
}

const remembered = new WeakMap<CrewProblem, Multipliers>();

/**
 * The bound for one request (gain[j] = −cost of position j's trip; usable[j]
 * whether position j may be used), with multipliers tuned by `steps`
 * subgradient steps towards `target` (the value the caller must beat).
 */
export function chainBound(
  problem: AwardProblem,
  c: CrewProblem,
  gain: Float64Array,
  usable: Uint8Array,
  scoreWeight: number,
  target: number,
  steps: number,
): ChainBound {
  const cc = compile(problem, c);
  const maxC = problem.maxCreditMinutes;
  const minC = problem.minCreditMinutes;
  const maxW = c.maxWorkedDays;
  const credit = Float64Array.from(c.eligible, (k) => problem.pairings[k]!.creditMinutes);
  const start = remembered.get(c);
  let current: Multipliers = start
    ? { kappa: start.kappa, mu: start.mu, theta: Float64Array.from(start.theta) }
    : { kappa: 0, mu: 0, theta: new Float64Array(cc.trips.length).fill(0.5) };
  let best: ChainBound | undefined;
  let bestM = current;
  for (let step = 0; ; step++) {
    const pass = chainPass(problem, c, cc, gain, usable, credit, scoreWeight, current);
    if (!best || pass.bound.root < best.root) {
      best = pass.bound;
      bestM = current;
    }
    if (step >= steps || best.root <= target) break;
    // A subgradient of the bound at these multipliers, from the chain that attains it.
    const { chain } = pass;
    let lineCredit = 0;
    let days = 0;
    let last = -10;
    const held = new Float64Array(cc.trips.length);
    for (const j of chain) {
      lineCredit += credit[j]!;
      days += cc.dutyCount[j]! - (last >= 0 && problem.dutyDays[c.eligible[j]!]!.includes(last) ? 1 : 0);
      cc.trips.forEach((t, r) => (held[r]! += t.selects[j]!));
      last = cc.lastDay[j]!;
    }
    // Work in units of value (u = κ·cScale, μ·wScale, θ·scoreWeight·weight), where a Polyak step is natural.
    const cScale = Number.isFinite(maxC) ? maxC : Math.max(1, minC);
    const wScale = Number.isFinite(maxW) ? maxW : 1;
    let dCredit = 0; // ∂bound/∂κ: the credit limit in force less the chain's credit
    if (current.kappa > 0 || (current.kappa === 0 && lineCredit > maxC)) dCredit = maxC - lineCredit;
    else if (current.kappa < 0 || (current.kappa === 0 && lineCredit < minC)) dCredit = minC - lineCredit;
    const gKappa = Number.isFinite(dCredit) ? dCredit / cScale : 0;
    const gMu = Number.isFinite(maxW) ? (maxW - days) / wScale : 0;
    const gTheta = cc.trips.map((t, r) => (scoreWeight * t.weight > 0 ? 1 - held[r]! / t.count : 0));
    let norm = gKappa * gKappa + gMu * gMu;
    for (const g of gTheta) norm += g * g;
    if (norm <= 1e-18) break;
    const excess = Number.isFinite(target) ? pass.bound.root - target : Math.max(1e-6, 0.1 * Math.abs(pass.bound.root));
    const t = excess / norm / 2;
    let kappa = current.kappa - (t * gKappa) / cScale;
    if (!Number.isFinite(maxC)) kappa = Math.min(0, kappa);
    if (minC <= 0) kappa = Math.max(0, kappa);
    const mu = Number.isFinite(maxW) ? Math.max(0, current.mu - (t * gMu) / wScale) : 0;
    const theta = Float64Array.from(current.theta, (th, r) => {
      const w = scoreWeight * cc.trips[r]!.weight;
      return w > 0 ? Math.min(1, Math.max(0, th - (t * gTheta[r]!) / w)) : th;
    });
    current = { kappa, mu, theta };
  }
  remembered.set(c, { kappa: bestM.kappa, mu: bestM.mu, theta: Float64Array.from(bestM.theta) });
  return best!;
}

/** The best Σ gain of a chain after each position, no score and no multipliers (0: stop there). */
export function chainAfter(problem: AwardProblem, c: CrewProblem, gain: Float64Array, usable: Uint8Array): Float64Array {
  const cc = compile(problem, c);
  const credit = new Float64Array(c.eligible.length);
  return chainPass(problem, c, cc, gain, usable, credit, 0, { kappa: 0, mu: 0, theta: new Float64Array(cc.trips.length) }).bound.suffix;
}

function chainPass(
  problem: AwardProblem,
  c: CrewProblem,
  cc: Compiled,
  gain: Float64Array,
  usable: Uint8Array,
  credit: Float64Array,
  sw: number,
  mult: Multipliers,
): { bound: ChainBound; chain: number[] } {
  const m = c.eligible.length;
  const { kappa, mu, theta } = mult;
  const maxC = problem.maxCreditMinutes;
  const minC = problem.minCreditMinutes;
  const maxW = c.maxWorkedDays;
  const constant = (kappa > 0 ? kappa * maxC : kappa < 0 ? kappa * minC : 0) + (mu > 0 ? mu * maxW : 0);
  // fresh[b]: what b adds with all of its days new.
  const fresh = new Float64Array(m);
  const list: number[] = [];
  for (let b = 0; b < m; b++) if (usable[b]) list.push(b);
  for (const b of list) {
    let bonus = 0;
    for (let r = 0; r < cc.trips.length; r++) {
      const t = cc.trips[r]!;
      if (t.selects[b]) bonus += (t.weight * (1 - theta[r]!)) / t.count;
    }
    fresh[b] = gain[b]! - kappa * credit[b]! - mu * cc.dutyCount[b]! + sw * (bonus - cc.freshLoss[b]!);
  }
  const dutyDays = problem.dutyDays;
  const periodDays = problem.periodDays;
  const eligible = c.eligible;
  /** What b's value regains when the previous trip's last day is `last` (a day or weekend already counted). */
  const regain = (b: number, last: number): number => {
    if (last < 0 || last >= problem.periodLength || cc.firstDay[b]! > last + 1) return 0;
    const k = eligible[b]!;
    let r = 0;
    const days = periodDays[k]!;
    if (days.includes(last)) r += sw * cc.dayLoss[last]!;
    if (dutyDays[k]!.includes(last)) r += mu;
    const w = cc.weekendOf[last]!;
    if (w >= 0 && days.some((d) => cc.weekendOf[d] === w)) r += sw * cc.weekendLoss;
    return r;
  };
  const step = (b: number, last: number) => fresh[b]! + regain(b, last);
  const suffix = new Float64Array(m);
  const choice = new Int32Array(m).fill(-1);
  // best[i]: the best fresh[b] + suffix[b] over usable positions b ≥ i, and which b.
  const bestFrom = new Float64Array(m + 1).fill(-Infinity);
  const bestAt = new Int32Array(m + 1).fill(-1);
  // The best next trip after a trip whose last period day is `last`: offer(b, last) for each candidate.
  let value = 0;
  let chosen = -1;
  const offer = (b: number, last: number) => {
    const v = step(b, last) + suffix[b]!;
    if (v > value) {
      value = v;
      chosen = b;
    }
  };
  const tail = cc.tail;
  if (tail && list.length * list.length <= 8 * m) {
    // A small pool of usable trips (a neighbourhood's): arc by arc over the pool alone.
    let after = -Infinity; // best fresh + suffix over the pool from the current index on
    let afterAt = -1;
    for (let x = list.length - 1; x >= 0; x--) {
      const j = list[x]!;
      const last = cc.lastDay[j]!;
      value = 0;
      chosen = -1;
      for (let y = x + 1; y < list.length; y++) if (list[y]! >= tail[j]!) offer(list[y]!, last);
      suffix[j] = value;
      choice[j] = chosen;
      if (fresh[j]! + value > after) {
        after = fresh[j]! + value;
        afterAt = j;
      }
    }
    bestFrom[0] = after;
    bestAt[0] = afterAt;
  } else {
    for (let j = m - 1; j >= 0; j--) {
      if (!usable[j]) {
        bestFrom[j] = bestFrom[j + 1]!;
        bestAt[j] = bestAt[j + 1]!;
        continue;
      }
      value = 0;
      chosen = -1;
      const last = cc.lastDay[j]!;
      if (tail) {
        const from = tail[j]!;
        // Positions starting on the last day or the day after may share a day or a weekend: one by one.
        const near = Math.max(from, cc.fromDay[Math.min(cc.fromDay.length - 1, Math.max(0, last + 2))]!);
        for (let b = from; b < near; b++) if (usable[b]) offer(b, last);
        if (bestFrom[near]! > value) {
          value = bestFrom[near]!;
          chosen = bestAt[near]!;
        }
      } else {
        for (const k of problem.next[eligible[j]!]!) {
          const b = c.position[k]!;
          if (b >= 0 && usable[b]) offer(b, last);
        }
      }
      suffix[j] = value;
      choice[j] = chosen;
      const here = fresh[j]! + value;
      if (here > bestFrom[j + 1]!) {
        bestFrom[j] = here;
        bestAt[j] = j;
      } else {
        bestFrom[j] = bestFrom[j + 1]!;
        bestAt[j] = bestAt[j + 1]!;
      }
    }
  }
  let thetaPart = 0;
  cc.trips.forEach((t, r) => (thetaPart += t.weight * theta[r]!));
  const rootChain = Math.max(0, bestFrom[0]!);
  const root = sw * (cc.emptyScore + thetaPart) + constant + rootChain;
  const chain: number[] = [];
  for (let j = bestFrom[0]! > 0 ? bestAt[0]! : -1; j >= 0; j = choice[j]!) chain.push(j);
  let maxDayLoss = 0;
  for (const x of cc.dayLoss) if (x > maxDayLoss) maxDayLoss = x;
  const regainMax = Math.max(0, mu) + Math.max(0, sw) * (maxDayLoss + cc.weekendLoss);
  return { bound: { root, suffix, step, lastDay: cc.lastDay, regainMax, tail: cc.tail, kappa, mu, theta: Float64Array.from(theta), constant }, chain };
}

/**
 * The bound on the score of every extension of the current line (positions
 * `path`, period days `dayCount`, `credit`) that the chain bound starts from:
 * the line so far with each trip wish at θ + (1 − θ)·held/k, free dates and
 * weekends as they stand, and the parts that only fall (no trip from a set, a
 * credit maximum already passed, the longest run so far) as they stand; a
 * credit minimum and buddy at their best.
 */
export function nowScore(problem: AwardProblem, c: CrewProblem, path: readonly number[], dayCount: ArrayLike<number>, credit: number, theta: Float64Array): number {
  const cc = compile(problem, c);
  let score = c.baseValue;
  for (const part of cc.parts) {
    const { weight } = part;
    switch (part.kind) {
      case "trip": {
        const t = cc.trips[part.trip]!;
        const th = theta[part.trip]!;
        let held = 0;
        for (const j of path) held += t.selects[j]!;
        score += weight * (th + ((1 - th) * held) / t.count);
        break;
      }
      case "no-trip": {
        let heldOne = false;
        for (const j of path) if (part.selects[j]) heldOne = true;
        if (!heldOne) score += weight;
        break;
      }
      case "free-days": {
        let worked = 0;
        for (const d of part.days) if (dayCount[d]! > 0) worked++;
        score += (weight * (part.named - worked)) / part.named;
        break;
      }
      case "rhythm": {
        let sum = 0;
        let count = 0;
        if (part.maxDaysOn !== undefined) {
          let run = 0;
          let longest = 0;
          for (let d = 0; d < problem.periodLength; d++) {
            run = dayCount[d]! > 0 ? run + 1 : 0;
            if (run > longest) longest = run;
          }
          sum += longest <= part.maxDaysOn ? 1 : part.maxDaysOn / longest;
          count++;
        }
        if (part.weekends) {
          let free = 0;
          for (const w of part.weekends) if (w.every((d) => !(dayCount[d]! > 0))) free++;
          sum += part.weekends.length === 0 ? 1 : free / part.weekends.length;
          count++;
        }
        score += count === 0 ? weight : (weight * sum) / count;
        break;
      }
      case "credit":
        score += part.maxMinutes !== undefined && credit > part.maxMinutes ? (weight * part.maxMinutes) / credit : weight;
        break;
      case "constant":
        score += weight;
        break;
    }
  }
  return score;
}
