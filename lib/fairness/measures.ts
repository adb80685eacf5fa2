/**
 * Distribution measures of satisfaction across crew (each value in [0, 1]).
 * Pure functions over plain numbers: lib/award and the screens feed them.
 */

/** Arithmetic mean; 0 for no values. */
export function mean(xs: readonly number[]): number {
  return xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : 0;
}

/**
 * The p-th percentile (0 ≤ p ≤ 100) by linear interpolation between closest
 * ranks (the "R-7" / spreadsheet PERCENTILE definition).
 */
export function percentile(xs: readonly number[], p: number): number {
  if (!xs.length) return 0;
  if (p < 0 || p > 100) throw new RangeError(`percentile ${p} is outside 0–100`);
  const s = [...xs].sort((a, b) => a - b);
  const h = ((s.length - 1) * p) / 100;
  const lo = Math.floor(h);
  return s[lo]! + (h - lo) * ((s[Math.min(lo + 1, s.length - 1)] ?? s[lo]!) - s[lo]!);
}

/**
 * Jain's fairness index (Σx)² / (n · Σx²): 1 when all shares are equal, k/n
 * when k of n share equally and the rest get nothing (R. Jain, D.-M. Chiu,
 * W. Hawe, DEC-TR-301, 1984). 1 by convention when every share is 0.
 */
export function jainIndex(xs: readonly number[]): number {
  const sum = xs.reduce((a, b) => a + b, 0);
  const squares = xs.reduce((a, b) => a + b * b, 0);
  return squares === 0 ? 1 : (sum * sum) / (xs.length * squares);
}

/**
 * Gini coefficient, mean absolute difference over twice the mean:
 * G = Σᵢ Σⱼ |xᵢ − xⱼ| / (2 n² μ), computed on sorted values as
 * Σᵢ (2i − n − 1) x₍ᵢ₎ / (n Σx) with i = 1..n. 0 for perfect equality,
 * (n − 1)/n when one holds everything. 0 by convention when every share is 0.
 */
export function gini(xs: readonly number[]): number {
  const n = xs.length;
  const sum = xs.reduce((a, b) => a + b, 0);
  if (n === 0 || sum === 0) return 0;
  const s = [...xs].sort((a, b) => a - b);
  return s.reduce((t, x, k) => t + (2 * (k + 1) - n - 1) * x, 0) / (n * sum);
}
