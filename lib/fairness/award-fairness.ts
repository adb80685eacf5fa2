/**
 * The fairness report of one award: how satisfaction is spread across the crew
 * and across seniority.
 */
import { gini, jainIndex, mean, percentile } from "./measures.ts";

export interface FairnessReport {
  crew: number;
  mean: number;
  min: number;
  max: number;
  /** max − min */
  spread: number;
  p10: number;
  median: number;
  p90: number;
  jain: number;
  gini: number;
  /** mean satisfaction of each seniority decile, most senior first (fewer groups when there are fewer than 10 crew) */
  byDecile: number[];
}

/** `entries` in any order; seniority 1 is the most senior. */
export function fairnessReport(entries: readonly { seniority: number; satisfaction: number }[]): FairnessReport {
  const xs = entries.map((e) => e.satisfaction);
  for (const [k, x] of xs.entries()) {
    if (!(x >= 0 && x <= 1)) throw new RangeError(`entries[${k}].satisfaction is ${x}; satisfaction lies in [0, 1]`);
  }
  const bySeniority = [...entries].sort((a, b) => a.seniority - b.seniority);
  const groups = Math.min(10, bySeniority.length);
  const byDecile = Array.from({ length: groups }, (_, g) => {
    const from = Math.floor((g * bySeniority.length) / groups);
    const to = Math.floor(((g + 1) * bySeniority.length) / groups);
    return mean(bySeniority.slice(from, to).map((e) => e.satisfaction));
  });
  const min = xs.length ? Math.min(...xs) : 0;
  const max = xs.length ? Math.max(...xs) : 0;
  return {
    crew: xs.length,
    mean: mean(xs),
    min,
    max,
    spread: max - min,
    p10: percentile(xs, 10),
    median: percentile(xs, 50),
    p90: percentile(xs, 90),
    jain: jainIndex(xs),
    gini: gini(xs),
    byDecile,
  };
}
