/**
 * The award engine (lib/award) against outside oracles on tiny instances:
 *
 * 1. an exact optimum by exhaustive enumeration and dynamic programming
 *    (oracle/enumerate-lines.ts, oracle/brute-force.ts — no lib/award code);
 * 2. the master LP rebuilt from that enumeration and solved by a second
 *    solver, glpk.js (GNU Linear Programming Kit compiled to WebAssembly);
 * 3. an assignment special case solved by munkres-js (Kuhn–Munkres /
 *    Hungarian algorithm, Munkres 1957);
 * 4. column generation's stopping condition checked on the engine's own final
 *    duals: no enumerated line has positive reduced profit.
 *
 * Instances come from the bid-period generator (seed/generator) with a
 * credit window fitted to a period of 7–10 days (the preset's 65–95 h is
 * for a month) and mode "balanced" (the engine's mode).
 */
import { createRequire } from "node:module";
import GLPK, { type LP } from "glpk.js/node";
import { beforeAll, describe, expect, it } from "vitest";
import { solveAward, type AwardResult } from "@/lib/award";
import { mulberry32 } from "@/lib/award/improve";
import { loadHighs, Master } from "@/lib/award/master";
import { instantMs, satisfaction, type Instance } from "@/lib/domain";
import type { GeneratorInput } from "@/seed/generator/params";
import { bruteForce, type BruteForceResult } from "./oracle/brute-force.ts";
import { enumerateLines, oracleWeight, type Enumeration } from "./oracle/enumerate-lines.ts";
import { tinyInstance, type Variant } from "./oracle/tiny-instance.ts";

// munkres-js is CommonJS without type declarations: computeMunkres(costMatrix) → [row, column] pairs of a least-cost assignment.
const munkres = createRequire(import.meta.url)("munkres-js") as (cost: number[][]) => [number, number][];

interface Case {
  name: string;
  instance: Instance;
  e: Enumeration;
  brute: BruteForceResult;
  result: AwardResult;
}

const H = 60;
const CASES: { params: GeneratorInput; variant: Variant }[] = [
  ...[1, 2, 3, 4].map((seed) => ({ params: { crew: 5, seed, days: 7, pairings: 10 }, variant: { minCreditMinutes: 0, maxCreditMinutes: 30 * H } })),
  ...[5, 6].map((seed) => ({ params: { crew: 4, seed, days: 10, pairings: 12 }, variant: { minCreditMinutes: 0, maxCreditMinutes: 40 * H } })),
  // A credit minimum: some lines fall below it, reserve lines appear, some crew may have no legal line at all.
  // (At 8 h no optimum holds reserve; at 16 h one crew member of seed 7 has no legal line-holder line.)
  ...[7, 8].map((seed) => ({ params: { crew: 6, seed, days: 8, pairings: 9 }, variant: { minCreditMinutes: 12 * H, maxCreditMinutes: 30 * H } })),
  { params: { crew: 6, seed: 7, days: 8, pairings: 9 }, variant: { minCreditMinutes: 16 * H, maxCreditMinutes: 30 * H } },
  // A reserve maximum (the master's reserve row).
  { params: { crew: 6, seed: 9, days: 8, pairings: 10 }, variant: { minCreditMinutes: 6 * H, maxCreditMinutes: 30 * H, reserve: { min: 0, max: 1 } } },
];

const describeCase = (c: { params: GeneratorInput; variant: Variant }) =>
  `crew ${c.params.crew}, seed ${c.params.seed}, days ${c.params.days}, pairings ${c.params.pairings}, credit ${c.variant.minCreditMinutes / H}–${c.variant.maxCreditMinutes / H} h` +
  (c.variant.reserve ? `, reserve ${c.variant.reserve.min}..${c.variant.reserve.max ?? "n"}` : "");

/** Every crew member holds a legal line-holder line (best_i > 0): the LP bound carries no constant. */
const allHoldLines = (c: Case) => c.e.crew.every((x) => x.best > 0);
const hasReserveRow = (c: Case) => c.instance.settings.reserve.min > 0 || (c.instance.settings.reserve.max ?? Infinity) < c.instance.crew.length;

