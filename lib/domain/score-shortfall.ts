import { longestRunOfDays, periodWeekends, workedDates } from "./line-dates.ts";
import type { Pairing } from "./pairing.ts";
import type { ScoreContext } from "./score-context.ts";
import type { WishOf } from "./wish.ts";

// Graded shortfalls for the wishes that are not simply held or not: a line that
// misses by a little scores nearly 1, so the engine prefers near misses.

/**
 * A work pattern: the mean of its parts.
 * - maxDaysOn: 1 when the longest run of consecutive worked dates is within it,
 *   else maxDaysOn ÷ longest run (runs count dates outside the period too);
 * - weekendsOff: the fraction of the period's weekends (their dates inside the
 *   period) left wholly free; 1 for a period without a weekend.
 */
export function scoreRhythm(wish: WishOf<"rhythm">, line: readonly Pairing[], context: ScoreContext): number {
  const worked = workedDates(line, context.zone);
  const parts: number[] = [];
  if (wish.maxDaysOn !== undefined) {
    const longest = longestRunOfDays(worked);
    parts.push(longest <= wish.maxDaysOn ? 1 : wish.maxDaysOn / longest);
  }
  if (wish.weekendsOff === true) {
    const weekends = periodWeekends(context.periodStart, context.periodEnd);
    const free = weekends.filter((weekend) => weekend.every((date) => !worked.has(date))).length;
    parts.push(weekends.length === 0 ? 1 : free / weekends.length);
  }
  return parts.length === 0 ? 1 : parts.reduce((sum, part) => sum + part, 0) / parts.length;
}

/**
 * A credit range: 1 inside it; below it credit ÷ min; above it max ÷ credit.
 * The line's credit is the full credit of each of its pairings, also of one
 * that runs into the next period (it is flown on this period's line).
 */
export function scoreCredit(wish: WishOf<"credit">, line: readonly Pairing[]): number {
  const credit = line.reduce((sum, pairing) => sum + pairing.creditMinutes, 0);
  const { minMinutes, maxMinutes } = wish;
  if (minMinutes !== undefined && credit < minMinutes) return credit / minMinutes;
  if (maxMinutes !== undefined && credit > maxMinutes) return maxMinutes / credit;
  return 1;
}
