/**
 * An outside oracle for the award engine: the exact optimum of a tiny
 * instance by dynamic programming over subsets of pairings, from the lines
 * of enumerate-lines.ts (no code of lib/award).
 *
 * Crew in seniority order each take one of their enumerated lines or the
 * reserve line; the state after crew 0..i−1 is (the set of pairings covered,
 * how many reserve lines so far), and its value the best Σ W_i·satisfaction_i
 * reaching it. Every pairing needs one crew member (asserted), so a line fits a
 * state when it holds none of the covered pairings. The objective is
 * lexicographic (AWARD-MODEL.md, phase 1 then phase 2):
 *
 *   1. least open credit minutes (Σ credit of uncovered pairings), ties by fewer
 *      uncovered pairings;
 *   2. then the most Σ_i W_i · satisfaction_i, W_i = (1 + β(n − 1 − rank)/n) ·
 *      carriedWeight and satisfaction_i = score/best_i (lib/domain's
 *      `satisfaction`: reserve scores 0; with no legal line-holder line,
 *      satisfaction is 1).
 *
 * settings.reserve.min and .max bound the number of reserve lines.
 */
import { satisfaction } from "@/lib/domain";
import { oracleWeight, type Enumeration, type OracleLine } from "./enumerate-lines.ts";

export interface BruteForceResult {
  /** Σ credit minutes of the pairings left uncovered */
  openCreditMinutes: number;
  /** how many pairings are left uncovered */
  openPositions: number;
  /** phase 1's integer optimum in the master's units: Σ (credit_p + 1/(1+P)) over uncovered p, P = pairings that need crew */
  openCost: number;
  /** Σ_i W_i · satisfaction_i of an optimal award */
  objective: number;
  /** an optimal award: per crew member (seniority order) the line chosen */
  lines: OracleLine[];
  /** W_i per crew member, seniority order */
  weights: number[];
  /** mask of the covered slots */
  covered: number;
}

export function bruteForce(e: Enumeration): BruteForceResult {
  const { instance, slots, need, crew } = e;
  const bad = need.findIndex((d) => d !== 1);
  if (bad >= 0) throw new Error(`the brute force assumes need 1 per pairing; ${instance.pairings[slots[bad]!]!.id} needs ${need[bad]}`);
  const P = slots.length;
  if (P > 20) throw new Error(`too many pairings for the brute force (${P})`);
  const n = crew.length;
  const { seniorityWeight: beta, reserve } = instance.settings;
  const reserveMin = reserve.min;
  const reserveMax = reserve.max ?? n;
  const weights = crew.map((c) => oracleWeight(c.rank, n, beta, c.crew.carriedWeight));
  const states = (1 << P) * (n + 1);
  const key = (mask: number, r: number) => mask * (n + 1) + r;

  // layer[i][state]: best value after crew 0..i−1; parent pointers to rebuild one optimal award.
  let value = new Float64Array(states).fill(-Infinity);
  value[key(0, 0)] = 0;
  const parents: { state: Int32Array; line: Int32Array }[] = [];
  for (let i = 0; i < n; i++) {
    const c = crew[i]!;
    const W = weights[i]!;
    const next = new Float64Array(states).fill(-Infinity);
    const fromState = new Int32Array(states).fill(-1);
    const viaLine = new Int32Array(states).fill(-2);
    const offer = (to: number, v: number, from: number, line: number) => {
      if (v > next[to]!) {
        next[to] = v;
        fromState[to] = from;
        viaLine[to] = line;
      }
    };
    const lineValues = c.lines.map((l) => W * satisfaction(l.score, c.best));
    const reserveValue = W * satisfaction(0, c.best);
    for (let mask = 0; mask < 1 << P; mask++) {
      for (let r = 0; r <= i; r++) {
        const s = key(mask, r);
        const v = value[s]!;
        if (v === -Infinity) continue;
        if (r + 1 <= reserveMax) offer(key(mask, r + 1), v + reserveValue, s, -1);
        c.lines.forEach((l, k) => {
          if ((l.mask & mask) === 0) offer(key(mask | l.mask, r), v + lineValues[k]!, s, k);
        });
      }
    }
    parents.push({ state: fromState, line: viaLine });
    value = next;
  }

  const credit = slots.map((k) => instance.pairings[k]!.creditMinutes);
  let bestState = -1;
  let bestOpen: [number, number] = [Infinity, Infinity];
  let bestValue = -Infinity;
  for (let mask = 0; mask < 1 << P; mask++) {
    let openCredit = 0;
    let open = 0;
    for (let j = 0; j < P; j++) {
      if (!(mask & (1 << j))) {
        openCredit += credit[j]!;
        open++;
      }
    }
    for (let r = reserveMin; r <= Math.min(reserveMax, n); r++) {
      const v = value[key(mask, r)]!;
      if (v === -Infinity) continue;
      const better =
        openCredit < bestOpen[0] || (openCredit === bestOpen[0] && (open < bestOpen[1] || (open === bestOpen[1] && v > bestValue)));
      if (better) {
        bestOpen = [openCredit, open];
        bestValue = v;
        bestState = key(mask, r);
      }
    }
  }
  if (bestState < 0) throw new Error("no award satisfies the reserve bounds");

  const lines: OracleLine[] = new Array(n);
  let s = bestState;
  for (let i = n - 1; i >= 0; i--) {
    const k = parents[i]!.line[s]!;
    lines[i] = k === -1 ? crew[i]!.reserve : crew[i]!.lines[k]!;
    s = parents[i]!.state[s]!;
  }
  const covered = Math.floor(bestState / (n + 1));
  return {
    openCreditMinutes: bestOpen[0],
    openPositions: bestOpen[1],
    openCost: bestOpen[0] + bestOpen[1] / (1 + P),
    objective: bestValue,
    lines,
    weights,
    covered,
  };
}