let glpk: Awaited<ReturnType<typeof GLPK>>;
const cases: Case[] = [];

beforeAll(async () => {
  glpk = await GLPK();
  for (const c of CASES) {
    const instance = tinyInstance(c.params, c.variant);
    const e = enumerateLines(instance);
    const brute = bruteForce(e);
    const result = await solveAward(instance);
    cases.push({ name: describeCase(c), instance, e, brute, result });
  }
}, 120_000);

/**
 * The master LP of AWARD-MODEL.md over every enumerated line, for glpk.js:
 * λ for each line (reserve included), u_p for each pairing, 0 ≤ λ, u ≤ 1;
 * one line per crew member (= 1); Σ lines covering p + u_p = 1; reserve
 * bounds when the settings set them. Phase 1 minimises Σ (c_p + 1/(1+P)) u_p;
 * phase 2 adds Σ (c_p + 1/(1+P)) u_p ≤ limit and maximises Σ W_i·score/best_i λ.
 */
function masterLp(c: Case, phase: 1 | 2, limit = Infinity): LP {
  const { e, brute } = c;
  const P = e.slots.length;
  const openCost = e.slots.map((k) => e.instance.pairings[k]!.creditMinutes + 1 / (1 + P));
  const subjectTo: LP["subjectTo"] = [];
  const bounds: NonNullable<LP["bounds"]> = [];
  const objective: { name: string; coef: number }[] = [];
  const cover: { name: string; coef: number }[][] = e.slots.map((_, j) => [{ name: `u${j}`, coef: 1 }]);
  const reserves: { name: string; coef: number }[] = [];
  e.crew.forEach((x, i) => {
    const row: { name: string; coef: number }[] = [];
    const W = brute.weights[i]!;
    x.lines.forEach((l, k) => {
      const name = `x${i}_${k}`;
      row.push({ name, coef: 1 });
      bounds.push({ name, type: glpk.GLP_DB, lb: 0, ub: 1 });
      objective.push({ name, coef: phase === 2 ? (W * l.score) / x.best : 0 });
      e.slots.forEach((_, j) => {
        if (l.mask & (1 << j)) cover[j]!.push({ name, coef: 1 });
      });
    });
    const reserve = `r${i}`;
    row.push({ name: reserve, coef: 1 });
    reserves.push({ name: reserve, coef: 1 });
    bounds.push({ name: reserve, type: glpk.GLP_DB, lb: 0, ub: 1 });
    objective.push({ name: reserve, coef: 0 });
    subjectTo.push({ name: `crew${i}`, vars: row, bnds: { type: glpk.GLP_FX, lb: 1, ub: 1 } });
  });
  cover.forEach((vars, j) => subjectTo.push({ name: `cover${j}`, vars, bnds: { type: glpk.GLP_FX, lb: 1, ub: 1 } }));
  const { min, max } = e.instance.settings.reserve;
  if (min > 0 || max !== undefined) subjectTo.push({ name: "reserve", vars: reserves, bnds: { type: glpk.GLP_DB, lb: min, ub: max ?? e.crew.length } });
  e.slots.forEach((_, j) => {
    bounds.push({ name: `u${j}`, type: glpk.GLP_DB, lb: 0, ub: 1 });
    objective.push({ name: `u${j}`, coef: phase === 1 ? openCost[j]! : 0 });
  });
  if (phase === 2) {
    subjectTo.push({ name: "coverage", vars: e.slots.map((_, j) => ({ name: `u${j}`, coef: openCost[j]! })), bnds: { type: glpk.GLP_UP, lb: 0, ub: limit } });
  }
  return {
    name: `master-phase-${phase}`,
    objective: { direction: phase === 1 ? glpk.GLP_MIN : glpk.GLP_MAX, name: "z", vars: objective },
    subjectTo,
    bounds,
  };
}

