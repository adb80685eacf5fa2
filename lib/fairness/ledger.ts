/**
 * The fairness ledger: what a published award carries into the next period.
 * Each crew member's balance says how far their satisfaction fell short of
 * their award group's mean, with older periods fading:
 *
 *   balance_t = decay · balance_{t−1} + (mean_t − satisfaction_t)
 *   carriedWeight_t = clamp(1 + gain · balance_t, minWeight, maxWeight)
 *
 * A crew member who did worse than their colleagues is owed (balance > 0) and
 * bids in the next period with a larger weight; in weighted-balance mode that
 * weight multiplies their seniority weight (lib/award seniorityWeight).
 * Strict seniority ignores it, as seniority alone decides there.
 * The form and the figures are our choice (no published source): halving
 * each period's share keeps a bad month from counting for ever, and the clamp
 * keeps one crew member's weight within a factor of 2 of anyone's.
 */

import { mean } from "./measures.ts";

export const LEDGER = { decay: 0.5, gain: 1, minWeight: 0.5, maxWeight: 2 } as const;

export interface LedgerStep {
  balance: number;
  carriedWeight: number;
}

/** One period's step for one crew member. */
export function ledgerStep(previousBalance: number, satisfaction: number, groupMean: number): LedgerStep {
  const balance = LEDGER.decay * previousBalance + (groupMean - satisfaction);
  const carriedWeight = Math.min(LEDGER.maxWeight, Math.max(LEDGER.minWeight, 1 + LEDGER.gain * balance));
  return { balance, carriedWeight };
}

/** The steps of one award group: `previous` balances by crew (absent → 0). */
export function ledgerFor(
  satisfactions: ReadonlyArray<{ crewMemberId: string; satisfaction: number }>,
  previous: ReadonlyMap<string, number>,
): Map<string, LedgerStep & { satisfaction: number }> {
  const groupMean = mean(satisfactions.map((x) => x.satisfaction));
  return new Map(satisfactions.map((x) => [x.crewMemberId, { satisfaction: x.satisfaction, ...ledgerStep(previous.get(x.crewMemberId) ?? 0, x.satisfaction, groupMean) }]));
}
