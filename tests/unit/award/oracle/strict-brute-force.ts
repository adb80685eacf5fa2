/**
 * An outside oracle for strict seniority (AWARD-MODEL.md, DESIGN.md "Strict
 * seniority"), from the lines of enumerate-lines.ts — no code of lib/award:
 *
 *   1. coverage first: the least open credit minutes, ties by fewer uncovered
 *      pairings (brute-force.ts's phase 1);
 *   2. then, in seniority order, each crew member's score as high as possible
 *      given every more senior crew member's score: the lexicographic maximum
 *      of (s_0, s_1, …, s_{n−1}) over the awards of optimal coverage, within
 *      the reserve bounds (a reserve line scores 0).
 *
 * `strictBruteForce` is a backward dynamic program over (pairings covered,
 * reserve lines so far): V_i(state) is the lexicographically greatest vector
 * of scores that crew i..n−1 can reach from the state and still end at an
 * optimal coverage. `bestGivenSeniors` is the seniority audit's re-solve: the
 * highest score crew member k can have when every more senior crew member
 * keeps at least a given score and the coverage is a given one (a forward
 * dynamic program).
 */
import { bruteForce } from "./brute-force.ts";
import type { Enumeration, OracleLine } from "./enumerate-lines.ts";

/** Scores that differ by less than this are equal (sums of the same wish weights in another order). */
const SAME = 1e-9;

export interface StrictOptimum {
  openCreditMinutes: number;
  openPositions: number;
  /** the lexicographic optimum: per crew member (seniority order) their score */
  scores: number[];
  /** an award reaching it */
  lines: OracleLine[];
}

function coverageOf(e: Enumeration, mask: number): [number, number] {
  let credit = 0;
  let open = 0;
  e.slots.forEach((k, j) => {
    if (!(mask & (1 << j))) {
      credit += e.instance.pairings[k]!.creditMinutes;
      open++;
    }
  });
  return [credit, open];
}

/** a > b lexicographically (beyond SAME in the first place they differ) */
function lexGreater(a: readonly number[], b: readonly number[]): boolean {
  for (let x = 0; x < a.length; x++) {
    if (a[x]! > b[x]! + SAME) return true;
    if (a[x]! < b[x]! - SAME) return false;
  }
  return false;
}

export function strictBruteForce(e: Enumeration): StrictOptimum {
  const coverage = bruteForce(e);
  const P = e.slots.length;
  const n = e.crew.length;
  const reserveMin = e.instance.settings.reserve.min;
  const reserveMax = e.instance.settings.reserve.max ?? n;
  const states = (1 << P) * (n + 1);
  const key = (mask: number, r: number) => mask * (n + 1) + r;
  // V_n: the empty vector where the award ends at optimal coverage within the reserve bounds.
  let value: (number[] | undefined)[] = new Array(states);
  for (let mask = 0; mask < 1 << P; mask++) {
    const [credit, open] = coverageOf(e, mask);
    if (credit !== coverage.openCreditMinutes || open !== coverage.openPositions) continue;
    for (let r = reserveMin; r <= Math.min(reserveMax, n); r++) value[key(mask, r)] = [];
  }
  const choice: Int32Array[] = new Array(n);
  for (let i = n - 1; i >= 0; i--) {
    const c = e.crew[i]!;
    const next = value;
    value = new Array(states);
    const chose = new Int32Array(states).fill(-2);
    for (let mask = 0; mask < 1 << P; mask++) {
      for (let r = 0; r <= i; r++) {
        let bestVector: number[] | undefined;
        let bestChoice = -2;
        const offer = (vector: number[] | undefined, score: number, k: number) => {
          if (!vector) return;
          const candidate = [score, ...vector];
          if (!bestVector || lexGreater(candidate, bestVector)) {
            bestVector = candidate;
            bestChoice = k;
          }
        };
        if (r + 1 <= reserveMax) offer(next[key(mask, r + 1)], 0, -1);
        c.lines.forEach((l, k) => {
          if ((l.mask & mask) === 0) offer(next[key(mask | l.mask, r)], l.score, k);
        });
        value[key(mask, r)] = bestVector;
        chose[key(mask, r)] = bestChoice;
      }
    }
    choice[i] = chose;
  }
  const scores = value[key(0, 0)];
  if (!scores) throw new Error("no award reaches the optimal coverage within the reserve bounds");
  const lines: OracleLine[] = [];
  let mask = 0;
  let r = 0;
  for (let i = 0; i < n; i++) {
    const k = choice[i]![key(mask, r)]!;
    const line = k === -1 ? e.crew[i]!.reserve : e.crew[i]!.lines[k]!;
    lines.push(line);
    if (k === -1) r++;
    mask |= line.mask;
  }
  return { openCreditMinutes: coverage.openCreditMinutes, openPositions: coverage.openPositions, scores, lines };
}

/**
 * The seniority audit's re-solve: the highest score crew member k can reach
 * over awards in which every crew member i < k scores at least
 * `floors[i] − margin` and the open time is `coverage` exactly
 * ([open credit minutes, open pairings]); −Infinity when there is none.
 */
export function bestGivenSeniors(e: Enumeration, k: number, floors: readonly number[], coverage: [number, number], margin = 1e-6): number {
  const P = e.slots.length;
  const n = e.crew.length;
  const reserveMin = e.instance.settings.reserve.min;
  const reserveMax = e.instance.settings.reserve.max ?? n;
  const states = (1 << P) * (n + 1);
  const key = (mask: number, r: number) => mask * (n + 1) + r;
  let value = new Float64Array(states).fill(-Infinity);
  value[key(0, 0)] = 0;
  for (let i = 0; i < n; i++) {
    const c = e.crew[i]!;
    const next = new Float64Array(states).fill(-Infinity);
    const allowed = (score: number) => i >= k || score >= floors[i]! - margin;
    const gain = (score: number) => (i === k ? score : 0);
    for (let mask = 0; mask < 1 << P; mask++) {
      for (let r = 0; r <= i; r++) {
        const v = value[key(mask, r)]!;
        if (v === -Infinity) continue;
        if (r + 1 <= reserveMax && allowed(0)) {
          const s = key(mask, r + 1);
          next[s] = Math.max(next[s]!, v + gain(0));
        }
        for (const l of c.lines) {
          if ((l.mask & mask) !== 0 || !allowed(l.score)) continue;
          const s = key(mask | l.mask, r);
          next[s] = Math.max(next[s]!, v + gain(l.score));
        }
      }
    }
    value = next;
  }
  let best = -Infinity;
  for (let mask = 0; mask < 1 << P; mask++) {
    const [credit, open] = coverageOf(e, mask);
    if (credit !== coverage[0] || open !== coverage[1]) continue;
    for (let r = reserveMin; r <= Math.min(reserveMax, n); r++) best = Math.max(best, value[key(mask, r)]!);
  }
  return best;
}
