/**
 * The strict-seniority audits of AWARD-MODEL.md on any award, with legality
 * re-checked by lib/rules' checkLine on whole lines (and the pairings'
 * required qualifications) and scores by lib/domain's
 * lineScore (the one scoring contract) — no code of lib/award:
 *
 * - swap: no senior would score higher with a junior's line that is legal for
 *   the senior while the junior could legally take the senior's line;
 * - move: no line holder can legally add an open pairing and score higher
 *   (nor can a reserve holder take one while the reserve minimum is met).
 */
import type { Award, CrewMember, Instance, Pairing } from "@/lib/domain";
import { instantMs, lineScore } from "@/lib/domain";
import { checkLine, type EngineContext } from "@/lib/rules";

export interface AuditResult {
  problems: string[];
  /** swaps in which both lines were legal for the other crew member */
  swapsTried: number;
  /** (crew member, open pairing) pairs checked */
  movesTried: number;
}

export function strictAudits(instance: Instance, award: Award, tolerance = 1e-6): AuditResult {
  const { period, ruleSet, settings } = instance;
  const engine: EngineContext = { stations: instance.stations, zone: period.zone, periodStart: period.startDate, periodEnd: period.endDate };
  const score = { zone: period.zone, periodStart: period.startDate, periodEnd: period.endDate };
  const byId = new Map(instance.pairings.map((p) => [p.id, p]));
  const members = new Map(instance.crew.map((c) => [c.id, c]));
  const lines = [...award.lines].sort((a, b) => members.get(a.crewId)!.seniority - members.get(b.crewId)!.seniority);
  const held = lines.map((l) => (l.kind === "reserve" ? undefined : l.pairings.map((id) => byId.get(id)!)));
  const who = lines.map((l) => members.get(l.crewId)!);
  // A line is legal for a crew member when they hold every qualification its pairings require
  // (pairing.requires, lib/domain/pairing.ts — a domain fact checkLine does not look at) and
  // checkLine calls it legal.
  const qualified = (member: CrewMember, line: readonly Pairing[]) => line.every((p) => p.requires.every((q) => member.qualifications.includes(q)));
  const legal = (member: CrewMember, line: readonly Pairing[] | undefined) =>
    line
      ? qualified(member, line) && checkLine(member, ruleSet, line.map((pairing) => ({ kind: "pairing" as const, pairing })), engine).legal
      : checkLine(member, ruleSet, [], engine, { reserve: true }).legal;
  const scoreOf = (member: CrewMember, line: readonly Pairing[] | undefined) =>
    line ? lineScore(instance.bids[member.id] ?? [], line, score, settings) : 0;
  const problems: string[] = [];
  let swapsTried = 0;
  let movesTried = 0;
  const mine = lines.map((_, i) => scoreOf(who[i]!, held[i]));
  for (let i = 0; i < lines.length; i++) {
    if (!legal(who[i]!, held[i])) problems.push(`the line of seniority ${who[i]!.seniority} is not legal`);
    for (let j = i + 1; j < lines.length; j++) {
      if (!legal(who[i]!, held[j]) || !legal(who[j]!, held[i])) continue;
      swapsTried++;
      const theirs = scoreOf(who[i]!, held[j]);
      if (theirs > mine[i]! + tolerance) problems.push(`seniority ${who[i]!.seniority} would score ${theirs} with the line of ${who[j]!.seniority}, holds ${mine[i]}`);
    }
  }
  const open = award.openPairings.map((o) => byId.get(o.pairingId)!);
  const reserves = held.filter((l) => l === undefined).length;
  held.forEach((line, i) => {
    if (line === undefined && reserves <= settings.reserve.min) return;
    for (const p of open) {
      movesTried++;
      const grown = [...(line ?? []), p].sort((a, b) => instantMs(a.dutyPeriods[0]!.report) - instantMs(b.dutyPeriods[0]!.report));
      if (legal(who[i]!, grown) && scoreOf(who[i]!, grown) > mine[i]! + tolerance) {
        problems.push(`seniority ${who[i]!.seniority} could add open ${p.id} and score ${scoreOf(who[i]!, grown)}, holds ${mine[i]}`);
      }
    }
  });
  return { problems, swapsTried, movesTried };
}
