/**
 * The period's pairings: lengths, start times, red-eyes and oceanic trips in
 * proportions that look like a domestic base with a few long trips. Either a
 * fixed count, or as many as it takes for the trip credit to reach
 * `tightness` × crew capacity.
 */
import type { CrewMember, Pairing, RuleSet } from "../../lib/domain/index.ts";
import { addDays, instantMs, startOfLocalDay } from "../../lib/domain/time.ts";
import { checkLine, dutyRulesOnly } from "../../lib/rules/index.ts";
import { OCEANIC, OCEANIC_QUALIFICATION, STATIONS } from "../carrier.ts";
import { makePairing } from "../pairing-factory.ts";
import type { Rng } from "../random.ts";
import { CREW_PER_PAIRING, type GeneratorParams } from "./params.ts";
import { ruleSetFor } from "./rule-set-presets.ts";

/** Share of trips by length in days (a domestic base: short trips dominate). */
const LENGTHS: ReadonlyArray<readonly [number, number]> = [[1, 0.36], [2, 0.3], [3, 0.2], [4, 0.1], [5, 0.04]];
/** First departure, base local: [share, earliest, latest] in minutes after midnight. */
const STARTS: ReadonlyArray<readonly [number, number, number]> = [
  [0.35, 5 * 60 + 30, 7 * 60 + 55],
  [0.33, 8 * 60, 12 * 60 + 55],
  [0.24, 13 * 60, 18 * 60 + 55],
  [0.08, 21 * 60 + 30, 23 * 60 + 30], // red-eyes
];

function weighted<T>(r: Rng, items: ReadonlyArray<readonly [T, number]>): T {
  let x = r.next();
  for (const [item, w] of items) if ((x -= w) < 0) return item;
  return items[items.length - 1]![0];
}

const clock = (m: number) => `${String(Math.floor(m / 60)).padStart(2, "0")}:${String(m % 60).padStart(2, "0")}`;

/**
 * Crew available in a period, in whole crew members: each counts the share of
 * the period (base-local dates `first`..`last`) they are not on leave.
 */
export function availableCrew(crew: readonly CrewMember[], first: string, last: string, zone: string): number {
  const periodStart = instantMs(startOfLocalDay(first, zone));
  const periodEnd = instantMs(startOfLocalDay(addDays(last, 1), zone));
  return crew.reduce((sum, c) => {
    const away = c.fixedActivities
      .filter((a) => a.kind === "vacation")
      .reduce((t, a) => t + Math.max(0, Math.min(periodEnd, instantMs(a.end)) - Math.max(periodStart, instantMs(a.start))), 0);
    return sum + 1 - away / (periodEnd - periodStart);
  }, 0);
}

/** Minutes of line capacity: each crew member's capacity scaled by the share of days not on leave. */
export function capacityMinutes(crew: readonly CrewMember[], params: GeneratorParams, zone: string): number {
  return params.lineCapacityMinutes * availableCrew(crew, params.startDate, addDays(params.startDate, params.days - 1), zone);
}

/**
 * Whether a pairing on its own keeps every duty and rest limit of the rule
 * sets its positions fly under (line rules such as the credit window are the
 * line's business, not the trip's).
 */
function legalAlone(p: Pairing, ruleSets: readonly RuleSet[], params: GeneratorParams, zone: string): boolean {
  const crew = { id: "0", name: "check", seniority: 1, base: params.base, position: params.positions[0]!, qualifications: [], fixedActivities: [], carryIn: [], lookBack: { duties: [], dailyFlightMinutes: [] }, carriedWeight: 1 };
  const ctx = { stations: STATIONS, zone, periodStart: params.startDate, periodEnd: addDays(params.startDate, params.days - 1) };
  return ruleSets.every((rs) => checkLine(crew, rs, [{ kind: "pairing", pairing: p }], ctx).legal);
}

/** The duty and rest rules of each distinct preset the positions fly under. */
function dutyRuleSets(params: GeneratorParams): RuleSet[] {
  const byPreset = new Map(params.positions.map((pos) => [ruleSetFor(pos).preset, ruleSetFor(pos)]));
  return [...byPreset.values()].map(dutyRulesOnly);
}

export function makePairings(params: GeneratorParams, capacityPerPosition: number, r: Rng, flightNo: () => number, zone: string): Pairing[] {
  const ruleSets = dutyRuleSets(params);
  const crewNeeded = Object.fromEntries(params.positions.map((p) => [p, CREW_PER_PAIRING[p]]));
  const target = params.pairings ?? Infinity;
  const creditGoal = params.pairings ? Infinity : params.tightness * capacityPerPosition;
  const pairings: Pairing[] = [];
  let credit = 0;
  while (pairings.length < target && credit < creditGoal) {
    const k = pairings.length;
    const days = weighted(r, LENGTHS);
    const [, lo, hi] = weighted(r, STARTS.map((s) => [s, s[0]] as const));
    const startDate = addDays(params.startDate, r.int(0, params.days - 1));
    const oceanic = days >= 2 && r.next() < 0.35;
    const p = makePairing(
      {
        id: `T${1000 + k}`,
        base: params.base,
        startDate,
        days,
        firstDeparture: clock(Math.round(r.int(lo, hi) / 5) * 5),
        crewNeeded,
        requires: ["A220"],
        maxLegsPerDuty: weighted(r, [[2, 0.25], [3, 0.4], [4, 0.25], [5, 0.1]]),
        oceanic,
      },
      r,
      flightNo,
    );
    // The factory keeps rough limits; the legality engine has the last word. Draw again when it says no.
    if (!legalAlone(p, ruleSets, params, zone)) continue;
    if (p.dutyPeriods.some((d) => d.legs.some((l) => OCEANIC.has(l.to)))) p.requires = ["A220", OCEANIC_QUALIFICATION];
    pairings.push(p);
    credit += p.creditMinutes;
  }
  // Trip numbers in time order, the order crew read them in.
  return pairings
    .sort((a, b) => instantMs(a.dutyPeriods[0]!.report) - instantMs(b.dutyPeriods[0]!.report) || a.id.localeCompare(b.id))
    .map((p, k) => ({ ...p, id: `T${1000 + k}` }));
}