function solveLp(lp: LP): number {
  const r = glpk.solve(lp, { msglev: glpk.GLP_MSG_OFF });
  if (r.result.status !== glpk.GLP_OPT) throw new Error(`glpk.js: ${lp.name} not solved to optimality (status ${r.result.status})`);
  return r.result.z;
}

describe("the award engine against outside oracles", { timeout: 120_000 }, () => {
  it("the tiny instances are what the oracles assume", () => {
    expect(cases).toHaveLength(CASES.length);
    for (const c of cases) {
      // Generated pairings need one captain each; the brute force asserts it too.
      expect(c.e.need.every((d) => d === 1), c.name).toBe(true);
      expect(c.e.slots.length, c.name).toBeGreaterThanOrEqual(9);
      // Lines of several pairings exist, so the award is not a mere assignment.
      expect(c.e.crew.some((x) => x.lines.some((l) => l.pairings.length >= 2)), c.name).toBe(true);
      // The engine saw no pairing illegal by itself, so its P (positions in the master) is ours.
      expect(c.result.report.illegalPairings, c.name).toEqual([]);
    }
    expect(cases.filter(allHoldLines).length).toBeGreaterThanOrEqual(6);
    // The credit-minimum cases leave crew with reserve as their only legal line, or as the best choice.
    expect(cases.some((c) => c.brute.lines.some((l) => l.reserve))).toBe(true);
    // … and some crew member has no legal line-holder line at all (best_i = 0: satisfaction 1 by definition).
    expect(cases.some((c) => c.e.crew.some((x) => x.best <= 0))).toBe(true);
  });

  // Oracle: exhaustive enumeration of legal lines (lib/rules checkLine) and a dynamic program over subsets of pairings.
  it("reaches the brute-force optimum: the same open credit, the same Σ W·satisfaction, proven optimal", () => {
    const problems: string[] = [];
    for (const c of cases) {
      const { report } = c.result;
      if (report.openCreditMinutes !== c.brute.openCreditMinutes || report.openPositions !== c.brute.openPositions) {
        problems.push(`${c.name}: open credit ${report.openCreditMinutes} min in ${report.openPositions} pairings, brute force ${c.brute.openCreditMinutes} min in ${c.brute.openPositions}`);
      }
      if (!(Math.abs(report.objective - c.brute.objective) <= 1e-6)) {
        problems.push(`${c.name}: objective ${report.objective}, brute force ${c.brute.objective} (difference ${report.objective - c.brute.objective})`);
      }
      if (!report.provenOptimal) problems.push(`${c.name}: not proven optimal (warnings: ${report.warnings.join("; ") || "none"})`);
    }
    expect(problems).toEqual([]);
  });

  // Oracle: the enumeration's best line alone (best_i), the weights W_i of the brief, and each awarded line re-checked.
  it("measures satisfaction against the true best line alone, weighs crew by W_i, and awards only enumerated legal lines", () => {
    const problems: string[] = [];
    for (const c of cases) {
      const { report, award } = c.result;
      const n = c.e.crew.length;
      let weighted = 0;
      const covered = new Set<number>();
      c.e.crew.forEach((x, i) => {
        const id = x.crew.id;
        if (!(Math.abs((report.best[id] ?? NaN) - x.best) <= 1e-9)) problems.push(`${c.name}: best of ${id} is ${report.best[id]}, enumeration ${x.best}`);
        const W = oracleWeight(i, n, c.instance.settings.seniorityWeight, x.crew.carriedWeight);
        if (!(Math.abs((report.weights[id] ?? NaN) - W) <= 1e-12)) problems.push(`${c.name}: W of ${id} is ${report.weights[id]}, expected ${W}`);
        const line = award.lines.find((l) => l.crewId === id);
        if (!line) {
          problems.push(`${c.name}: no line for ${id}`);
          return;
        }
        const ids = [...line.pairings].sort();
        const match =
          line.kind === "reserve"
            ? x.reserve
            : x.lines.find((l) => l.pairings.map((k) => c.instance.pairings[k]!.id).sort().join() === ids.join());
        if (!match) {
          problems.push(`${c.name}: ${id}'s awarded line [${ids.join(", ")}] is not among the enumerated legal lines`);
          return;
        }
        if (!(Math.abs(line.score - match.score) <= 1e-9)) problems.push(`${c.name}: ${id}'s line scores ${line.score}, lineScore ${match.score}`);
        for (const k of match.pairings) {
          if (covered.has(k)) problems.push(`${c.name}: ${c.instance.pairings[k]!.id} awarded twice`);
          covered.add(k);
        }
        weighted += W * satisfaction(match.score, x.best);
      });
      const open = c.e.slots.filter((k) => !covered.has(k)).reduce((t, k) => t + c.instance.pairings[k]!.creditMinutes, 0);
      if (open !== report.openCreditMinutes) problems.push(`${c.name}: the award leaves ${open} min open, the report says ${report.openCreditMinutes}`);
      if (!(Math.abs(weighted - report.objective) <= 1e-9)) problems.push(`${c.name}: the award's Σ W·satisfaction is ${weighted}, the report says ${report.objective}`);
    }
    expect(problems).toEqual([]);
  });

  // Second solver: glpk.js (GNU Linear Programming Kit compiled to WebAssembly) on the master LP of every enumerated line.
  it("reports the master LP's optimum as its bounds, as glpk.js finds it over every legal line", () => {
    const problems: string[] = [];
    const checked = cases.filter(allHoldLines);
    expect(checked.length).toBeGreaterThanOrEqual(6);
    for (const c of checked) {
      const P = c.e.slots.length;
      const z1 = solveLp(masterLp(c, 1));
      // The LP relaxation bounds the integer coverage optimum from below (a check of the oracles themselves).
      expect(z1, c.name).toBeLessThanOrEqual(c.brute.openCost + 1e-6);
      // Phase 1: coverageLpBound is a lower bound on open credit (AwardReport) — valid against the brute force, and
      // no weaker than glpk's LP optimum less the positions' share P/(1+P) and one tie-break step δ = 1/(1+P).
      const lpCoverage = Math.max(0, z1 - P / (1 + P));
      const { coverageLpBound } = c.result.report;
      if (!(coverageLpBound <= c.brute.openCreditMinutes + 1e-6 && coverageLpBound >= lpCoverage - 1 / (1 + P) - 1e-6)) {
        problems.push(`${c.name}: coverageLpBound ${coverageLpBound}; brute-force open credit ${c.brute.openCreditMinutes}; glpk phase-1 LP ${z1} − P/(1+P) = ${lpCoverage}`);
      }
      // Phase 2 with coverage held at the integer phase-1 optimum U* (brute force, same units).
      const z2 = solveLp(masterLp(c, 2, c.brute.openCost));
      expect(z2, c.name).toBeGreaterThanOrEqual(c.brute.objective - 1e-6);
      if (!(Math.abs(c.result.report.lpBound - z2) <= 1e-6)) {
        // For the report: the LP with the engine's own coverage limit, U* + 1e-6·max(1, U*) (lib/award/solve.ts).
        const relaxed = solveLp(masterLp(c, 2, c.brute.openCost + 1e-6 * Math.max(1, c.brute.openCost)));
        problems.push(
          `${c.name}: lpBound ${c.result.report.lpBound}, glpk phase-2 LP ${z2} (difference ${c.result.report.lpBound - z2}; U* = ${c.brute.openCost}; ` +
            `glpk with the limit U* + 1e-6·max(1, U*): ${relaxed}; integer optimum ${c.brute.objective})`,
        );
      }
    }
    expect(problems).toEqual([]);
  });

  // A run stopped part-way (as a cancel or a time limit stops it: between pricing calls) may report a weaker
  // bound, never one below the optimum — a pricing round cut short must not count as a bound.
  it("never reports a bound below the brute-force optimum when stopped part-way through pricing", async () => {
    const problems: string[] = [];
    for (const c of cases.slice(0, 4)) {
      for (const polls of [3, 7, 12, 20, 35]) {
        let seen = 0;
        const r = await solveAward(c.instance, { shouldStop: () => ++seen > polls });
        if (r.report.lpBound < c.brute.objective - 1e-9) problems.push(`${c.name}, stopped after ${polls} polls: bound ${r.report.lpBound} below the optimum ${c.brute.objective}`);
        if (r.report.provenOptimal && Math.abs(r.report.objective - c.brute.objective) > 1e-6) problems.push(`${c.name}, stopped after ${polls} polls: claims optimality at ${r.report.objective}`);
      }
    }
    expect(problems).toEqual([]);
  });

  // Lagrangian duality (Geoffrion 1974): with the crew rows kept and every other row priced, any duals give an
  // upper bound on the LP over all lines, equal to it at the LP's duals. Each crew member's best line value comes
  // from the independent enumeration; checked for phase 1 (open time), phase 2 (wishes), phase 2 with a fairness
  // floor, and phase 1 with a reserve line required, at random duals of either sign and at the LP's own.
  it("turns any duals into a bound on the LP over all enumerated lines, met at the LP's duals (Master.lagrangianBound)", async () => {
    const highs = await loadHighs();
    const problems: string[] = [];
    const checked = cases.filter(allHoldLines);
    for (const c of checked) {
      const { e, brute } = c;
      const n = e.crew.length;
      const P = e.slots.length;
      const need = new Map(e.slots.map((k) => [k, 1]));
      const openCost = new Map(e.slots.map((k) => [k, e.instance.pairings[k]!.creditMinutes + 1 / (1 + P)]));
      const { min, max } = e.instance.settings.reserve;
      const random = mulberry32(e.slots.length * 7919 + n);
      const FLOOR = 0.6;
      for (const variant of ["open time", "wishes", "wishes with a floor", "open time with a reserve line required"] as const) {
        const phase = variant.startsWith("open time") ? 1 : 2;
        const floor = variant === "wishes with a floor";
        const reserve = variant === "open time with a reserve line required" ? { min: Math.max(1, min), max: max ?? n } : { min, max: max ?? n };
        const master = new Master(highs, n, need, reserve);
        try {
          master.setCoverageObjective(openCost);
          if (phase === 2) {
            master.setWishObjective(openCost, brute.openCost + 1e-9, () => 0, floor ? { floor: FLOOR, penalty: 100, coefficient: () => 0, crewCount: n } : undefined);
          }
          // Every enumerated line in the master, so that its LP optimum z* is the LP over all lines.
          const sigma = (i: number, score: number) => score / e.crew[i]!.best;
          e.crew.forEach((x, i) => {
            master.add({ crew: i, pairings: [], reserve: true, score: 0 }, 0, 0);
            for (const l of x.lines) {
              master.add({ crew: i, pairings: l.pairings, reserve: false, score: l.score }, phase === 2 ? brute.weights[i]! * sigma(i, l.score) : 0, floor ? sigma(i, l.score) : 0);
            }
          });
          const lp = master.solveLp(60, () => false);
          expect(lp.status, `${c.name}, ${variant}`).toBe("optimal");
          const zStar = lp.objective;
          if (variant !== "wishes with a floor" && reserve.min === min && !(zStar >= (phase === 1 ? -brute.openCost : brute.objective) - 1e-7)) problems.push(`${c.name}, ${variant}: LP ${zStar} below the brute-force optimum`);
          const lineValue = (y: Float64Array, i: number) =>
            Math.max(
              ...e.crew[i]!.lines.map((l) => {
                let v = phase === 2 ? brute.weights[i]! * sigma(i, l.score) : 0;
                if (floor) v -= y[master.fairRow[i]!]! * sigma(i, l.score);
                for (const k of l.pairings) v -= y[master.coverRow.get(k)!]!;
                return v;
              }),
            );
          const bound = (y: Float64Array) => master.lagrangianBound(y, e.crew.map((_, i) => lineValue(y, i)));
          // At the LP's own duals the bound is the LP optimum (strong duality): this pins every sign and term.
          const atLp = bound(master.project(master.duals()));
          if (!(Math.abs(atLp - zStar) <= 1e-6)) problems.push(`${c.name}, ${variant}: L(y*) = ${atLp} at the LP's duals, LP optimum ${zStar}`);
          for (let trial = 0; trial < 300; trial++) {
            const scale = [0.01, 1, 30, 1000][trial % 4]!;
            const raw = Float64Array.from({ length: master.rowCount }, () => (random() * 2 - 1) * scale);
            if (master.coverageRow >= 0) raw[master.coverageRow] = (random() * 2 - 1) * (scale / 100);
            const value = bound(master.project(raw));
            if (!(value >= zStar - 1e-7)) problems.push(`${c.name}, ${variant}, trial ${trial}: L(y) = ${value} below the LP optimum ${zStar}`);
          }
          // At zero duals it is each crew member's best line alone: Σ W_i for wishes, and 0 open in phase 1.
          const zero = new Float64Array(master.rowCount);
          const expected = phase === 1 ? 0 : brute.weights.reduce((t, w) => t + w, 0);
          if (!(Math.abs(bound(zero) - expected) <= 1e-9)) problems.push(`${c.name}, ${variant}: L(0) = ${bound(zero)}, expected ${expected}`);
        } finally {
          master.dispose();
        }
      }
    }
    expect(checked.length).toBeGreaterThanOrEqual(6);
    expect(problems).toEqual([]);
  });

  // Reduced profits from the engine's final duals (AWARD-MODEL.md, column generation), over every enumerated line.
  it("stops column generation only when no legal line has positive reduced profit", () => {
    const problems: string[] = [];
    const checked = cases.filter((c) => allHoldLines(c) && !hasReserveRow(c));
    expect(checked.length).toBeGreaterThanOrEqual(6);
    for (const c of checked) {
      const { stats, report } = c.result;
      if (!(stats.rounds > 1)) problems.push(`${c.name}: ${stats.rounds} column-generation round(s)`);
      const duals = report.finalDuals;
      if (!duals) {
        problems.push(`${c.name}: no final duals`);
        continue;
      }
      let lines = 0;
      c.e.crew.forEach((x, i) => {
        const id = x.crew.id;
        const pi = duals.crew[id];
        const a = duals.scoreCoefficient[id];
        if (pi === undefined || a === undefined) {
          problems.push(`${c.name}: no dual for crew ${id}`);
          return;
        }
        // a_i = W_i / best_i without a fairness floor.
        const expectedA = c.brute.weights[i]! / x.best;
        if (!(Math.abs(a - expectedA) <= 1e-9)) problems.push(`${c.name}: score coefficient of ${id} is ${a}, W/best = ${expectedA}`);
        for (const l of [x.reserve, ...x.lines]) {
          let mu = 0;
          for (const k of l.pairings) {
            const y = duals.pairings[c.instance.pairings[k]!.id];
            if (y === undefined) problems.push(`${c.name}: no dual for pairing ${c.instance.pairings[k]!.id}`);
            mu += y ?? 0;
          }
          const profit = a * l.score - pi - mu;
          lines++;
          if (profit > 1e-6) {
            const names = l.reserve ? "reserve" : `[${l.pairings.map((k) => c.instance.pairings[k]!.id).join(", ")}]`;
            problems.push(`${c.name}: ${id}'s line ${names} (score ${l.score}) has reduced profit ${profit} (a ${a}, π ${pi}, Σμ ${mu})`);
          }
        }
      });
      expect(lines, c.name).toBeGreaterThan(c.e.crew.length);
    }
    expect(problems).toEqual([]);
  });
});

