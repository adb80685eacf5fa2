/**
 * One award group made ready for solving: crew in seniority order with their
 * weights and wishes, each crew member's eligible pairings and the legal
 * successor relation between them (the network), and the pairings that no
 * one may fly because they break the rule set by themselves.
 */
import type { CrewMember, Instance, Pairing, Wish } from "../domain/index.ts";
import { lineScore, rankWeight, type ScoreContext } from "../domain/index.ts";
import { pairingDates } from "../domain/pairing-facts.ts";
import { daysBetween, instantMs, localDatesTouched } from "../domain/time.ts";
import { canFollow, checkLine, dutyRulesOnly, extendAll, finish, requiredDaysOff, start, type EngineContext, type LineResult } from "../rules/index.ts";

/**
 * One bidder of the award: a crew member, or a buddy unit — two crew members
 * of the group who named each other in buddy wishes, awarded one shared line
 * (both fly its trips) at the junior member's seniority (DESIGN.md's contract;
 * see buddyUnits below for when a pair forms one).
 */
export interface CrewProblem {
  /** the crew member; for a buddy unit its junior member, whose place in seniority order the unit takes */
  crew: CrewMember;
  /** who holds the line: the crew member alone, or the unit's two members, senior first */
  members: readonly CrewMember[];
  /** each member's wishes, in the order of `members` */
  memberWishes: readonly (readonly Wish[])[];
  /** 0 = most senior (the index in AwardProblem.crew) */
  rank: number;
  /** W_i: see seniorityWeight(); a unit's is the sum of its members' weights at the junior's place */
  weight: number;
  /** each member's part of `weight` */
  memberWeights: readonly number[];
  /** every wish that counts in the line's score with its rank weight (a unit: both members' wishes) */
  weighted: readonly { wish: Wish; weight: number }[];
  /** the line's score before wishes: the base value B, once per member */
  baseValue: number;
  /** pairing indices this crew member may fly, by report time (a unit: those both may fly that need two or more of the position) */
  eligible: number[];
  /** by pairing index: its position in `eligible`, −1 when not eligible */
  position: Int32Array;
  /** the most base-local period dates a line may work (days-off rule), Infinity without one */
  maxWorkedDays: number;
}

export interface IllegalPairing {
  pairingId: string;
  text: string;
}

export interface AwardProblem {
  instance: Instance;
  pairings: readonly Pairing[];
  /** crew of the group's position each pairing needs */
  need: number[];
  /** report and release, epoch ms */
  startMs: number[];
  endMs: number[];
  /** per pairing: its base-local dates inside the period, as day numbers from the period's start */
  periodDays: number[][];
  /**
   * per pairing: the period days its duties touch (report to release) — what the
   * days-off and days-on rules count; a layover day with no duty is not among them
   */
  dutyDays: number[][];
  /**
   * by pairing index: the pairings that may follow it in a line (report order),
   * the same for the whole group — the network; a crew member's own network is
   * this one restricted to their eligible pairings (see successorPositions)
   */
  next: Int32Array[];
  /**
   * when every pairing's successors are all the pairings of report order from
   * its first successor on (a "monotone" network: the pairwise rules are
   * minimum rests and gaps), each pairing's rank in report order and the rank
   * of its first successor (the count of pairings when it has none); else undefined
   */
  tails?: { rank: Int32Array; first: Int32Array };
  engine: EngineContext;
  score: ScoreContext;
  /** seniority order */
  crew: CrewProblem[];
  illegal: IllegalPairing[];
  /** the credit window's maximum, Infinity without one */
  maxCreditMinutes: number;
  /** the longest run of worked days the days-on rule allows, Infinity without one */
  maxDaysOn: number;
  /** the credit window's minimum for a line-holder line, 0 without one */
  minCreditMinutes: number;
  periodLength: number;
}

