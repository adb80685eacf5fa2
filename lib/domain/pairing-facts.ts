import type { DutyPeriod, Leg } from "./duty-period.ts";
import type { Pairing } from "./pairing.ts";
import { localDatesTouched } from "./time.ts";

// Facts about a pairing that wishes, filters and rules read. Pairings here have
// passed pairingSchema, so they have at least one duty period of at least one leg.

function firstDuty(pairing: Pairing): DutyPeriod {
  const duty = pairing.dutyPeriods[0];
  if (!duty) throw new RangeError(`pairing ${pairing.id} has no duty period`);
  return duty;
}

function lastDuty(pairing: Pairing): DutyPeriod {
  const duty = pairing.dutyPeriods.at(-1);
  if (!duty) throw new RangeError(`pairing ${pairing.id} has no duty period`);
  return duty;
}

/** The instant the pairing begins: its first report. */
export function pairingStart(pairing: Pairing): string {
  return firstDuty(pairing).report;
}

/** The instant the pairing ends: its last release. */
export function pairingEnd(pairing: Pairing): string {
  return lastDuty(pairing).release;
}

/**
 * The local dates in `zone` the pairing occupies: every date from its first
 * report to its last release, layover days included (a release at exactly local
 * midnight leaves the next date free).
 */
export function pairingDates(pairing: Pairing, zone: string): string[] {
  return localDatesTouched(pairingStart(pairing), pairingEnd(pairing), zone);
}

/** The pairing's length in days as crew count it: the local dates it occupies (a "3-day trip"). */
export function pairingLengthDays(pairing: Pairing, zone: string): number {
  return pairingDates(pairing, zone).length;
}

/** The stations where the crew rest between duty periods, in order (may repeat). */
export function layoverStations(pairing: Pairing): string[] {
  return pairing.dutyPeriods.slice(0, -1).flatMap((duty) => {
    const arrival = duty.legs.at(-1)?.to;
    return arrival ? [arrival] : [];
  });
}

/** Every leg of the pairing in order. */
export function pairingLegs(pairing: Pairing): Leg[] {
  return pairing.dutyPeriods.flatMap((duty) => duty.legs);
}

/** Whether any leg of the pairing is a deadhead. */
export function hasDeadhead(pairing: Pairing): boolean {
  return pairingLegs(pairing).some((leg) => leg.deadhead);
}

/** The most legs in any one duty period of the pairing (deadheads count: the crew sits through them). */
export function maxLegsInADuty(pairing: Pairing): number {
  return Math.max(...pairing.dutyPeriods.map((duty) => duty.legs.length));
}

/** Credit per duty day, in minutes: credit divided by the number of duty periods (one duty period is one duty day). */
export function creditPerDutyDay(pairing: Pairing): number {
  return pairing.creditMinutes / pairing.dutyPeriods.length;
}
