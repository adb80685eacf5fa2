import { workedDates } from "./line-dates.ts";
import { matchesTripSelection } from "./match-trip-filter.ts";
import type { Pairing } from "./pairing.ts";
import type { ScoreContext } from "./score-context.ts";
import { scoreCredit, scoreRhythm } from "./score-shortfall.ts";
import type { Wish } from "./wish.ts";

/**
 * How far `line` (the awarded pairings of one crew member) grants `wish`, in
 * [0, 1]. The one scoring function the award engine, the bid preview,
 * explanations and fairness all use:
 * - trip: 1 when the line holds at least `count` selected trips, else held ÷ count;
 * - no-trip: 1 when it holds none of them, else 0;
 * - free-days: the fraction of the named dates the line leaves free. Every named
 *   date counts, inside the period or not: a date after the period is taken only
 *   when a trip runs into it, and is free otherwise;
 * - rhythm, credit: 1 when met, else the graded shortfall of score-shortfall.ts;
 * - buddy: the fraction of the crew member's trips the buddy also flies; 0 for
 *   an empty line and when there is no mutual buddy line.
 */
export function scoreWish(wish: Wish, line: readonly Pairing[], context: ScoreContext): number {
  const { zone } = context;
  switch (wish.kind) {
    case "trip": {
      const held = line.filter((pairing) => matchesTripSelection(wish, pairing, zone)).length;
      return Math.min(1, held / wish.count);
    }
    case "no-trip":
      return line.some((pairing) => matchesTripSelection(wish, pairing, zone)) ? 0 : 1;
    case "free-days": {
      const worked = workedDates(line, zone);
      return wish.dates.filter((date) => !worked.has(date)).length / wish.dates.length;
    }
    case "rhythm":
      return scoreRhythm(wish, line, context);
    case "credit":
      return scoreCredit(wish, line);
    case "buddy": {
      if (!context.buddyLine || line.length === 0) return 0;
      const buddy = new Set(context.buddyLine);
      return line.filter((pairing) => buddy.has(pairing.id)).length / line.length;
    }
  }
}