/** One crew member alone as a bidder (its `rank` is set once the group's order stands). */
function single(member: CrewMember, wishes: readonly Wish[], weight: number, eligible: number[], P: number, maxWorkedDays: number, instance: Instance): CrewProblem {
  const position = new Int32Array(P).fill(-1);
  eligible.forEach((k, j) => (position[k] = j));
  const { rankDecay, baseLineValue } = instance.settings;
  return {
    crew: member,
    members: [member],
    memberWishes: [wishes],
    rank: -1,
    weight,
    memberWeights: [weight],
    weighted: wishes.map((wish, r) => ({ wish, weight: rankWeight(r, rankDecay) })),
    baseValue: baseLineValue,
    eligible,
    position,
    maxWorkedDays,
  };
}

/**
 * The seniority weight of the crew member of 0-based rank `rank` among `n`:
 * 1 + β(n − 1 − rank)/n — the most senior gets 1 + β(n − 1)/n, the most junior 1
 * (AWARD-MODEL.md's W_i = 1 + β(n − i)/n with i counted from 1) — times the
 * crew member's carried fairness weight.
 */
export function seniorityWeight(rank: number, n: number, beta: number, carriedWeight: number): number {
  return (1 + (beta * (n - 1 - rank)) / n) * carriedWeight;
}

/** Prepares an instance (already parsed by instanceSchema). */
export function prepareProblem(instance: Instance): AwardProblem {
  const { period, ruleSet, settings, group } = instance;
  const engine: EngineContext = { stations: instance.stations, zone: period.zone, periodStart: period.startDate, periodEnd: period.endDate };
  const score: ScoreContext = { zone: period.zone, periodStart: period.startDate, periodEnd: period.endDate };
  const pairings = instance.pairings;
  const need = pairings.map((p) => p.crewNeeded[group.position] ?? 0);
  const startMs = pairings.map((p) => instantMs(p.dutyPeriods[0]!.report));
  const endMs = pairings.map((p) => instantMs(p.dutyPeriods.at(-1)!.release));
  const periodLength = daysBetween(period.startDate, period.endDate) + 1;
  const dayNumbers = (dates: Iterable<string>) =>
    [...new Set(dates)].map((date) => daysBetween(period.startDate, date)).filter((d) => d >= 0 && d < periodLength).sort((a, b) => a - b);
  const periodDays = pairings.map((p) => dayNumbers(pairingDates(p, period.zone)));
  const dutyDays = pairings.map((p) => dayNumbers(p.dutyPeriods.flatMap((d) => localDatesTouched(d.report, d.release, period.zone))));

  // A pairing that breaks a duty or rest rule by itself, for a crew member
  // with no history, is illegal for everyone: reported and left open.
  const dutyOnly = dutyRulesOnly(ruleSet);
  const illegal: IllegalPairing[] = [];
  const illegalAt = new Set<number>();
  const neutral: CrewMember = {
    id: "-", name: "-", seniority: 1, base: group.base, position: group.position, qualifications: [],
    fixedActivities: [], carryIn: [], lookBack: { duties: [], dailyFlightMinutes: [] }, carriedWeight: 1,
  };
  pairings.forEach((p, k) => {
    if (need[k]! <= 0) return;
    const r = extendAll(start(neutral, dutyOnly, engine), { kind: "pairing", pairing: p });
    if (r.violations.length) {
      illegalAt.add(k);
      illegal.push({ pairingId: p.id, text: r.violations.map((v) => v.text).join("; ") });
    }
  });

  const creditRule = ruleSet.rules.find((r) => (r.params.check ?? r.id) === "credit-window");
  const maxCredit = creditRule?.params.maxMinutes;
  const maxCreditMinutes = typeof maxCredit === "number" ? maxCredit : Infinity;
  const minCredit = creditRule?.params.minMinutes;
  const minCreditMinutes = typeof minCredit === "number" ? minCredit : 0;
  const daysOnRule = ruleSet.rules.find((r) => (r.params.check ?? r.id) === "max-days-on");
  const maxDaysOn = typeof daysOnRule?.params.days === "number" ? daysOnRule.params.days : Infinity;
  const hasDaysOff = ruleSet.rules.some((r) => (r.params.check ?? r.id) === "min-days-off");
  const maxWorkedDays = hasDaysOff ? periodLength - requiredDaysOff(ruleSet.rules, periodLength, false) : Infinity;

  const order = pairings.map((_, k) => k).sort((a, b) => startMs[a]! - startMs[b]! || pairings[a]!.id.localeCompare(pairings[b]!.id));
  // Which pairing may follow which: asked once for the group, since the
  // pairwise rules read nothing of a crew member but the base, which the whole
  // group shares (checks/min-rest.ts, no-overlap.ts, days-between-trips.ts).
  const P = pairings.length;
  const next: Int32Array[] = pairings.map(() => new Int32Array(0));
  const anyone = instance.crew[0];
  if (anyone) {
    const live = order.filter((k) => need[k]! > 0);
    for (const a of live) {
      const after: number[] = [];
      for (const b of live) {
        if (startMs[b]! >= endMs[a]! && canFollow(anyone, ruleSet, pairings[a]!, pairings[b]!, engine)) after.push(b);
      }
      next[a] = Int32Array.from(after);
    }
  }
  const tails = monotoneTails(order.filter((k) => need[k]! > 0), next, P);
  const sorted = [...instance.crew].sort((a, b) => a.seniority - b.seniority);
  const n = sorted.length;
  const singles = sorted.map((member, rank): CrewProblem => {
    const fresh = start(member, ruleSet, engine);
    const eligible = order.filter((k) => {
      if (need[k]! <= 0 || illegalAt.has(k)) return false;
      const p = pairings[k]!;
      if (!p.requires.every((q) => member.qualifications.includes(q))) return false;
      if (p.creditMinutes > maxCreditMinutes) return false;
      // Legal on its own for this crew member: history, carry-in and fixed activities.
      return extendAll(fresh, { kind: "pairing", pairing: p }).violations.length === 0;
    });
    const weight = seniorityWeight(rank, n, settings.seniorityWeight, member.carriedWeight);
    return single(member, instance.bids[member.id] ?? [], weight, eligible, P, maxWorkedDays, instance);
  });
  const crew = buddyUnits(singles, need, { pairings, ruleSet, engine, minCreditMinutes, instance });
  crew.forEach((c, rank) => (c.rank = rank));
  return { instance, pairings, need, startMs, endMs, periodDays, dutyDays, next, ...(tails ? { tails } : {}), engine, score, crew, illegal, maxCreditMinutes, maxDaysOn, minCreditMinutes, periodLength };
}

