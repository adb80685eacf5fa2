/**
 * Improving an integer award by re-solving small neighbourhoods exactly
 * (large neighbourhood search; Shaw 1998, Pisinger & Ropke 2010). A
 * neighbourhood is a handful of crew members: one whose satisfaction falls
 * short (the anchor), the crew who hold the trips of the anchor's best lines,
 * and those trips, the neighbourhood's own trips and the open ones as the
 * pool. Everyone else keeps their line. Within the neighbourhood the same
 * master as the whole award's is solved — column generation with pricing
 * restricted to the pool (small enough for pricing to be exhaustive), then
 * the integer solve started from the lines held now — so a neighbourhood's
 * answer is never worse than what it replaces, covers every trip the
 * neighbourhood covered (or more open time's worth) and keeps the reserve
 * bounds; only legal lines come out of pricing.
 *
 * Set partitioning's LP is often fractional, and price-and-branch on the
 * lines of the whole LP finds few integer solutions that fit together; small
 * neighbourhoods close much of that gap, one exact step at a time.
 */
import type { Highs } from "highs";
import { Master, type MasterColumn } from "./master.ts";
import type { AwardProblem } from "./problem.ts";
import { priceLines } from "./pricing.ts";

const TOL = 1e-7;
const DAY = 86_400_000;
/** column generation rounds per neighbourhood, and lines per crew member and round */
const ROUNDS = 60;
const LINES = 10;
/** the most time one neighbourhood may take */
const STEP_MS = 3_000;

export interface ImproveInput {
  problem: AwardProblem;
  highs: Highs;
  /** pairing index → crew needed (pairings someone may fly) */
  need: ReadonlyMap<number, number>;
  /** open time's cost per position, by pairing */
  openCost: ReadonlyMap<number, number>;
  /** the objective coefficient of a column (W_i × satisfaction) */
  coefficient: (col: MasterColumn) => number;
  /** pricing's weight of a line's score for crew i at fairness dual yf (W_i − yf)/best_i; 0 without a best line */
  scoreWeight: (crew: number, fairnessDual: number) => number;
  /** the elastic fairness floor, when the settings have one */
  fairness?: { floor: number; penalty: number; coefficient: (col: MasterColumn) => number };
  reserve: { min: number; max: number };
  /** the largest coefficient a column of crew i can have (W_i; 0 without a best line) */
  fullCoefficient: (crew: number) => number;
  /** one column per crew member, by crew index; feasible */
  start: readonly MasterColumn[];
  /** performance.now() by which to stop */
  deadline: number;
  stop: () => boolean;
  /**
   * Coverage instead of wishes (phase 1): the objective is −open time's cost plus
   * tieBreak × Σ coefficient, the neighbourhoods gather around open trips, and
   * open time may only fall (or stay, with wishes better)
   */
  coverage?: { tieBreak: number };
  /** crew per neighbourhood to begin with (default 4; up to three times as many when smaller ones stop improving) */
  size?: number;
  /** neighbourhoods to solve at most (default: no limit but the deadline); with it a run is the same however fast the machine */
  maxTries?: number;
  /** pricing nodes per crew member and round (default 5,000) */
  nodeLimit?: number;
}

export interface ImproveResult {
  columns: MasterColumn[];
  /** neighbourhoods solved, and how many of them improved the award */
  tried: number;
  improved: number;
  /** the objective's rise */
  gain: number;
}

/** The award's objective: Σ coefficient less the fairness penalty. */
export function awardValue(input: Pick<ImproveInput, "coefficient" | "fairness">, columns: readonly MasterColumn[]): number {
  const f = input.fairness;
  return columns.reduce((t, col) => t + input.coefficient(col) - (f ? f.penalty * Math.max(0, f.floor - f.coefficient(col)) : 0), 0);
}

/** A small seeded generator (mulberry32): the same neighbourhoods on every run. */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function shuffled<T>(items: readonly T[], random: () => number): T[] {
  const out = [...items];
  for (let k = out.length - 1; k > 0; k--) {
    const j = Math.floor(random() * (k + 1));
    [out[k], out[j]] = [out[j]!, out[k]!];
  }
  return out;
}

