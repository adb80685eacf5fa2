/**
 * The trip list's filters, applied on the phone to the period's trip
 * summaries (hundreds at most), so filtering is instant and works offline.
 * Conditions shared with trip wishes read the same way as lib/domain's
 * matchesTripFilter (a unit test holds them together).
 */
import type { TripSummary } from "@/lib/db/periods";

export interface ListFilter {
  q: string;
  /** lengths in days; 4 means 4 or more */
  lengths: number[];
  layover: string;
  reportAfter: string;
  releaseBefore: string;
  daysOfWeek: number[];
  /** hours, as typed */
  creditMin: string;
  creditMax: string;
  creditPerDayMin: string;
  redEye: "any" | "yes" | "no";
  deadhead: "any" | "yes" | "no";
}

export type SortKey = "date" | "credit" | "creditPerDay" | "length" | "report";

export const emptyFilter: ListFilter = {
  q: "",
  lengths: [],
  layover: "",
  reportAfter: "",
  releaseBefore: "",
  daysOfWeek: [],
  creditMin: "",
  creditMax: "",
  creditPerDayMin: "",
  redEye: "any",
  deadhead: "any",
};

const hours = (text: string) => (text.trim() === "" || Number.isNaN(Number(text)) ? undefined : Math.round(Number(text) * 60));

/** How many filters are set (the search box not counted). */
export function activeFilters(f: ListFilter): number {
  return [
    f.lengths.length > 0,
    f.layover !== "",
    f.reportAfter !== "",
    f.releaseBefore !== "",
    f.daysOfWeek.length > 0,
    hours(f.creditMin) !== undefined || hours(f.creditMax) !== undefined,
    hours(f.creditPerDayMin) !== undefined,
    f.redEye !== "any",
    f.deadhead !== "any",
  ].filter(Boolean).length;
}

/** Whether `t` passes every filter set. */
export function tripPasses(t: TripSummary, f: ListFilter): boolean {
  const q = f.q.trim().toUpperCase();
  if (q && !t.code.toUpperCase().includes(q) && !t.layovers.some((s) => s.toUpperCase().includes(q))) return false;
  if (f.lengths.length > 0 && !f.lengths.some((n) => (n >= 4 ? t.days >= 4 : t.days === n))) return false;
  if (f.layover && !t.layovers.includes(f.layover)) return false;
  // "HH:MM" strings order like the times they name.
  if (f.reportAfter && !(t.report >= f.reportAfter)) return false;
  if (f.releaseBefore && !(t.release <= f.releaseBefore)) return false;
  if (f.daysOfWeek.length > 0 && !f.daysOfWeek.some((d) => t.daysOfWeek.includes(d))) return false;
  const lo = hours(f.creditMin);
  const hi = hours(f.creditMax);
  if (lo !== undefined && t.creditMinutes < lo) return false;
  if (hi !== undefined && t.creditMinutes > hi) return false;
  const perDay = hours(f.creditPerDayMin);
  if (perDay !== undefined && t.creditPerDutyDayMinutes < perDay) return false;
  if (f.redEye !== "any" && t.redEye !== (f.redEye === "yes")) return false;
  if (f.deadhead !== "any" && t.deadheads > 0 !== (f.deadhead === "yes")) return false;
  return true;
}

const by: Record<SortKey, (a: TripSummary, b: TripSummary) => number> = {
  date: (a, b) => a.startDate.localeCompare(b.startDate) || a.report.localeCompare(b.report),
  credit: (a, b) => b.creditMinutes - a.creditMinutes,
  creditPerDay: (a, b) => b.creditPerDutyDayMinutes - a.creditPerDutyDayMinutes,
  length: (a, b) => b.days - a.days,
  report: (a, b) => a.report.localeCompare(b.report),
};

/** The trips that pass, in the chosen order (ties by date, then trip number: stable). */
export function filterTrips(trips: readonly TripSummary[], f: ListFilter, sort: SortKey): TripSummary[] {
  return trips.filter((t) => tripPasses(t, f)).sort((a, b) => by[sort](a, b) || by.date(a, b) || a.code.localeCompare(b.code));
}
