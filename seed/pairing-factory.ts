/**
 * Builds plausible pairings for the fictional carrier: 1–4 days from the base,
 * 1–3 legs per duty period, report 60 min before the first departure and
 * release 30 min after the last arrival, layovers of 12–16 h.
 *
 * Credit per duty period = max(block, 1 h per 2 h on duty) — a duty rig that is
 * common practice in agreements (no published source); pairing credit is the sum.
 */
import type { DutyPeriod, Leg, Pairing } from "../lib/domain/index.ts";
import { addDays, addMinutes, atLocalTime, instantMs, minutesBetween } from "../lib/domain/time.ts";
import { CARRIER, STATIONS, blockMinutes, destinations } from "./carrier.ts";
import type { Rng } from "./random.ts";

export const REPORT_BEFORE_MIN = 60;
export const RELEASE_AFTER_MIN = 30;

/** The factories build the domain's own shapes (lib/domain), so a seeded pairing parses as one. */
export type LegSeed = Leg;
export type DutyPeriodSeed = DutyPeriod;
export type PairingSeed = Pairing;

const minutes = (a: string, b: string) => Math.round(minutesBetween(a, b));
const addMin = addMinutes;

/** Duty rig: 1 h of credit per 2 h on duty, or the block time when that is more (common practice). */
export function dutyCredit(d: DutyPeriodSeed): number {
  const block = d.legs.reduce((s, l) => s + (l.deadhead ? 0 : l.blockMinutes), 0);
  return Math.max(block, Math.round(minutes(d.report, d.release) / 2));
}

/** Fills in the totals of a pairing from its duty periods. */
export function withTotals(p: Omit<PairingSeed, "blockMinutes" | "creditMinutes" | "tafbMinutes">): PairingSeed {
  const first = p.dutyPeriods[0];
  const last = p.dutyPeriods[p.dutyPeriods.length - 1];
  if (!first || !last) throw new Error(`pairing ${p.id} has no duty periods`);
  const block = p.dutyPeriods.flatMap((d) => d.legs).reduce((s, l) => s + (l.deadhead ? 0 : l.blockMinutes), 0);
  return {
    ...p,
    blockMinutes: block,
    creditMinutes: p.dutyPeriods.reduce((s, d) => s + dutyCredit(d), 0),
    tafbMinutes: minutes(first.report, last.release),
  };
}

export interface PairingSpec {
  id: string;
  base: string;
  /** base-local date of the first report, YYYY-MM-DD */
  startDate: string;
  days: number;
  /** base-local clock time of the first departure, HH:MM */
  firstDeparture: string;
  crewNeeded: Pairing["crewNeeded"];
  requires?: string[];
}

/** A random but legal-looking pairing that starts and ends at its base. */
export function makePairing(spec: PairingSpec, r: Rng, flightNo: () => number): PairingSeed {
  const zone = STATIONS.find((s) => s.code === spec.base)?.zone;
  if (!zone) throw new Error(`unknown base ${spec.base}`);
  let departure = atLocalTime(spec.startDate, spec.firstDeparture, zone);
  let at = spec.base;
  const dutyPeriods: DutyPeriodSeed[] = [];
  for (let day = 0; day < spec.days; day++) {
    const lastDay = day === spec.days - 1;
    const legs: LegSeed[] = [];
    // Planned legs before the day's last one; the day stops early when the next
    // hop would take scheduled flying past 8 h (14 CFR 117.11 Table A's lowest row).
    const hops = lastDay && spec.days === 1 ? r.int(1, 2) : r.int(0, 2);
    let dayBlock = 0;
    for (let k = 0; k <= hops; k++) {
      const home = lastDay && k === hops;
      let to = spec.base;
      if (!home) {
        const fits = destinations(at).filter((c) => {
          const b = blockMinutes(at, c)!;
          const back = lastDay ? (blockMinutes(c, spec.base) ?? Infinity) : 0;
          return c !== spec.base && dayBlock + b + back <= 480;
        });
        if (fits.length === 0) {
          if (!lastDay) break;
        } else to = r.pick(fits);
      }
      const b = blockMinutes(at, to);
      if (b === undefined) throw new Error(`no leg ${at}-${to} in the carrier's network`);
      const arrival = addMin(departure, b);
      // Now and then the first leg positions the crew as passengers (a deadhead).
      const deadhead = day === 0 && k === 0 && hops > 0 && r.next() < 0.08;
      legs.push({ flightNumber: `${CARRIER.flightPrefix}${flightNo()}`, from: at, to, departure, arrival, deadhead, blockMinutes: b, equipment: "A220" });
      dayBlock += deadhead ? 0 : b;
      at = to;
      departure = addMin(arrival, r.int(40, 95));
      if (to === spec.base) break;
    }
    if (legs.length === 0) throw new Error(`pairing ${spec.id}: no leg fits day ${day + 1}`);
    const firstLeg = legs[0]!;
    const lastLeg = legs[legs.length - 1]!;
    const duty = { report: addMin(firstLeg.departure, -REPORT_BEFORE_MIN), release: addMin(lastLeg.arrival, RELEASE_AFTER_MIN), legs };
    dutyPeriods.push(duty);
    // Layover: at least 11–13 h of rest, and no earlier than the first departure's
    // clock time (base local) on the next day, so trips keep a daytime rhythm.
    const rested = addMin(duty.release, r.int(11 * 60, 13 * 60) + REPORT_BEFORE_MIN);
    const nextMorning = addMinutes(atLocalTime(addDays(spec.startDate, day + 1), spec.firstDeparture, zone), r.int(-60, 90));
    departure = instantMs(rested) > instantMs(nextMorning) ? rested : nextMorning;
  }
  return withTotals({ id: spec.id, base: spec.base, dutyPeriods, crewNeeded: spec.crewNeeded, requires: spec.requires ?? [] });
}
