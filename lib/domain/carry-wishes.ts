import type { Wish } from "./wish.ts";

/** Last period's wishes made fit for a new period, and what had to be left behind. */
export interface CarriedWishes {
  wishes: Wish[];
  /** one plain sentence per wish (or part of one) left behind, by rank in the old bid */
  leftBehind: string[];
}

/**
 * Copies a bid's wishes as a starting point for the next period. Named trips
 * and dates belong to the old period (trip numbers come round again on other
 * trips), so they are left out: a trip or no-trip wish keeps only its filter
 * and is dropped without one; a free-days wish is dropped. Work pattern,
 * credit, buddy and filters carry over as they are.
 */
export function carryWishes(wishes: readonly Wish[]): CarriedWishes {
  const kept: Wish[] = [];
  const leftBehind: string[] = [];
  wishes.forEach((wish, rank) => {
    const n = rank + 1;
    if (wish.kind === "free-days") {
      leftBehind.push(`wish ${n}: free days named last period's dates`);
      return;
    }
    if (wish.kind === "trip" || wish.kind === "no-trip") {
      if (wish.pairingIds === undefined) {
        kept.push(wish);
        return;
      }
      if (wish.filter === undefined) {
        leftBehind.push(`wish ${n}: it named last period's trips (${wish.pairingIds.join(", ")})`);
        return;
      }
      const { pairingIds, ...rest } = wish;
      leftBehind.push(`wish ${n}: kept its filter, left out last period's trips (${pairingIds.join(", ")})`);
      kept.push(rest as Wish);
      return;
    }
    kept.push(wish);
  });
  return { wishes: kept, leftBehind };
}
