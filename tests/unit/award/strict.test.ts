/**
 * Strict seniority (lib/award, settings.mode "strict") against outside
 * oracles on tiny instances:
 *
 * 1. the lexicographic optimum by exhaustive enumeration and dynamic
 *    programming (oracle/strict-brute-force.ts — no lib/award code):
 *    coverage first, then every crew member's score in seniority order;
 * 2. the seniority audit (AWARD-MODEL.md): for each crew member, the best
 *    score over the enumerator's lines with every more senior crew member
 *    keeping the engine's score and the coverage kept — no improvement;
 * 3. the swap and move audits, with legality re-checked by lib/rules'
 *    checkLine on whole lines;
 * 4. each crew member's certificate: a bound at least the true optimum.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { solveAward, type AwardResult, type StrictCertificate } from "@/lib/award";
import { compactStrictAward } from "@/lib/award/compact-mip";
import { lineScore, type Instance, type Pairing } from "@/lib/domain";
import { checkLine } from "@/lib/rules";
import type { GeneratorInput } from "@/seed/generator/params";
import { enumerateLines, type Enumeration } from "./oracle/enumerate-lines.ts";
import { strictAudits } from "./oracle/audits.ts";
import { bestGivenSeniors, strictBruteForce, type StrictOptimum } from "./oracle/strict-brute-force.ts";
import { tinyInstance, type Variant } from "./oracle/tiny-instance.ts";

const H = 60;
const strictly = (v: Omit<Variant, "mode">): Variant => ({ ...v, mode: "strict" });
const CASES: { params: GeneratorInput; variant: Variant }[] = [
  ...[1, 2, 3, 4].map((seed) => ({ params: { crew: 5, seed, days: 7, pairings: 10 }, variant: strictly({ minCreditMinutes: 0, maxCreditMinutes: 30 * H }) })),
  ...[5, 6].map((seed) => ({ params: { crew: 4, seed, days: 10, pairings: 12 }, variant: strictly({ minCreditMinutes: 0, maxCreditMinutes: 40 * H }) })),
  ...[7, 8].map((seed) => ({ params: { crew: 6, seed, days: 8, pairings: 9 }, variant: strictly({ minCreditMinutes: 12 * H, maxCreditMinutes: 30 * H }) })),
  { params: { crew: 6, seed: 7, days: 8, pairings: 9 }, variant: strictly({ minCreditMinutes: 16 * H, maxCreditMinutes: 30 * H }) },
  { params: { crew: 6, seed: 9, days: 8, pairings: 10 }, variant: strictly({ minCreditMinutes: 6 * H, maxCreditMinutes: 30 * H, reserve: { min: 0, max: 1 } }) },
  // More crew than the trips need and a reserve minimum: who holds reserve is decided by seniority.
  { params: { crew: 7, seed: 10, days: 7, pairings: 8 }, variant: strictly({ minCreditMinutes: 0, maxCreditMinutes: 30 * H, reserve: { min: 2 } }) },
  { params: { crew: 7, seed: 11, days: 7, pairings: 8 }, variant: strictly({ minCreditMinutes: 0, maxCreditMinutes: 30 * H, reserve: { min: 2 } }) },
];

interface Case {
  name: string;
  instance: Instance;
  e: Enumeration;
  oracle: StrictOptimum;
  result: AwardResult;
  /** the engine's score per crew member, seniority order */
  scores: number[];
  /** the engine's lines, seniority order: pairing indices, or undefined for reserve */
  lines: (number[] | undefined)[];
}

const cases: Case[] = [];

beforeAll(async () => {
  for (const c of CASES) {
    const instance = tinyInstance(c.params, c.variant);
    const e = enumerateLines(instance);
    const oracle = strictBruteForce(e);
    const result = await solveAward(instance);
    const index = new Map(instance.pairings.map((p, k) => [p.id, k]));
    const byCrew = new Map(result.award.lines.map((l) => [l.crewId, l]));
    const awarded = e.crew.map((x) => byCrew.get(x.crew.id)!);
    cases.push({
      name: `crew ${c.params.crew}, seed ${c.params.seed}, pairings ${c.params.pairings}, credit ${c.variant.minCreditMinutes / H}–${c.variant.maxCreditMinutes / H} h, reserve ${JSON.stringify(c.variant.reserve ?? {})}`,
      instance,
      e,
      oracle,
      result,
      scores: awarded.map((l) => l.score),
      lines: awarded.map((l) => (l.kind === "reserve" ? undefined : l.pairings.map((id) => index.get(id)!))),
    });
  }
}, 300_000);

