/**
 * Statistics of a generated (or any) instance, so that tests can hold them to
 * stated ranges and closing notes can quote them.
 */
import type { Instance } from "../../lib/domain/index.ts";
import { isRedEye, layoverStations, localDayMinutes, pairingLengthDays, periodDates } from "../../lib/domain/index.ts";
import { availableCrew } from "./make-pairings.ts";

export interface InstanceStats {
  group: string;
  crew: number;
  pairings: number;
  /** share of trips by length in days */
  lengthShare: Record<number, number>;
  legsPerDuty: { min: number; mean: number; max: number };
  creditPerDutyDayHours: { min: number; mean: number; max: number };
  redEyeShare: number;
  deadheadShare: number;
  topLayovers: string[];
  /** trip credit ÷ (crew × lineCapacityMinutes × share of days not on leave) */
  tightness: number;
  crewWithLeave: number;
  crewWithCarryIn: number;
  bidders: number;
  wishesPerBid: number;
  wishKinds: Record<string, number>;
  /** stations whose UTC offset changes inside the period */
  dstChanges: string[];
}

const round = (x: number, d = 2) => Math.round(x * 10 ** d) / 10 ** d;
const stats = (xs: number[]) => ({ min: round(Math.min(...xs)), mean: round(xs.reduce((a, b) => a + b, 0) / xs.length), max: round(Math.max(...xs)) });

export function instanceStats(instance: Instance, lineCapacityMinutes = 85 * 60): InstanceStats {
  const { period, pairings, crew, bids } = instance;
  const zone = period.zone;
  const duties = pairings.flatMap((p) => p.dutyPeriods);
  const lengths: Record<number, number> = {};
  for (const p of pairings) lengths[pairingLengthDays(p, zone)] = (lengths[pairingLengthDays(p, zone)] ?? 0) + 1;
  const layovers = new Map<string, number>();
  for (const p of pairings) for (const s of layoverStations(p)) layovers.set(s, (layovers.get(s) ?? 0) + 1);
  const available = availableCrew(crew, period.startDate, period.endDate, zone);
  const wishes = Object.values(bids).flat();
  const kinds: Record<string, number> = {};
  for (const w of wishes) kinds[w.kind] = (kinds[w.kind] ?? 0) + 1;
  return {
    group: `${instance.group.base}/${instance.group.position}`,
    crew: crew.length,
    pairings: pairings.length,
    lengthShare: Object.fromEntries(Object.entries(lengths).map(([k, v]) => [k, round(v / pairings.length)])),
    legsPerDuty: stats(duties.map((d) => d.legs.length)),
    creditPerDutyDayHours: stats(pairings.map((p) => p.creditMinutes / p.dutyPeriods.length / 60)),
    redEyeShare: round(pairings.filter((p) => isRedEye(p, zone)).length / pairings.length),
    deadheadShare: round(pairings.filter((p) => p.dutyPeriods.some((d) => d.legs.some((l) => l.deadhead))).length / pairings.length),
    topLayovers: [...layovers.entries()].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0])).slice(0, 5).map(([s, n]) => `${s} ${n}`),
    tightness: round(pairings.reduce((t, p) => t + p.creditMinutes * (p.crewNeeded[instance.group.position] ?? 0), 0) / (available * lineCapacityMinutes)),
    crewWithLeave: crew.filter((c) => c.fixedActivities.some((a) => a.kind === "vacation")).length,
    crewWithCarryIn: crew.filter((c) => c.carryIn.length > 0).length,
    bidders: Object.keys(bids).length,
    wishesPerBid: round(wishes.length / Math.max(1, Object.keys(bids).length)),
    wishKinds: kinds,
    dstChanges: instance.stations.filter((s) => offsetChanges(s.zone, period.startDate, period.endDate)).map((s) => s.code),
  };
}

/** Does the zone have a 23- or 25-hour day inside the period? */
function offsetChanges(zone: string, first: string, last: string): boolean {
  return periodDates(first, last).some((d) => localDayMinutes(d, zone) !== 24 * 60);
}
