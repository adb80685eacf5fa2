/**
 * Builds plausible pairings for the fictional carrier: 1–5 days from the base,
 * 1–5 legs per duty period, report 60 min before the first departure and
 * release 30 min after the last arrival, layovers with at least 10.5 h of rest,
 * now and then a deadhead or a red-eye.
 *
 * Limits the factory keeps so that its trips look legal (it is not the legality
 * engine): scheduled flying per duty at most 8 h, or 9 h for a single leg
 * (14 CFR 117.11 Table A's rows), duty at most 12.5 h (well inside Table B for
 * the start times it uses), rest at a layover at least 10.5 h (above the 10 h of
 * 14 CFR 117.25(e)).
 *
 * Credit per duty period = max(block, 1 h per 2 h on duty) — a duty rig that is
 * common practice in agreements (no published source); deadheads count no
 * block here. Pairing credit is the sum over its duty periods.
 */
import type { DutyPeriod, Leg, Pairing } from "../lib/domain/index.ts";
import { addDays, addMinutes, atLocalTime, instantMs, minutesBetween, toInstant } from "../lib/domain/time.ts";
import { CARRIER, OCEANIC, STATIONS, blockMinutes, destinations } from "./carrier.ts";
import type { Rng } from "./random.ts";

export const REPORT_BEFORE_MIN = 60;
export const RELEASE_AFTER_MIN = 30;
export const MIN_LAYOVER_REST_MIN = 630;
const MAX_DUTY_MIN = 750;

/** The factories build the domain's own shapes (lib/domain), so a seeded pairing parses as one. */
export type LegSeed = Leg;
export type DutyPeriodSeed = DutyPeriod;
export type PairingSeed = Pairing;

const minutes = (a: string, b: string) => Math.round(minutesBetween(a, b));
/** Timetables run in 5-minute steps. */
const ceil5 = (instant: string) => toInstant(new Date(Math.ceil(instantMs(instant) / 300_000) * 300_000));
const legBlock = (legs: readonly Leg[]) => legs.reduce((s, l) => s + (l.deadhead ? 0 : l.blockMinutes), 0);

/** Duty rig: 1 h of credit per 2 h on duty, or the block time when that is more (common practice). */
export function dutyCredit(d: DutyPeriod): number {
  return Math.max(legBlock(d.legs), Math.round(minutes(d.report, d.release) / 2));
}

/** Fills in the totals of a pairing from its duty periods. */
export function withTotals(p: Omit<Pairing, "blockMinutes" | "creditMinutes" | "tafbMinutes">): Pairing {
  const first = p.dutyPeriods[0];
  const last = p.dutyPeriods[p.dutyPeriods.length - 1];
  if (!first || !last) throw new Error(`pairing ${p.id} has no duty periods`);
  return {
    ...p,
    blockMinutes: legBlock(p.dutyPeriods.flatMap((d) => d.legs)),
    creditMinutes: p.dutyPeriods.reduce((s, d) => s + dutyCredit(d), 0),
    tafbMinutes: minutes(first.report, last.release),
  };
}

export interface PairingSpec {
  id: string;
  base: string;
  /** base-local date of the first departure, YYYY-MM-DD */
  startDate: string;
  /** duty periods, one per day */
  days: number;
  /** base-local clock time of the first departure, HH:MM */
  firstDeparture: string;
  crewNeeded: Pairing["crewNeeded"];
  requires?: string[];
  /** most legs in a duty period (1–5); default 3 */
  maxLegsPerDuty?: number;
  /** may the trip lay over at an oceanic station */
  oceanic?: boolean;
  /** chance that the first leg is a deadhead; default 0.08 */
  deadheadChance?: number;
}

