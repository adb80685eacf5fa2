/**
 * An outside oracle for the award engine: every line of every crew member of a
 * tiny instance, found by exhaustive enumeration — no code of lib/award.
 *
 * For each crew member: every subset of the instance's pairings that need the
 * group's position (need > 0) which the legality engine's full check
 * (`checkLine`, kind "line") calls legal, plus the reserve line. Subsets are
 * enumerated by our own depth-first walk over the pairings in report order;
 * the only pruning is (a) subsets holding two pairings that overlap in time,
 * which the legality engine's no-overlap check always refuses, and (b)
 * pairings whose required qualifications the crew member does not hold
 * (`pairing.requires`, lib/domain/pairing.ts: "qualifications a crew member
 * must hold" — a domain fact checkLine does not look at).
 *
 * Each line is scored by `lineScore` (lib/domain, the one scoring contract)
 * with ScoreContext = { zone, periodStart, periodEnd } of the period and no
 * buddy line.
 */
import type { CrewMember, Instance, Pairing } from "@/lib/domain";
import { instantMs, lineScore, type ScoreContext } from "@/lib/domain";
import { checkLine, type EngineContext } from "@/lib/rules";

export interface OracleLine {
  /** pairing indices into instance.pairings, in report order; empty for reserve (and for an empty line-holder line) */
  pairings: number[];
  /** bit j set when the line holds `slots[j]` (see Enumeration.slots) */
  mask: number;
  reserve: boolean;
  /** lineScore for a line-holder line; 0 for reserve */
  score: number;
  creditMinutes: number;
}

export interface OracleCrew {
  crew: CrewMember;
  /** 0 = most senior */
  rank: number;
  /** line-holder lines that checkLine calls legal (the empty line included when legal) */
  lines: OracleLine[];
  /** the reserve line (always present, as in AWARD-MODEL.md: every crew member has one) */
  reserve: OracleLine;
  /** whether checkLine calls the reserve line legal (kind "reserve") — informational */
  reserveLegal: boolean;
  /** best_i: the highest score over `lines`, 0 when there is none */
  best: number;
  /** subsets handed to checkLine (after the overlap and qualification pruning) */
  checked: number;
}

export interface Enumeration {
  instance: Instance;
  /** pairing indices (into instance.pairings) with need > 0 for the group's position, in instance order; bit j of a mask is slots[j] */
  slots: number[];
  /** need of each slot */
  need: number[];
  /** crew in seniority order */
  crew: OracleCrew[];
  engine: EngineContext;
  score: ScoreContext;
}

export interface EnumerateOptions {
  /** refuse instances with more pairings than this (2^n subsets); default 16 */
  maxPairings?: number;
}

const reportMs = (p: Pairing) => instantMs(p.dutyPeriods[0]!.report);
const releaseMs = (p: Pairing) => instantMs(p.dutyPeriods.at(-1)!.release);

export function enumerateLines(instance: Instance, options: EnumerateOptions = {}): Enumeration {
  const { period, group, ruleSet, settings } = instance;
  const engine: EngineContext = { stations: instance.stations, zone: period.zone, periodStart: period.startDate, periodEnd: period.endDate };
  const score: ScoreContext = { zone: period.zone, periodStart: period.startDate, periodEnd: period.endDate };
  const slots = instance.pairings.flatMap((p, k) => ((p.crewNeeded[group.position] ?? 0) > 0 ? [k] : []));
  const maxPairings = options.maxPairings ?? 16;
  if (slots.length > maxPairings) throw new Error(`the oracle enumerates at most ${maxPairings} pairings; this instance has ${slots.length}`);
  const need = slots.map((k) => instance.pairings[k]!.crewNeeded[group.position]!);
  const bitOf = new Map(slots.map((k, j) => [k, j]));
  // Report order for the walk (ties by id, so the walk is deterministic).
  const order = [...slots].sort((a, b) => {
    const pa = instance.pairings[a]!;
    const pb = instance.pairings[b]!;
    return reportMs(pa) - reportMs(pb) || pa.id.localeCompare(pb.id);
  });
  const start = order.map((k) => reportMs(instance.pairings[k]!));
  const end = order.map((k) => releaseMs(instance.pairings[k]!));

  const crew = [...instance.crew]
    .sort((a, b) => a.seniority - b.seniority)
    .map((member, rank): OracleCrew => {
      const wishes = instance.bids[member.id] ?? [];
      const qualified = order.map((k) => instance.pairings[k]!.requires.every((q) => member.qualifications.includes(q)));
      const lines: OracleLine[] = [];
      let checked = 0;
      const chosen: number[] = []; // positions in `order`
      const consider = () => {
        checked++;
        const pairings = chosen.map((x) => instance.pairings[order[x]!]!);
        const verdict = checkLine(member, ruleSet, pairings.map((pairing) => ({ kind: "pairing" as const, pairing })), engine);
        if (!verdict.legal) return;
        lines.push({
          pairings: chosen.map((x) => order[x]!),
          mask: chosen.reduce((m, x) => m | (1 << bitOf.get(order[x]!)!), 0),
          reserve: false,
          score: lineScore(wishes, pairings, score, settings),
          creditMinutes: pairings.reduce((t, p) => t + p.creditMinutes, 0),
        });
      };
      // Every subset of pairwise non-overlapping, qualified pairings: each is visited once, in report order.
      const walk = (from: number) => {
        consider();
        for (let x = from; x < order.length; x++) {
          if (!qualified[x]) continue;
          if (chosen.some((y) => start[x]! < end[y]! && start[y]! < end[x]!)) continue;
          chosen.push(x);
          walk(x + 1);
          chosen.pop();
        }
      };
      walk(0);
      const reserveLegal = checkLine(member, ruleSet, [], engine, { reserve: true }).legal;
      const best = lines.reduce((b, l) => Math.max(b, l.score), 0);
      return { crew: member, rank, lines, reserve: { pairings: [], mask: 0, reserve: true, score: 0, creditMinutes: 0 }, reserveLegal, best, checked };
    });
  return { instance, slots, need, crew, engine, score };
}

/** W_i = (1 + β(n − 1 − rank)/n) · carriedWeight (rank 0 = most senior), as the brief and AWARD-MODEL.md state it. */
export function oracleWeight(rank: number, n: number, beta: number, carriedWeight: number): number {
  return (1 + (beta * (n - 1 - rank)) / n) * carriedWeight;
}
