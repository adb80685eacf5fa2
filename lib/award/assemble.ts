/**
 * From chosen lines to the award document (lib/domain's format), the same for
 * every method: lines in seniority order, pairings in report order, reserve
 * days, scores and satisfaction, the wishes granted in full, open time and why
 * anyone holds reserve.
 */
import type { Award, AwardedLine, CrewMember } from "../domain/index.ts";
type ReserveReason = Award["reserveReasons"][number];
import { satisfaction, scoreWish, schemaVersion } from "../domain/index.ts";
import { localDatesTouched, periodDates } from "../domain/time.ts";
import { requiredDaysOff } from "../rules/index.ts";
import { memberScores, type AwardProblem } from "./problem.ts";
import { memberBests } from "./pricing.ts";

/** One crew member's chosen line: pairing indices, or reserve. */
export interface Choice {
  reserve: boolean;
  pairings: number[];
}

export interface Assembled {
  award: Award;
  /** per bidder (AwardProblem.crew): the indices of its members' lines in award.lines */
  entryLines: number[][];
  openCreditMinutes: number;
  openPositions: number;
  /** Σ_i W_i · satisfaction_i */
  weightedSatisfaction: number;
}

/**
 * The reserve days of a reserve line: the period's dates that are free of the
 * crew member's fixed activities, minus the days off the rule set requires for
 * a reserve line, taken evenly spread through the period (days of leave count
 * as days off already).
 */
export function reserveDays(problem: AwardProblem, member: CrewMember): string[] {
  const { startDate, endDate, zone } = problem.instance.period;
  const dates = periodDates(startDate, endDate);
  const busy = new Set(
    [
      ...member.fixedActivities.map((a) => localDatesTouched(a.start, a.end, zone)),
      ...member.carryIn.map((t) => localDatesTouched(t.dutyPeriods[0]!.report, t.dutyPeriods.at(-1)!.release, zone)),
    ].flat(),
  );
  const leave = new Set(
    member.fixedActivities.filter((a) => a.kind !== "training" && a.kind !== "office").flatMap((a) => localDatesTouched(a.start, a.end, zone)),
  );
  const need = requiredDaysOff(problem.instance.ruleSet.rules, dates.length, true);
  const free = dates.filter((d) => !busy.has(d));
  const extra = Math.min(free.length, Math.max(0, need - dates.filter((d) => leave.has(d)).length));
  // Spaced at least a day apart, since extra ≤ free.length.
  const dayOff = new Set(Array.from({ length: extra }, (_, j) => free[Math.floor(((j + 0.5) * free.length) / extra)]!));
  return free.filter((d) => !dayOff.has(d));
}

/**
 * The award of the chosen lines (one per bidder, by AwardProblem.crew index;
 * `best`: each bidder's best line alone). A buddy unit's line goes to both
 * members, each scored with their own wishes and satisfied against their own
 * best shared line (memberBests); the award's weighted satisfaction counts the
 * unit as the master does, by the unit's score against the unit's best.
 */
export function assembleAward(problem: AwardProblem, choices: readonly Choice[], best: readonly number[]): Assembled {
  const { instance, pairings } = problem;
  const covered = new Array<number>(pairings.length).fill(0);
  const ownBest = memberBests(problem, best);
  let weightedSatisfaction = 0;
  const lines: AwardedLine[] = problem.crew.flatMap((c, i) => {
    const choice = choices[i]!;
    const ordered = [...choice.pairings].sort((a, b) => problem.startMs[a]! - problem.startMs[b]! || a - b);
    for (const k of ordered) covered[k]! += c.members.length;
    const line = ordered.map((k) => pairings[k]!);
    const scores = choice.reserve ? c.members.map(() => 0) : memberScores(problem, c, line);
    weightedSatisfaction += c.weight * satisfaction(scores.reduce((t, x) => t + x, 0), best[i]!);
    const context = c.members.length > 1 ? { ...problem.score, buddyLine: line.map((p) => p.id) } : problem.score;
    return c.members.map((member, x): AwardedLine => ({
      crewId: member.id,
      kind: choice.reserve ? "reserve" : "line",
      pairings: line.map((p) => p.id),
      reserveDays: choice.reserve ? reserveDays(problem, member) : [],
      creditMinutes: line.reduce((t, p) => t + p.creditMinutes, 0),
      score: scores[x]!,
      satisfaction: satisfaction(scores[x]!, ownBest[i]![x]!),
      grantedWishes: choice.reserve ? [] : c.memberWishes[x]!.flatMap((wish, rank) => (scoreWish(wish, line, context) >= 1 - 1e-12 ? [rank] : [])),
    }));
  });
  // Lines in seniority order (a unit's senior member's line sits at the junior's place until here).
  const order = new Map(problem.crew.flatMap((c) => c.members).map((m) => [m.id, m.seniority]));
  lines.sort((a, b) => order.get(a.crewId)! - order.get(b.crewId)!);
  const lineOf = new Map(lines.map((l, x) => [l.crewId, x]));
  const entryLines = problem.crew.map((c) => c.members.map((m) => lineOf.get(m.id)!));
  let openCreditMinutes = 0;
  let openPositions = 0;
  const openPairings = pairings.flatMap((p, k) => {
    const open = problem.need[k]! - covered[k]!;
    if (open <= 0) return [];
    openCreditMinutes += open * p.creditMinutes;
    openPositions += open;
    return [{ pairingId: p.id, positionsOpen: open, openCreditMinutes: open * p.creditMinutes }];
  });
  const { min } = instance.settings.reserve;
  const reserveCount = problem.crew.reduce((t, c, i) => t + (choices[i]!.reserve ? c.members.length : 0), 0);
  const reserveReasons = problem.crew
    .flatMap((c, i): ReserveReason[] => {
      if (!choices[i]!.reserve) return [];
      const unit = c.members.length > 1;
      return c.members.map((member): ReserveReason => {
        if (best[i]! <= 0) {
          return { crewId: member.id, reason: "no-legal-line", text: unit ? "No line of trips in this period is legal for both you and the colleague you bid to fly with." : "No line of trips in this period is legal for you with your leave, training and carry-in." };
        }
        if (min > 0 && reserveCount <= min) return { crewId: member.id, reason: "reserve-minimum", text: `This group needs at least ${min} reserve lines.` };
        return {
          crewId: member.id,
          reason: "not-enough-trips",
          text: unit
            ? "The trips left after covering the period and the lines of more senior colleagues make no legal line that you and the colleague you bid to fly with can share."
            : "The trips left after covering the period and the lines of more senior colleagues make no legal line for you.",
        };
      });
    })
    .sort((a, b) => lineOf.get(a.crewId)! - lineOf.get(b.crewId)!);
  const award: Award = {
    schemaVersion,
    periodId: instance.period.id,
    group: instance.group,
    lines,
    openPairings,
    reserveReasons,
  };
  return { award, entryLines, openCreditMinutes, openPositions, weightedSatisfaction };
}

/** The report's best score alone and weight W_i of each crew member (a buddy unit's members: their own, memberBests and memberWeights). */
export function crewFigures(problem: AwardProblem, best: readonly number[]): { best: Record<string, number>; weights: Record<string, number> } {
  const own = memberBests(problem, best);
  return {
    best: Object.fromEntries(problem.crew.flatMap((c, i) => c.members.map((m, x) => [m.id, own[i]![x]!]))),
    weights: Object.fromEntries(problem.crew.flatMap((c) => c.members.map((m, x) => [m.id, c.memberWeights[x]!]))),
  };
}
