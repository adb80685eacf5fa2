import type { Pairing } from "./pairing.ts";
import { tripFacts } from "./trip-facts.ts";
import type { TripFilter } from "./trip-filter.ts";

/**
 * Whether `pairing` is a trip like `filter` describes, reading days and clock
 * times in `zone` (the base's). Every condition given must hold; see
 * tripFilterSchema for what each one means.
 */
export function matchesTripFilter(pairing: Pairing, filter: TripFilter, zone: string): boolean {
  const facts = tripFacts(pairing, zone);
  const length = facts.dates.length;
  const { lengthDays, layoverAt, daysOfWeek } = filter;
  if (lengthDays && !((lengthDays.min ?? 1) <= length && length <= (lengthDays.max ?? Infinity))) return false;
  if (layoverAt && !layoverAt.some((station) => facts.layovers.has(station))) return false;
  // "HH:MM" strings order like the times they name.
  if (filter.reportAfter !== undefined && !(facts.reportTime >= filter.reportAfter)) return false;
  if (filter.reportBefore !== undefined && !(facts.reportTime < filter.reportBefore)) return false;
  if (filter.releaseBefore !== undefined && !(facts.releaseTime <= filter.releaseBefore)) return false;
  if (filter.releaseAfter !== undefined && !(facts.releaseTime > filter.releaseAfter)) return false;
  if (daysOfWeek && !daysOfWeek.some((day) => facts.daysOfWeek.has(day))) return false;
  if (filter.minCreditPerDutyDay !== undefined && facts.creditPerDutyDay < filter.minCreditPerDutyDay) return false;
  if (filter.maxLegsPerDuty !== undefined && facts.maxLegsInADuty > filter.maxLegsPerDuty) return false;
  if (filter.redEye !== undefined && facts.redEye !== filter.redEye) return false;
  if (filter.deadhead !== undefined && facts.deadhead !== filter.deadhead) return false;
  return true;
}

/** The trips a trip or no-trip wish selects: named ones, and those its filter matches. */
export interface TripSelection {
  pairingIds?: readonly string[] | undefined;
  filter?: TripFilter | undefined;
}

/** Whether a trip or no-trip wish selects `pairing`: it is named, or it matches the filter (names OR filter). */
export function matchesTripSelection(selection: TripSelection, pairing: Pairing, zone: string): boolean {
  if (selection.pairingIds?.includes(pairing.id)) return true;
  return selection.filter !== undefined && matchesTripFilter(pairing, selection.filter, zone);
}
