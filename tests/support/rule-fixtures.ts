/**
 * Hand-made crew, pairings and stations for the legality engine's tests.
 * The carrier is the project's own fictional one (seed/carrier.ts): base HLV
 * in America/Denver, short hops to PLM and CBS (same zone), EMR in New York,
 * and OSY in Europe/Berlin, more than 60° of longitude from HLV (acclimation
 * cases). Times are written as local clock times and turned into UTC instants
 * by lib/domain/time.ts only.
 */
import {
  crewMemberSchema,
  pairingSchema,
  type CrewMember,
  type DutyPeriod,
  type Leg,
  type Pairing,
  type RuleSet,
} from "../../lib/domain/index.ts";
import { addMinutes, atLocalTime, instantMs, minutesBetween } from "../../lib/domain/time.ts";
import type { EngineContext, LineItem, PresetId } from "../../lib/rules/index.ts";
import { presetRuleSet } from "../../lib/rules/index.ts";
import { STATIONS, blockMinutes } from "../../seed/carrier.ts";

export { STATIONS };
export const BASE = "HLV";
export const ZONE = "America/Denver";
export const BERLIN = "Europe/Berlin";

/** The agreement rules every preset carries on top of its regulation. */
export const AGREEMENT_RULE_IDS = ["credit-window", "min-days-off", "max-days-on", "rest-at-base", "days-between-trips"] as const;

/** A preset with only the named rules left: so that only the rule under test speaks. */
export function only(preset: PresetId, ...ids: string[]): RuleSet {
  const rs = presetRuleSet(preset);
  const rules = rs.rules.filter((r) => ids.includes(r.id));
  if (rules.length !== ids.length) throw new Error(`preset ${preset} lacks one of ${ids.join(", ")}`);
  return { ...rs, rules };
}

/** A preset without its agreement rules (credit window, days off, days on). */
export function regulationOnly(preset: PresetId): RuleSet {
  const rs = presetRuleSet(preset);
  return { ...rs, rules: rs.rules.filter((r) => !(AGREEMENT_RULE_IDS as readonly string[]).includes(r.id)) };
}

/** "2027-05-12", "07:00" in a zone (base's by default) → UTC instant. */
export const at = (date: string, time: string, zone: string = ZONE) => atLocalTime(date, time, zone);

export function crew(extra: Partial<Omit<CrewMember, "lookBack">> & { lookBack?: Partial<CrewMember["lookBack"]> } = {}): CrewMember {
  const { lookBack, ...rest } = extra;
  return crewMemberSchema.parse({
    id: "10001",
    name: "Test Captain",
    seniority: 1,
    base: BASE,
    position: "captain",
    ...rest,
    lookBack: { duties: [], dailyFlightMinutes: [], ...lookBack },
  });
}

export function context(periodStart = "2027-05-01", periodEnd = "2027-05-31"): EngineContext {
  return { stations: STATIONS, periodStart, periodEnd, zone: ZONE };
}

export interface DutyOptions {
  /** duty length report → release, minutes; default: legs plus 60 min before and 30 min after */
  minutes?: number;
  /** block per leg, minutes; default the carrier's block for the city pair, else 45 */
  blocks?: number[];
  /** 0-based leg indexes flown as deadhead (not segments, 14 CFR 117.3) */
  deadheads?: number[];
  /** minutes from report to the first departure; default 60, or 30 when `minutes` is given */
  lead?: number;
  /** minutes between legs; default 30, or 20 when `minutes` is given */
  turn?: number;
}

let flight = 1000;

/** One duty period flying `route` (stations in order), reporting at `report` (UTC instant). */
export function duty(report: string, route: readonly string[], o: DutyOptions = {}): DutyPeriod {
  if (route.length < 2) throw new Error("a route needs two stations");
  const fixed = o.minutes !== undefined;
  const lead = o.lead ?? (fixed ? 30 : 60);
  const turn = o.turn ?? (fixed ? 20 : 30);
  const legs: Leg[] = [];
  let t = addMinutes(report, lead);
  for (let k = 0; k < route.length - 1; k++) {
    const from = route[k]!;
    const to = route[k + 1]!;
    const block = o.blocks?.[k] ?? blockMinutes(from, to) ?? 45;
    const arrival = addMinutes(t, block);
    legs.push({ flightNumber: `LK${flight++}`, from, to, departure: t, arrival, deadhead: o.deadheads?.includes(k) ?? false, blockMinutes: block });
    t = addMinutes(arrival, turn);
  }
  const lastArrival = legs.at(-1)!.arrival;
  const release = fixed ? addMinutes(report, o.minutes!) : addMinutes(lastArrival, 30);
  if (instantMs(release) < instantMs(lastArrival)) throw new Error(`legs of ${route.join("-")} do not fit in ${o.minutes} min`);
  return { report, release, legs };
}

/** A route from the base flying `segments` operated legs on short hops and back to the base (a 1-leg duty rides home as a deadhead). */
export function hops(segments: number): { route: string[]; deadheads: number[] } {
  if (segments < 1) throw new Error("at least one segment");
  if (segments === 1) return { route: [BASE, "PLM", BASE], deadheads: [1] };
  const route = [BASE];
  let n = segments;
  if (n % 2 === 1) {
    route.push("PLM", "CBS", BASE);
    n -= 3;
  }
  for (; n > 0; n -= 2) route.push("PLM", BASE);
  return { route, deadheads: [] };
}

/** A pairing from its duty periods; block = operated block, credit = block unless given. Parsed, so it is a valid pairing. */
export function pairing(id: string, dutyPeriods: DutyPeriod[], extra: Partial<Pairing> = {}): Pairing {
  const block = dutyPeriods.flatMap((d) => d.legs).reduce((t, l) => t + (l.deadhead ? 0 : l.blockMinutes), 0);
  const first = dutyPeriods[0]!;
  const last = dutyPeriods.at(-1)!;
  return pairingSchema.parse({
    id,
    base: BASE,
    dutyPeriods,
    blockMinutes: block,
    creditMinutes: block,
    tafbMinutes: Math.round(minutesBetween(first.report, last.release)),
    crewNeeded: { captain: 1 },
    ...extra,
  });
}

/** A one-duty trip from the base: `segments` operated legs, reporting at `report`, lasting `minutes`. */
export function oneDuty(id: string, report: string, minutes: number, segments = 2, o: Omit<DutyOptions, "minutes"> = {}): Pairing {
  const h = hops(segments);
  return pairing(id, [duty(report, h.route, { deadheads: h.deadheads, ...o, minutes })]);
}

export const item = (p: Pairing): LineItem => ({ kind: "pairing", pairing: p });
export const items = (...ps: Pairing[]): LineItem[] => ps.map(item);

/** "HH:MM" of a minute of the day. */
export const clock = (minuteOfDay: number) => `${String(Math.floor(minuteOfDay / 60)).padStart(2, "0")}:${String(minuteOfDay % 60).padStart(2, "0")}`;

/** A look-back duty (before the period) for rolling limits. */
export function pastDuty(report: string, minutes: number, flightMinutes: number, segments = 2, endStation = BASE): CrewMember["lookBack"]["duties"][number] {
  return { report, release: addMinutes(report, minutes), flightMinutes, segments, endStation };
}