const pairingsOf = (c: Case, line: readonly number[]): Pairing[] => line.map((k) => c.instance.pairings[k]!);
/** lib/rules' full check of a whole line (undefined: a reserve line) for crew member i */
const legalFor = (c: Case, i: number, line: readonly number[] | undefined): boolean => {
  const member = c.e.crew[i]!.crew;
  if (!line) return checkLine(member, c.instance.ruleSet, [], c.e.engine, { reserve: true }).legal;
  return checkLine(member, c.instance.ruleSet, pairingsOf(c, line).map((pairing) => ({ kind: "pairing" as const, pairing })), c.e.engine).legal;
};
/** lineScore (lib/domain's one scoring contract) of a line for crew member i; a reserve line scores 0 */
const scoreFor = (c: Case, i: number, line: readonly number[] | undefined): number =>
  line ? lineScore(c.instance.bids[c.e.crew[i]!.crew.id] ?? [], pairingsOf(c, line), c.e.score, c.instance.settings) : 0;

describe("strict seniority against outside oracles", { timeout: 300_000 }, () => {
  it("the tiny instances are what the oracles assume", () => {
    expect(cases).toHaveLength(CASES.length);
    for (const c of cases) {
      expect(c.e.need.every((d) => d === 1), c.name).toBe(true);
      expect(c.result.report.illegalPairings, c.name).toEqual([]);
    }
    // Seniority binds somewhere: in some case a crew member does not get their best line alone.
    expect(cases.some((c) => c.oracle.scores.some((s, i) => s < c.e.crew[i]!.best - 1e-9))).toBe(true);
    // Reserve lines appear, and some crew member has no legal line-holder line at all.
    expect(cases.some((c) => c.oracle.lines.some((l) => l.reserve))).toBe(true);
    expect(cases.some((c) => c.e.crew.some((x) => x.best <= 0))).toBe(true);
  });

  // Oracle: exhaustive enumeration (lib/rules checkLine) and a backward dynamic program over subsets of pairings.
  it("reaches the lexicographic optimum: the brute force's coverage, then every crew member's score in seniority order", () => {
    const problems: string[] = [];
    for (const c of cases) {
      const { report } = c.result;
      if (report.openCreditMinutes !== c.oracle.openCreditMinutes || report.openPositions !== c.oracle.openPositions) {
        problems.push(`${c.name}: open ${report.openCreditMinutes} min in ${report.openPositions}, brute force ${c.oracle.openCreditMinutes} min in ${c.oracle.openPositions}`);
      }
      c.oracle.scores.forEach((s, i) => {
        if (!(Math.abs(c.scores[i]! - s) <= 1e-6)) problems.push(`${c.name}: seniority ${c.e.crew[i]!.crew.seniority} scores ${c.scores[i]}, lexicographic optimum ${s}`);
      });
      if (!report.provenOptimal) problems.push(`${c.name}: not proven optimal (${JSON.stringify(report.strictSteps)}; ${report.warnings.join("; ")})`);
    }
    expect(problems).toEqual([]);
  });

  it("passes the seniority audit: no crew member could score higher with the seniors' scores and the coverage kept", () => {
    const problems: string[] = [];
    for (const c of cases) {
      const coverage: [number, number] = [c.result.report.openCreditMinutes, c.result.report.openPositions];
      c.e.crew.forEach((x, k) => {
        const possible = bestGivenSeniors(c.e, k, c.scores.slice(0, k), coverage);
        if (possible > c.scores[k]! + 1e-6) problems.push(`${c.name}: seniority ${x.crew.seniority} could score ${possible}, holds ${c.scores[k]}`);
      });
    }
    expect(problems).toEqual([]);
  });

  it("passes the swap and move audits, and every line is legal under a whole-line re-check", () => {
    const problems: string[] = [];
    let swapsTried = 0;
    for (const c of cases) {
      const audit = strictAudits(c.instance, c.result.award);
      problems.push(...audit.problems.map((p) => `${c.name}: ${p}`));
      swapsTried += audit.swapsTried;
      // The engine's score is lib/domain's score of the line.
      c.lines.forEach((line, i) => {
        if (Math.abs(scoreFor(c, i, line) - c.scores[i]!) > 1e-9) problems.push(`${c.name}: seniority ${c.e.crew[i]!.crew.seniority}: score ${c.scores[i]}, lineScore ${scoreFor(c, i, line)}`);
      });
    }
    expect(swapsTried).toBeGreaterThan(20);
    expect(problems).toEqual([]);
  });

  it("gives reserve to the most junior: no reserve holder could legally hold a more junior colleague's line", () => {
    const withReserve = cases.filter((c) => c.instance.settings.reserve.min > 0);
    expect(withReserve.length).toBeGreaterThanOrEqual(2);
    for (const c of withReserve) {
      const reserve = c.lines.flatMap((l, i) => (l === undefined ? [i] : []));
      expect(reserve.length, c.name).toBeGreaterThanOrEqual(c.instance.settings.reserve.min);
      for (const i of reserve) {
        for (let j = i + 1; j < c.lines.length; j++) {
          const theirs = c.lines[j];
          if (theirs) expect(legalFor(c, i, theirs), `${c.name}: reserve holder ${c.e.crew[i]!.crew.seniority} could hold the line of ${c.e.crew[j]!.crew.seniority}`).toBe(false);
        }
      }
      // The award says why each of them holds reserve.
      const reasons = new Map(c.result.award.reserveReasons.map((r) => [r.crewId, r.reason]));
      for (const i of reserve) expect(reasons.get(c.e.crew[i]!.crew.id), c.name).toMatch(/reserve-minimum|no-legal-line|not-enough-trips/);
    }
    // In these cases seniority decides: the reserve holders are the most junior crew who have a legal line.
    const juniorMost = withReserve.filter((c) => {
      const reserve = c.lines.flatMap((l, i) => (l === undefined && c.e.crew[i]!.best > 0 ? [i] : []));
      const holders = c.e.crew.flatMap((x, i) => (x.best > 0 ? [i] : []));
      return reserve.every((i) => holders.indexOf(i) >= holders.length - reserve.length);
    });
    expect(juniorMost.length).toBeGreaterThanOrEqual(1);
  });

  it("certifies each crew member's score with a bound no lower than the true optimum given the seniors", () => {
    const problems: string[] = [];
    const methods = new Set<StrictCertificate["method"]>();
    for (const c of cases) {
      c.result.award.lines.forEach((line) => {
        const i = c.e.crew.findIndex((x) => x.crew.id === line.crewId);
        const cert = line.certificate as unknown as StrictCertificate | undefined;
        if (!cert) {
          problems.push(`${c.name}: no certificate for ${line.crewId}`);
          return;
        }
        methods.add(cert.method);
        if (cert.step !== i + 1) problems.push(`${c.name}: ${line.crewId} is step ${cert.step}, seniority place ${i + 1}`);
        if (Math.abs(cert.score - line.score) > 1e-9) problems.push(`${c.name}: certificate score ${cert.score}, line score ${line.score}`);
        // The bound must hold against the oracle's optimum for this crew member given the seniors (the same scores).
        if (cert.bound === null || cert.bound < c.oracle.scores[i]! - 1e-6) problems.push(`${c.name}: ${line.crewId}'s bound ${cert.bound} is below the optimum ${c.oracle.scores[i]}`);
        if (cert.method !== "unproven" && cert.bound !== null && cert.bound > cert.score + 1e-5) problems.push(`${c.name}: ${line.crewId} is certified by ${cert.method} with bound ${cert.bound} above ${cert.score}`);
        if (cert.method === "best-alone" && Math.abs((cert.bound ?? NaN) - c.e.crew[i]!.best) > 1e-9) problems.push(`${c.name}: best-alone bound ${cert.bound}, enumeration ${c.e.crew[i]!.best}`);
      });
    }
    expect(problems).toEqual([]);
    // More than the trivial evidence is exercised.
    expect([...methods].some((m) => m === "coverage" || m === "enumeration")).toBe(true);
  });

  // The benchmark's baseline for strict mode (compact model, stacked objectives) against the same oracle. Its
  // model counts rhythm wishes as met and approximates legality: so the cases are taken without rhythm wishes,
  // and where no line of the model had to be cut back to legal, it must reach the optimum exactly.
  it("the stacked compact baseline ends every step and, where its lines needed no repair, reaches the brute force's optimum", async () => {
    const problems: string[] = [];
    let exact = 0;
    for (const c of cases) {
      const bids = Object.fromEntries(Object.entries(c.instance.bids).map(([id, wishes]) => [id, wishes.filter((w) => w.kind !== "rhythm")]));
      const instance: Instance = { ...c.instance, bids };
      const oracle = strictBruteForce(enumerateLines(instance));
      const baseline = await compactStrictAward(instance, { timeLimitSeconds: 60 });
      expect(baseline.progress, c.name).toMatchObject({ coverage: true, settled: baseline.progress.steps });
      const byCrew = new Map(baseline.award.lines.map((l) => [l.crewId, l.score]));
      const lex = [baseline.report.openCreditMinutes, baseline.report.openPositions, ...c.e.crew.map((x) => -byCrew.get(x.crew.id)!)];
      const best = [oracle.openCreditMinutes, oracle.openPositions, ...oracle.scores.map((s) => -s)];
      const first = lex.findIndex((v, k) => Math.abs(v - best[k]!) > 1e-6);
      // A legal, exactly scored award can never be lexicographically better than the optimum.
      if (first >= 0 && lex[first]! < best[first]!) problems.push(`${c.name}: the baseline beats the lexicographic optimum at place ${first}`);
      if (!baseline.report.warnings.some((w) => /cut back/.test(w))) {
        exact++;
        if (first >= 0) problems.push(`${c.name}: the baseline differs from the optimum at place ${first}: ${lex[first]} against ${best[first]}`);
      }
    }
    expect(problems).toEqual([]);
    expect(exact).toBeGreaterThanOrEqual(3);
  });
});