/**
 * The bidders of the group in seniority order, buddy units in place of their
 * members. Two crew members form a unit when each one's bid names the other in
 * a buddy wish, some pairing needs two or more of the group's position and
 * both may fly it, and a shared line is legal for both: some first fit of the
 * shared trips (sharedLineExists) must pass both members' line rules. That is
 * a quick screen, not a search: a pair it refuses bids as two crew members,
 * each buddy wish then scoring 0, as for a pair that may share no trip. The unit takes the junior's
 * place in seniority order; its weight is both members' weights there.
 */
function buddyUnits(
  singles: CrewProblem[],
  need: readonly number[],
  ctx: { pairings: readonly Pairing[]; ruleSet: Instance["ruleSet"]; engine: EngineContext; minCreditMinutes: number; instance: Instance },
): CrewProblem[] {
  const byId = new Map(singles.map((c, i) => [c.crew.id, i]));
  const buddyOf = (c: CrewProblem) => c.memberWishes[0]!.find((w) => w.kind === "buddy")?.crewId;
  const joined = new Map<number, CrewProblem>(); // junior's index → unit
  const taken = new Set<number>();
  const n = singles.length;
  singles.forEach((a, i) => {
    const j = byId.get(buddyOf(a) ?? "");
    if (j === undefined || j <= i || buddyOf(singles[j]!) !== a.crew.id) return;
    const b = singles[j]!;
    const eligible = a.eligible.filter((k) => need[k]! >= 2 && b.position[k]! >= 0);
    if (eligible.length === 0 || !sharedLineExists([a.crew, b.crew], eligible, ctx)) return;
    const unit = single(b.crew, b.memberWishes[0]!, 0, eligible, need.length, Math.min(a.maxWorkedDays, b.maxWorkedDays), ctx.instance);
    const memberWeights = [a, b].map((m) => seniorityWeight(j, n, ctx.instance.settings.seniorityWeight, m.crew.carriedWeight));
    const weight = memberWeights[0]! + memberWeights[1]!;
    joined.set(j, {
      ...unit,
      members: [a.crew, b.crew],
      memberWishes: [a.memberWishes[0]!, b.memberWishes[0]!],
      weight,
      memberWeights,
      weighted: [...a.weighted, ...b.weighted],
      baseValue: a.baseValue + b.baseValue,
    });
    taken.add(i);
  });
  return singles.flatMap((c, i) => (taken.has(i) ? [] : [joined.get(i) ?? c]));
}