/**
 * A period where every pairing is in progress at one instant, so no line
 * holds two (the legality engine refuses overlapping trips), and the credit
 * minimum (1 minute) makes the empty line illegal: every line holds exactly
 * one pairing, crew count = pairing count, and the award is an assignment.
 */
function assignmentInstance(seed: number, size: number): Instance {
  const pick = (instance: Instance): Instance => {
    const ps = instance.pairings;
    const report = ps.map((p) => instantMs(p.dutyPeriods[0]!.report));
    const release = ps.map((p) => instantMs(p.dutyPeriods.at(-1)!.release));
    // The instant covered by the most trips needing no extra qualification (every crew member holds "A220").
    let chosen: number[] = [];
    for (const t of report) {
      const at = ps.flatMap((p, k) => (report[k]! <= t && t < release[k]! && p.requires.every((q) => q === "A220") ? [k] : []));
      if (at.length > chosen.length) chosen = at;
    }
    if (chosen.length < size) throw new Error(`seed ${seed}: only ${chosen.length} trips overlap at one instant`);
    const pairings = chosen.slice(0, size).map((k) => ps[k]!);
    // Crew on leave in the period could fly none of the trips: leave them out (training and carry-in stay, and restrict some).
    const crew = [...instance.crew]
      .sort((a, b) => a.seniority - b.seniority)
      .filter((c) => c.fixedActivities.every((a) => a.kind === "training" || a.kind === "office"))
      .slice(0, size);
    if (crew.length < size) throw new Error(`seed ${seed}: only ${crew.length} crew without leave`);
    const ids = new Set(crew.map((c) => c.id));
    return { ...instance, pairings, crew, bids: Object.fromEntries(Object.entries(instance.bids).filter(([id]) => ids.has(id))) };
  };
  return tinyInstance({ crew: size + 4, seed, days: 10, pairings: 40 }, { minCreditMinutes: 1, maxCreditMinutes: 40 * H }, pick);
}

