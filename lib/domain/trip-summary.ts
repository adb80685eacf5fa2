import type { Pairing } from "./pairing.ts";
import { layoverStations } from "./pairing-facts.ts";
import { tripFacts } from "./trip-facts.ts";

/**
 * What the phone's trip list holds per trip: small, plain JSON, and read from
 * the same facts (tripFacts) that trip filters and wish scoring read, so the
 * list's filters and a trip wish made from them agree.
 */
export interface TripSummary {
  code: string;
  /** base-local dates of the first report and the last release */
  startDate: string;
  endDate: string;
  days: number;
  layovers: string[];
  creditMinutes: number;
  blockMinutes: number;
  /** base-local clock times */
  report: string;
  release: string;
  legs: number;
  deadheads: number;
  redEye: boolean;
  /** base-local dates touched, first report to last release */
  dates: string[];
  /** ISO days of the week touched, 1 = Monday */
  daysOfWeek: number[];
  dutyPeriods: number;
  /** credit minutes per duty period, unrounded (filters compare it as trip filters do) */
  creditPerDutyDayMinutes: number;
  tafbMinutes: number;
}

/** The list's summary of `pairing`, with days and clock times in `zone` (the base's). */
export function tripSummary(pairing: Pairing, zone: string): TripSummary {
  const facts = tripFacts(pairing, zone);
  const legs = pairing.dutyPeriods.flatMap((d) => d.legs);
  return {
    code: pairing.id,
    startDate: facts.dates[0]!,
    endDate: facts.dates[facts.dates.length - 1]!,
    days: facts.dates.length,
    layovers: layoverStations(pairing),
    creditMinutes: pairing.creditMinutes,
    blockMinutes: pairing.blockMinutes,
    report: facts.reportTime,
    release: facts.releaseTime,
    legs: legs.length,
    deadheads: legs.filter((l) => l.deadhead).length,
    redEye: facts.redEye,
    dates: [...facts.dates],
    daysOfWeek: [...facts.daysOfWeek].sort(),
    dutyPeriods: pairing.dutyPeriods.length,
    creditPerDutyDayMinutes: facts.creditPerDutyDay,
    tafbMinutes: pairing.tafbMinutes,
  };
}
