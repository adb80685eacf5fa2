/**
 * The review of a finished run, from its own instance snapshot: every line
 * re-checked with lib/rules (whole-line legality, independent of the engine),
 * and open time by base-local day for the coverage calendar.
 */
import type { Award, Instance } from "../domain/index";
import { pairingDates } from "../domain/pairing-facts";
import { periodDates } from "../domain/time";
import { checkLine } from "../rules/index";

export interface RunReview {
  /** lines lib/rules calls legal, of all lines */
  legal: number;
  lines: number;
  /** each line lib/rules refuses, with its violations */
  problems: { crewId: string; texts: string[] }[];
  /** per base-local date of the period: open credit minutes of the open positions touching it */
  openByDay: { date: string; openCreditMinutes: number; positions: number }[];
}

export function reviewRun(instance: Instance, award: Award): RunReview {
  const { period, ruleSet } = instance;
  const engine = { stations: instance.stations, zone: period.zone, periodStart: period.startDate, periodEnd: period.endDate };
  const crew = new Map(instance.crew.map((c) => [c.id, c]));
  const pairings = new Map(instance.pairings.map((p) => [p.id, p]));
  const problems: RunReview["problems"] = [];
  for (const line of award.lines) {
    const member = crew.get(line.crewId);
    if (!member) {
      problems.push({ crewId: line.crewId, texts: ["not a crew member of this run's instance"] });
      continue;
    }
    const items = line.pairings.map((id) => ({ kind: "pairing" as const, pairing: pairings.get(id)! }));
    if (items.some((i) => !i.pairing)) {
      problems.push({ crewId: line.crewId, texts: ["holds a trip that is not in this run's instance"] });
      continue;
    }
    const verdict = checkLine(member, ruleSet, items, engine, { reserve: line.kind === "reserve" });
    if (!verdict.legal) problems.push({ crewId: line.crewId, texts: verdict.violations.map((v) => v.text) });
  }
  const open = new Map(periodDates(period.startDate, period.endDate).map((d) => [d, { openCreditMinutes: 0, positions: 0 }]));
  for (const o of award.openPairings) {
    const p = pairings.get(o.pairingId);
    if (!p) continue;
    for (const date of pairingDates(p, period.zone)) {
      const day = open.get(date);
      if (!day) continue;
      day.openCreditMinutes += o.openCreditMinutes;
      day.positions += o.positionsOpen;
    }
  }
  return { legal: award.lines.length - problems.length, lines: award.lines.length, problems, openByDay: [...open].map(([date, v]) => ({ date, ...v })) };
}