describe("the assignment special case", { timeout: 60_000 }, () => {
  // Oracle: munkres-js (Kuhn–Munkres / Hungarian algorithm, Munkres 1957) on the matrix W_i·score_ip/best_i.
  it.each([
    [11, 5],
    [12, 5],
    [13, 6],
  ])("equals the Hungarian algorithm's optimum (generator seed %i, %i crew and trips)", async (seed, size) => {
    const instance = assignmentInstance(seed, size);
    const e = enumerateLines(instance);
    expect(e.slots).toHaveLength(size);
    expect(e.crew).toHaveLength(size);
    // Every legal line holds exactly one pairing.
    expect(e.crew.flatMap((x) => x.lines.map((l) => l.pairings.length)).every((len) => len === 1)).toBe(true);
    const n = e.crew.length;
    const W = e.crew.map((x) => oracleWeight(x.rank, n, instance.settings.seniorityWeight, x.crew.carriedWeight));
    // value[i][j]: W_i·score/best_i of crew i flying slot j alone; undefined when that line is illegal.
    const value = e.crew.map((x, i) => e.slots.map((_, j) => {
      const l = x.lines.find((line) => line.mask === 1 << j);
      return l ? (W[i]! * l.score) / x.best : undefined;
    }));
    const legal = value.flat().filter((v): v is number => v !== undefined);
    // The scores differ, so the assignment is a real choice.
    expect(new Set(legal.map((v) => v.toFixed(9))).size).toBeGreaterThan(n);
    const top = Math.max(...legal);
    const forbidden = top + 1000; // far above any legal cost: never chosen while a legal perfect assignment exists
    const cost = value.map((row) => row.map((v) => (v === undefined ? forbidden : top - v)));
    const assignment = munkres(cost);
    expect(assignment).toHaveLength(n);
    expect(assignment.every(([i, j]) => value[i]![j] !== undefined)).toBe(true);
    const optimum = assignment.reduce((t, [i, j]) => t + value[i]![j]!, 0);

    // The brute force agrees with the Hungarian algorithm (the two oracles check each other).
    const brute = bruteForce(e);
    expect(brute.openCreditMinutes).toBe(0);
    expect(brute.objective).toBeCloseTo(optimum, 9);

    const { award, report } = await solveAward(instance);
    expect(report.openPositions).toBe(0);
    expect(award.openPairings).toEqual([]);
    expect(new Set(award.lines.flatMap((l) => l.pairings))).toEqual(new Set(instance.pairings.map((p) => p.id)));
    expect(award.lines.every((l) => l.kind === "line" && l.pairings.length === 1)).toBe(true);
    expect(Math.abs(report.objective - optimum)).toBeLessThanOrEqual(1e-9);
  });
});