/** Open positions per pairing under a full award (one column per crew member; `size`: the crew members behind a column, 2 for a buddy unit). */
function openPositions(need: ReadonlyMap<number, number>, columns: readonly MasterColumn[], size: (col: MasterColumn) => number): Map<number, number> {
  const left = new Map(need);
  for (const col of columns) for (const p of col.pairings) left.set(p, (left.get(p) ?? 0) - size(col));
  return left;
}

export function improveByNeighbourhoods(input: ImproveInput): ImproveResult {
  const { problem, need, openCost } = input;
  const cover = input.coverage;
  const membersOf = (col: MasterColumn) => problem.crew[col.crew]!.members.length;
  /** The objective being improved, of a full award. */
  const valueOf = (cols: readonly MasterColumn[]) => {
    if (!cover) return awardValue(input, cols);
    let open = 0;
    for (const [p, left] of openPositions(need, cols, membersOf)) open += openCost.get(p)! * Math.max(0, left);
    return -open + cover.tieBreak * cols.reduce((t, col) => t + input.coefficient(col), 0);
  };
  const n = problem.crew.length;
  // Neighbourhoods grow when a whole pass at one size improves nothing.
  let size = Math.min(n, input.size ?? 4);
  const largest = Math.min(n, 3 * size);
  const columns = [...input.start];
  const before = valueOf(columns);
  let tried = 0;
  let improved = 0;
  // At the largest size the seeded draws never run out, so a long enough run of
  // neighbourhoods without a gain ends the search (the award is then stuck at
  // a local optimum that more of the same will not leave).
  let sinceGain = 0;
  const patience = Math.max(30, n);
  const out = () =>
    tried >= (input.maxTries ?? Infinity) || (size >= largest && sinceGain >= patience) || halt();
  /** Time up or cancelled: what may interrupt a neighbourhood's own solves. */
  const halt = () => performance.now() > input.deadline || input.stop();

  /** Who holds each pairing now. */
  const holders = () => {
    const held = new Map<number, number[]>();
    columns.forEach((col, i) => col.pairings.forEach((p) => held.set(p, [...(held.get(p) ?? []), i])));
    return held;
  };
  const loss = (i: number) => input.fullCoefficient(i) - input.coefficient(columns[i]!);
  // The lines each crew member would most like alone (three best), found when first asked.
  const zero = new Float64Array(problem.pairings.length);
  const wantedLines = new Map<number, MasterColumn[]>();
  const wanted = (i: number) => {
    let lines = wantedLines.get(i);
    if (!lines) {
      const r = priceLines(problem, problem.crew[i]!, { scoreWeight: 1, cost: zero, threshold: 0, maxLines: 3, nodeLimit: input.nodeLimit ?? 5_000 });
      lines = r.lines.map((l) => ({ crew: i, pairings: l.pairings, reserve: false, score: l.score }));
      wantedLines.set(i, lines);
    }
    return lines;
  };

  // Passes over the anchors — the most unhappy crew first, or in coverage mode
  // the open trips, most costly first — until a pass at the largest size improves nothing.
  const seen = new Set<string>();
  const tryGroup = (members: number[]): boolean => {
    const group = [...new Set(members)].sort((a, b) => a - b);
    const key = `${group.join(",")}|${group.map((i) => Master.key(columns[i]!)).join("|")}`;
    if (seen.has(key)) return false;
    seen.add(key);
    tried++;
    sinceGain++;
    const better = solveNeighbourhood(group);
    if (!better) return false;
    group.forEach((i, s) => (columns[i] = better[s]!));
    improved++;
    sinceGain = 0;
    return true;
  };
  /** Crew close to `anchor` in seniority, for room to pass trips on. */
  const fill = (members: number[], anchor: number) => {
    for (let d = 1; members.length < size && d < n; d++) {
      for (const h of [anchor - d, anchor + d]) if (h >= 0 && h < n && !members.includes(h) && members.length < size) members.push(h);
    }
    return members;
  };
  const random = mulberry32(0x5eed + n);
  for (let pass = 0; !out(); pass++) {
    let passImproved = false;
    if (cover) {
      const open = [...openPositions(need, columns, membersOf)].filter(([, left]) => left > 0).map(([p]) => p);
      open.sort((a, b) => openCost.get(b)! - openCost.get(a)! || a - b);
      for (const p of open) {
        if (out()) break;
        // Crew who may fly it, the least loaded first; then those whose trips clash with it.
        const start = problem.startMs[p]!;
        const end = problem.endMs[p]!;
        const able = problem.crew.map((_, i) => i).filter((i) => problem.crew[i]!.position[p]! >= 0);
        const credit = (i: number) => columns[i]!.pairings.reduce((t, k) => t + problem.pairings[k]!.creditMinutes, 0);
        const clash = (i: number) => columns[i]!.pairings.some((k) => problem.startMs[k]! < end + DAY && start < problem.endMs[k]! + DAY);
        const light = [...able].sort((a, b) => credit(a) - credit(b) || a - b);
        const tries = [
          light.slice(0, size),
          [...light.filter(clash).slice(0, Math.ceil(size / 2)), ...light.filter((i) => !clash(i))].slice(0, size),
          // and a few drawn at random among those who may fly it, for variety
          shuffled(able, random).slice(0, size),
        ];
        for (const members of tries) {
          if (members.length === 0 || out()) continue;
          if (tryGroup(fill(members, members[0]!))) {
            passImproved = true;
            break;
          }
        }
      }
    } else {
      const anchors = problem.crew
        .map((_, i) => i)
        .filter((i) => loss(i) > 1e-9)
        .sort((a, b) => loss(b) - loss(a) || a - b);
      for (const anchor of anchors) {
        if (out()) break;
        for (const { pairings: line } of wanted(anchor)) {
          if (out()) break;
          const held = holders();
          // The crew holding the wanted trips, those holding most of them first.
          const count = new Map<number, number>();
          for (const p of line) for (const h of held.get(p) ?? []) if (h !== anchor) count.set(h, (count.get(h) ?? 0) + 1);
          const others = [...count].sort((a, b) => b[1] - a[1] || a[0] - b[0]).map(([h]) => h);
          const random1 = shuffled(problem.crew.map((_, i) => i).filter((i) => i !== anchor && !others.includes(i)), random);
          const groups = [fill([anchor, ...others.slice(0, size - 1)], anchor), [anchor, ...others.slice(0, Math.ceil(size / 2)), ...random1].slice(0, size)];
          if (groups.some((g) => tryGroup(g))) {
            passImproved = true;
            break; // the anchor's loss changed: on to the next anchor
          }
        }
      }
    }
    if (!passImproved) {
      if (size >= largest) break;
      size = Math.min(largest, size + 2);
    }
  }
  return { columns, tried, improved, gain: valueOf(columns) - before };

  /** The neighbourhood's best award when it beats the lines it holds now. */
  function solveNeighbourhood(group: number[]): MasterColumn[] | undefined {
    const inGroup = new Set(group);
    // Positions the group may fill: what it holds now plus what is open.
    const covered = new Map<number, number>();
    for (const col of columns) for (const p of col.pairings) covered.set(p, (covered.get(p) ?? 0) + membersOf(col));
    const subNeed = new Map<number, number>();
    for (const i of group) for (const p of columns[i]!.pairings) subNeed.set(p, (subNeed.get(p) ?? 0) + membersOf(columns[i]!));
    let openNow = 0;
    for (const [p, d] of need) {
      const open = d - (covered.get(p) ?? 0);
      if (open <= 0) continue;
      subNeed.set(p, (subNeed.get(p) ?? 0) + open);
      openNow += openCost.get(p)! * open;
    }
    const pool = new Set(subNeed.keys());
    const reservesOutside = columns.reduce((t, col, i) => t + (col.reserve && !inGroup.has(i) ? membersOf(col) : 0), 0);
    const sizes = group.map((i) => problem.crew[i]!.members.length);
    const master = new Master(
      input.highs,
      group.length,
      subNeed,
      { min: Math.max(0, input.reserve.min - reservesOutside), max: Math.max(0, input.reserve.max - reservesOutside) },
      sizes,
    );
    try {
      const sub = (col: MasterColumn, s: number): MasterColumn => ({ ...col, crew: s });
      const whole = (col: MasterColumn): MasterColumn => ({ ...col, crew: group[col.crew]! });
      const subOpenCost = new Map([...subNeed.keys()].map((p) => [p, openCost.get(p)!]));
      const f = cover ? undefined : input.fairness;
      const columnCost = (col: MasterColumn) => (cover ? cover.tieBreak : 1) * input.coefficient(whole(col));
      if (cover) master.setCoverageObjective(subOpenCost);
      else master.setWishObjective(subOpenCost, openNow + TOL, columnCost, f ? { ...f, coefficient: (col) => f.coefficient(whole(col)), crewCount: group.length } : undefined);
      const add = (col: MasterColumn) => master.add(col, columnCost(col), f ? f.coefficient(whole(col)) : 0);
      const current = group.map((i, s) => sub(columns[i]!, s));
      current.forEach(add);
      group.forEach((i, s) => {
        add({ crew: s, pairings: [], reserve: true, score: 0 });
        for (const line of wanted(i)) if (line.pairings.every((p) => pool.has(p))) add(sub(line, s));
      });
      const nodeLimit = input.nodeLimit ?? 5_000;
      // A neighbourhood is one small step: a few seconds at most, however much time the run has left.
      const until = Math.min(input.deadline, performance.now() + STEP_MS);
      const remaining = () => Math.max(0.01, (until - performance.now()) / 1000);
      for (let round = 0; round < ROUNDS; round++) {
        const lp = master.solveLp(remaining(), halt, true);
        if (lp.status !== "optimal") break;
        const y = master.duals();
        const cost = new Float64Array(problem.pairings.length);
        for (const [p, row] of master.coverRow) cost[p] = y[row]!;
        let added = 0;
        group.forEach((i, s) => {
          const yi = y[master.crewRow[s]!]!;
          const fr = master.fairRow[s];
          const weight = (cover ? cover.tieBreak : 1) * input.scoreWeight(i, fr === undefined ? 0 : y[fr]!);
          const r = priceLines(problem, problem.crew[i]!, { scoreWeight: weight, cost, threshold: yi + TOL, maxLines: LINES, nodeLimit, allowed: (p) => pool.has(p) });
          for (const line of r.lines) if (add({ crew: s, pairings: line.pairings, reserve: false, score: line.score })) added++;
        });
        if (added === 0 || halt()) break;
      }
      const mip = master.solveMip(remaining(), halt, 1e-9, current);
      if (mip.status !== "optimal" && mip.status !== "time-limit" && mip.status !== "interrupted") return undefined;
      const x = master.values();
      const chosen = master.columns.filter((_, k) => x[k]! > 0.5);
      if (chosen.length !== group.length || new Set(chosen.map((c) => c.crew)).size !== group.length) return undefined;
      const next = group.map((_, s) => chosen.find((c) => c.crew === s)!);
      // Exact cover of what the group may fill, no more open time than now, and a better objective.
      const left = openPositions(subNeed, next, (col) => sizes[col.crew]!);
      if ([...left.values()].some((v) => v < 0)) return undefined;
      const openAfter = [...left].reduce((t, [p, v]) => t + openCost.get(p)! * v, 0);
      if (openAfter > openNow + 1e-6) return undefined;
      const proposal = [...columns];
      group.forEach((i, s) => (proposal[i] = whole(next[s]!)));
      if (!(valueOf(proposal) > valueOf(columns) + 1e-9)) return undefined;
      return next.map(whole);
    } finally {
      master.dispose();
    }
  }
}
