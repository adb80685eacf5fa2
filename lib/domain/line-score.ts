import type { Pairing } from "./pairing.ts";
import type { ScoreContext } from "./score-context.ts";
import { scoreWish } from "./score-wish.ts";
import type { AwardSettings } from "./settings.ts";
import type { Wish } from "./wish.ts";

/** The weight of the wish of rank `rank` (0-based): rankDecay^rank. */
export function rankWeight(rank: number, rankDecay: number): number {
  return rankDecay ** rank;
}

/** The score of every wish of a bid against `line`, in rank order. */
export function scoreWishes(wishes: readonly Wish[], line: readonly Pairing[], context: ScoreContext): number[] {
  return wishes.map((wish) => scoreWish(wish, line, context));
}

/**
 * The score of a line-holder line: B + Σ_r rankDecay^r · scoreWish(wish r).
 * B > 0, so holding a line, even one that grants nothing, beats reserve.
 */
export function lineScore(
  wishes: readonly Wish[],
  line: readonly Pairing[],
  context: ScoreContext,
  settings: Pick<AwardSettings, "rankDecay" | "baseLineValue">,
): number {
  return scoreWishes(wishes, line, context).reduce(
    (sum, score, rank) => sum + rankWeight(rank, settings.rankDecay) * score,
    settings.baseLineValue,
  );
}

/** The score of a reserve line. */
export const reserveLineScore = 0;

/**
 * Satisfaction: the awarded score ÷ the best line-holder score the crew member
 * could have alone, clamped to [0, 1] so that crew are comparable. When no
 * line-holder line exists for them (best ≤ 0), reserve was the best possible: 1.
 */
export function satisfaction(score: number, best: number): number {
  if (best <= 0) return 1;
  return Math.min(1, Math.max(0, score / best));
}