/** A random but legal-looking pairing that starts and ends at its base. */
export function makePairing(spec: PairingSpec, r: Rng, flightNo: () => number): Pairing {
  const zone = STATIONS.find((s) => s.code === spec.base)?.zone;
  if (!zone) throw new Error(`unknown base ${spec.base}`);
  const maxLegs = Math.min(5, Math.max(1, spec.maxLegsPerDuty ?? 3));
  const home = (c: string) => blockMinutes(c, spec.base);
  let departure = atLocalTime(spec.startDate, spec.firstDeparture, zone);
  let at = spec.base;
  const dutyPeriods: DutyPeriod[] = [];
  for (let day = 0; day < spec.days; day++) {
    const lastDay = day === spec.days - 1;
    const target = lastDay && spec.days === 1 ? r.int(Math.min(2, maxLegs), maxLegs) : r.int(1, maxLegs);
    const legs: Leg[] = [];
    let dayBlock = 0;
    for (let k = 0; k < target; k++) {
      // A single long leg may fly 9 h; a day of several legs keeps to 8 h (Table A rows).
      const cap = legs.length === 0 ? 540 : 480;
      const dayEnds = k === target - 1;
      let to: string | undefined;
      if (lastDay && dayEnds) to = spec.base;
      else {
        // Minutes on duty so far, counted from the report before the day's first leg.
        const onDuty = legs[0] ? minutes(legs[0].departure, departure) + REPORT_BEFORE_MIN : REPORT_BEFORE_MIN;
        const fits = destinations(at).filter((c) => {
          const b = blockMinutes(at, c)!;
          if (c === spec.base || (OCEANIC.has(c) && !spec.oceanic)) return false;
          if (dayBlock + b > cap) return false;
          const homeLeg = lastDay ? 95 + (home(c) ?? Infinity) : 0;
          if (onDuty + b + homeLeg + RELEASE_AFTER_MIN > MAX_DUTY_MIN) return false;
          // Keep the way home open: on the last day, and from the last layover.
          if (lastDay) return home(c) !== undefined && dayBlock + b + home(c)! <= cap;
          // Any leg of the day before the last may end the day, so each must leave a leg home.
          if (day === spec.days - 2) return home(c) !== undefined;
          return true;
        });
        // A day planned with many legs hops between nearby stations where it can.
        const near = fits.filter((c) => blockMinutes(at, c)! <= 140);
        const pool = target - k >= 3 && near.length ? near : fits;
        to = pool.length ? r.pick(pool) : lastDay ? spec.base : undefined;
      }
      if (to === undefined) break;
      const b = blockMinutes(at, to);
      if (b === undefined) throw new Error(`pairing ${spec.id}: no leg ${at}-${to} in the carrier's network`);
      const arrival = addMinutes(departure, b);
      // Now and then the first leg positions the crew as passengers (a deadhead).
      const deadhead = day === 0 && k === 0 && target > 1 && r.next() < (spec.deadheadChance ?? 0.08);
      legs.push({ flightNumber: `${CARRIER.flightPrefix}${flightNo()}`, from: at, to, departure, arrival, deadhead, blockMinutes: b, equipment: "A220" });
      dayBlock += deadhead ? 0 : b;
      at = to;
      departure = ceil5(addMinutes(arrival, target >= 4 ? r.int(35, 55) : r.int(40, 95)));
      if (to === spec.base) break;
    }
    if (legs.length === 0) throw new Error(`pairing ${spec.id}: no leg fits day ${day + 1} from ${at}`);
    const duty = {
      report: addMinutes(legs[0]!.departure, -REPORT_BEFORE_MIN),
      release: addMinutes(legs[legs.length - 1]!.arrival, RELEASE_AFTER_MIN),
      legs,
    };
    dutyPeriods.push(duty);
    if (at === spec.base) break;
    // Layover: at least 10.5–13 h of rest, and no earlier than the first departure's
    // clock time (base local) on the next day, so trips keep a daytime rhythm.
    const rested = addMinutes(duty.release, r.int(MIN_LAYOVER_REST_MIN, 13 * 60) + REPORT_BEFORE_MIN);
    const nextMorning = addMinutes(atLocalTime(addDays(spec.startDate, day + 1), spec.firstDeparture, zone), r.int(-60, 90));
    departure = ceil5(instantMs(rested) > instantMs(nextMorning) ? rested : nextMorning);
  }
  return withTotals({ id: spec.id, base: spec.base, dutyPeriods, crewNeeded: spec.crewNeeded, requires: spec.requires ?? [] });
}
