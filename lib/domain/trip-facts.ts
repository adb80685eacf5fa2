import type { Pairing } from "./pairing.ts";
import {
  creditPerDutyDay,
  hasDeadhead,
  layoverStations,
  maxLegsInADuty,
  pairingDates,
  pairingEnd,
  pairingStart,
} from "./pairing-facts.ts";
import { isRedEye } from "./red-eye.ts";
import { dayOfWeek, localTime } from "./time.ts";

/** What trip filters and wish scoring read about a pairing, in one base's zone. */
export interface TripFacts {
  /** Local dates occupied, first report to last release. */
  readonly dates: readonly string[];
  readonly daysOfWeek: ReadonlySet<number>;
  /** Local "HH:MM" of the first report and the last release. */
  readonly reportTime: string;
  readonly releaseTime: string;
  readonly layovers: ReadonlySet<string>;
  readonly redEye: boolean;
  readonly deadhead: boolean;
  readonly maxLegsInADuty: number;
  readonly creditPerDutyDay: number;
}

// Scoring reads the same pairings for every candidate line, and zone
// arithmetic is the costly part, so facts are kept per pairing object and zone.
// Parsed pairings are values: nothing in lib changes one after parsing.
const memo = new WeakMap<Pairing, Map<string, TripFacts>>();

/** The facts of `pairing` in `zone`, computed once per pairing object and zone. */
export function tripFacts(pairing: Pairing, zone: string): TripFacts {
  let byZone = memo.get(pairing);
  if (!byZone) {
    byZone = new Map();
    memo.set(pairing, byZone);
  }
  const known = byZone.get(zone);
  if (known) return known;
  const dates = pairingDates(pairing, zone);
  const facts: TripFacts = Object.freeze({
    dates: Object.freeze(dates),
    daysOfWeek: new Set(dates.map(dayOfWeek)),
    reportTime: localTime(pairingStart(pairing), zone),
    releaseTime: localTime(pairingEnd(pairing), zone),
    layovers: new Set(layoverStations(pairing)),
    redEye: isRedEye(pairing, zone),
    deadhead: hasDeadhead(pairing),
    maxLegsInADuty: maxLegsInADuty(pairing),
    creditPerDutyDay: creditPerDutyDay(pairing),
  });
  byZone.set(zone, facts);
  return facts;
}
