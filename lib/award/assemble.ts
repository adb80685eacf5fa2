/**
 * From chosen lines to the award document (lib/domain's format), the same for
 * every method: lines in seniority order, pairings in report order, reserve
 * days, scores and satisfaction, the wishes granted in full, open time and why
 * anyone holds reserve.
 */
import type { Award, AwardedLine } from "../domain/index.ts";
type ReserveReason = Award["reserveReasons"][number];
import { satisfaction, scoreWish, schemaVersion } from "../domain/index.ts";
import { localDatesTouched, periodDates } from "../domain/time.ts";
import { requiredDaysOff } from "../rules/index.ts";
import { scoreLine, type AwardProblem, type CrewProblem } from "./problem.ts";

/** One crew member's chosen line: pairing indices, or reserve. */
export interface Choice {
  reserve: boolean;
  pairings: number[];
}

export interface Assembled {
  award: Award;
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
export function reserveDays(problem: AwardProblem, c: CrewProblem): string[] {
  const { startDate, endDate, zone } = problem.instance.period;
  const dates = periodDates(startDate, endDate);
  const busy = new Set(
    [
      ...c.crew.fixedActivities.map((a) => localDatesTouched(a.start, a.end, zone)),
      ...c.crew.carryIn.map((t) => localDatesTouched(t.dutyPeriods[0]!.report, t.dutyPeriods.at(-1)!.release, zone)),
    ].flat(),
  );
  const leave = new Set(
    c.crew.fixedActivities.filter((a) => a.kind !== "training" && a.kind !== "office").flatMap((a) => localDatesTouched(a.start, a.end, zone)),
  );
  const need = requiredDaysOff(problem.instance.ruleSet.rules, dates.length, true);
  const free = dates.filter((d) => !busy.has(d));
  const extra = Math.min(free.length, Math.max(0, need - dates.filter((d) => leave.has(d)).length));
  // Spaced at least a day apart, since extra ≤ free.length.
  const dayOff = new Set(Array.from({ length: extra }, (_, j) => free[Math.floor(((j + 0.5) * free.length) / extra)]!));
  return free.filter((d) => !dayOff.has(d));
}

export function assembleAward(problem: AwardProblem, choices: readonly Choice[], best: readonly number[]): Assembled {
  const { instance, pairings } = problem;
  const covered = new Array<number>(pairings.length).fill(0);
  let weightedSatisfaction = 0;
  const lines: AwardedLine[] = problem.crew.map((c, i) => {
    const choice = choices[i]!;
    const ordered = [...choice.pairings].sort((a, b) => problem.startMs[a]! - problem.startMs[b]! || a - b);
    for (const k of ordered) covered[k]!++;
    const score = choice.reserve ? 0 : scoreLine(problem, c, ordered);
    const sat = satisfaction(score, best[i]!);
    weightedSatisfaction += c.weight * sat;
    const line = ordered.map((k) => pairings[k]!);
    const granted = choice.reserve ? [] : c.wishes.flatMap((wish, rank) => (scoreWish(wish, line, problem.score) >= 1 - 1e-12 ? [rank] : []));
    return {
      crewId: c.crew.id,
      kind: choice.reserve ? "reserve" : "line",
      pairings: line.map((p) => p.id),
      reserveDays: choice.reserve ? reserveDays(problem, c) : [],
      creditMinutes: line.reduce((t, p) => t + p.creditMinutes, 0),
      score,
      satisfaction: sat,
      grantedWishes: granted,
    };
  });
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
  const reserveCount = choices.filter((c) => c.reserve).length;
  const reserveReasons = problem.crew.flatMap((c, i): ReserveReason[] => {
    if (!choices[i]!.reserve) return [];
    if (best[i]! <= 0) {
      return [{ crewId: c.crew.id, reason: "no-legal-line", text: "No line of trips in this period is legal for you with your leave, training and carry-in." }];
    }
    if (min > 0 && reserveCount <= min) {
      return [{ crewId: c.crew.id, reason: "reserve-minimum", text: `This group needs at least ${min} reserve lines.` }];
    }
    return [{ crewId: c.crew.id, reason: "not-enough-trips", text: "The trips left after covering the period and the lines of more senior colleagues make no legal line for you." }];
  });
  const award: Award = {
    schemaVersion,
    periodId: instance.period.id,
    group: instance.group,
    lines,
    openPairings,
    reserveReasons,
  };
  return { award, openCreditMinutes, openPositions, weightedSatisfaction };
}
