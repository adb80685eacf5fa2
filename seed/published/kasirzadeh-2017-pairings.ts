/**
 * Builds our pairings from the published ones. The files list each pairing's
 * legs without marking duty periods or giving report and release times, so the
 * assumptions below (stated in README.md beside this file) fill that in.
 */
import type { DutyPeriod, Leg, Pairing } from "../../lib/domain/index.ts";
import { addMinutes, minutesBetween } from "../../lib/domain/time.ts";
import { inputError, type RawLeg, type RawPairing } from "./kasirzadeh-2017-files.ts";

/** A gap of this many minutes or more between two legs ends a duty period (the data set's README). */
export const DUTY_SPLIT_GAP_MIN = 8 * 60;
/** Report before the first departure of a duty period: our assumption, the data carry none. */
export const REPORT_BEFORE_MIN = 60;
/** Release after the last arrival of a duty period: our assumption, the data carry none. */
export const RELEASE_AFTER_MIN = 30;

/** The longest flight number our leg schema takes; the data set's leg ids serve as flight numbers. */
const FLIGHT_NUMBER_MAX = 10;

/** The pairing id we give published pairing number `n`. */
export function pairingIdFor(n: number): string {
  return `P${n}`;
}

const minutes = (start: string, end: string) => Math.round(minutesBetween(start, end));

/**
 * Credit by the published definition: scheduled flight time of the operated
 * legs plus half the duration of the deadheads. The half is taken once per
 * pairing, of the summed deadhead minutes, and rounded half up to a whole
 * minute (a deadhead total of 75 min adds 38).
 */
export function publishedCredit(legs: readonly Leg[]): number {
  const flown = legs.filter((leg) => !leg.deadhead).reduce((sum, leg) => sum + leg.blockMinutes, 0);
  const deadhead = legs.filter((leg) => leg.deadhead).reduce((sum, leg) => sum + leg.blockMinutes, 0);
  return flown + Math.ceil(deadhead / 2);
}

/** Splits legs in time order into duty periods where a gap of 8 h or more lies between two legs. */
export function splitDuties(legs: readonly Leg[]): Leg[][] {
  const duties: Leg[][] = [];
  legs.forEach((leg, k) => {
    const previous = legs[k - 1];
    const current = duties.at(-1);
    if (!previous || !current || minutes(previous.arrival, leg.departure) >= DUTY_SPLIT_GAP_MIN) duties.push([leg]);
    else current.push(leg);
  });
  return duties;
}

function dutyPeriodOf(legs: Leg[]): DutyPeriod {
  const first = legs[0];
  const last = legs.at(-1);
  if (!first || !last) throw new RangeError("a duty period needs a leg");
  return {
    report: addMinutes(first.departure, -REPORT_BEFORE_MIN),
    release: addMinutes(last.arrival, RELEASE_AFTER_MIN),
    legs,
  };
}

/**
 * Our pairing for a published one, one captain needed. `legs` are the day
 * files' legs by id and `codeOf` maps an airport name to its station code.
 * Refuses, naming the file and line, a leg no day file holds, legs out of
 * order or not joined up, and a pairing that does not start and end at its base.
 */
export function convertPairing(raw: RawPairing, legs: ReadonlyMap<string, RawLeg>, codeOf: (name: string) => string): Pairing {
  const where = `pairing ${raw.number}`;
  const ours = raw.legs.map(({ id, deadhead }, k): Leg => {
    const leg = legs.get(id);
    if (!leg) throw inputError(raw.at, `${where} names leg ${deadhead ? "TDH_" : ""}${id}, which no day_N.csv file holds`);
    if (id.length > FLIGHT_NUMBER_MAX) throw inputError(raw.at, `${where}: leg id ${id} is longer than ${FLIGHT_NUMBER_MAX} characters`);
    const previous = raw.legs[k - 1] && legs.get(raw.legs[k - 1]!.id);
    if (previous && previous.to !== leg.from) {
      throw inputError(raw.at, `${where}: leg ${id} departs ${leg.from} but the leg before it, ${previous.id}, arrives at ${previous.to}`);
    }
    if (previous && minutes(previous.arrival, leg.departure) < 0) {
      throw inputError(raw.at, `${where}: leg ${id} departs ${leg.departure}, before the leg before it, ${previous.id}, arrives ${previous.arrival}`);
    }
    return {
      flightNumber: id,
      from: codeOf(leg.from),
      to: codeOf(leg.to),
      departure: leg.departure,
      arrival: leg.arrival,
      deadhead,
      blockMinutes: minutes(leg.departure, leg.arrival),
    };
  });
  const firstLeg = legs.get(raw.legs[0]?.id ?? "");
  const lastLeg = legs.get(raw.legs.at(-1)?.id ?? "");
  if (firstLeg?.from !== raw.base) throw inputError(raw.at, `${where} starts at ${firstLeg?.from}, not at its base ${raw.base}`);
  if (lastLeg?.to !== raw.base) throw inputError(raw.at, `${where} ends at ${lastLeg?.to}, not at its base ${raw.base}`);
  const dutyPeriods = splitDuties(ours).map(dutyPeriodOf);
  const report = dutyPeriods[0]!.report;
  const release = dutyPeriods.at(-1)!.release;
  return {
    id: pairingIdFor(raw.number),
    base: codeOf(raw.base),
    dutyPeriods,
    blockMinutes: ours.filter((leg) => !leg.deadhead).reduce((sum, leg) => sum + leg.blockMinutes, 0),
    creditMinutes: publishedCredit(ours),
    tafbMinutes: minutes(report, release),
    crewNeeded: { captain: 1 },
    requires: [],
  };
}