/**
 * Whether a first fit of `eligible` (see buddyUnits) is a legal line for every
 * member: from each shared trip in turn, the trips from there on in report
 * order, taken while legal for both, until the credit minimum is reached.
 */
function sharedLineExists(
  members: readonly CrewMember[],
  eligible: readonly number[],
  ctx: { pairings: readonly Pairing[]; ruleSet: Instance["ruleSet"]; engine: EngineContext; minCreditMinutes: number },
): boolean {
  const fresh = members.map((m) => start(m, ctx.ruleSet, ctx.engine));
  return eligible.some((_, from) => {
    let states = fresh;
    let credit = 0;
    for (const k of eligible.slice(from)) {
      if (credit >= ctx.minCreditMinutes && credit > 0) break;
      const item = { kind: "pairing" as const, pairing: ctx.pairings[k]! };
      const next = states.map((s) => extendAll(s, item));
      if (next.some((r) => r.violations.length)) continue;
      states = next.map((r) => r.state);
      credit += ctx.pairings[k]!.creditMinutes;
    }
    return credit > 0 && states.every((s) => finish(s).legal);
  });
}

/** The ranks behind AwardProblem.tails, or undefined when some pairing's successors are not a tail of report order. */
function monotoneTails(live: readonly number[], next: readonly Int32Array[], P: number): AwardProblem["tails"] {
  const rank = new Int32Array(P).fill(-1);
  live.forEach((k, r) => (rank[k] = r));
  const first = new Int32Array(P).fill(live.length);
  for (const a of live) {
    const after = next[a]!;
    if (after.length === 0) continue;
    const r = rank[after[0]!]!;
    if (after.length !== live.length - r) return undefined;
    for (let x = 0; x < after.length; x++) if (rank[after[x]!] !== r + x) return undefined;
    first[a] = r;
  }
  return { rank, first };
}

/** The positions in `c.eligible` whose pairing may follow the one at position `j`, ascending. */
export function successorPositions(problem: AwardProblem, c: CrewProblem, j: number): number[] {
  const out: number[] = [];
  for (const b of problem.next[c.eligible[j]!]!) {
    const s = c.position[b]!;
    if (s >= 0) out.push(s);
  }
  return out;
}

/**
 * The score of a line-holder line of pairing indices for crew member `c`
 * (lineScore, the one contract); for a buddy unit, the sum of both members'
 * scores, each with the shared line as the buddy's line.
 */
export function scoreLine(problem: AwardProblem, c: CrewProblem, line: readonly number[]): number {
  const trips = line.map((k) => problem.pairings[k]!);
  return memberScores(problem, c, trips).reduce((t, x) => t + x, 0);
}

/** Each member's score of a shared line (a crew member alone: their own score). */
export function memberScores(problem: AwardProblem, c: CrewProblem, trips: readonly Pairing[]): number[] {
  const context: ScoreContext = c.members.length > 1 ? { ...problem.score, buddyLine: trips.map((p) => p.id) } : problem.score;
  return c.memberWishes.map((wishes) => lineScore(wishes, trips, context, problem.instance.settings));
}

/** The legality engine's verdict on a line (or, with `reserve`, the reserve line); for a unit, legal only when legal for both. */
export function checkCrewLine(problem: AwardProblem, c: CrewProblem, line: readonly number[], reserve = false): LineResult {
  const items = line.map((k) => ({ kind: "pairing" as const, pairing: problem.pairings[k]! }));
  const results = c.members.map((m) => checkLine(m, problem.instance.ruleSet, items, problem.engine, { reserve }));
  return results.find((r) => !r.legal) ?? results[0]!;
}
