/**
 * The trip list's filters, applied on the phone to the period's trip
 * summaries (hundreds at most), so filtering is instant and works offline.
 *
 * The conditions a trip filter also has (length, layover, report after,
 * release by, days of the week, credit per duty day, red-eye, deadhead) read
 * the same trip facts the same way as lib/domain's matchesTripFilter, and
 * `asTripFilter` turns them into one, so "use these filters as a trip wish"
 * asks for exactly the trips the list shows. tests/unit/app/trip-list-filter
 * holds the two together over generated trips and filters (fast-check). Two
 * conditions are the list's own: the search box and the trip's total credit;
 * a wish made from the list leaves them out and says so.
 */
import type { TripFilter } from "@/lib/domain/trip-filter";
import type { TripSummary } from "@/lib/domain/trip-summary";

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

/** Hours as typed ("5", "5.5" or "5,5") in whole minutes; undefined when empty or not a number of hours. */
function hours(text: string): number | undefined {
  const n = Number(text.trim().replace(",", "."));
  return text.trim() === "" || !Number.isFinite(n) || n < 0 ? undefined : Math.round(n * 60);
}

type HoursField = "creditMin" | "creditMax" | "creditPerDayMin";

/** A message per hours field that holds something other than a number of hours (the list then ignores it). */
export function filterErrors(f: ListFilter): Partial<Record<HoursField, string>> {
  const out: Partial<Record<HoursField, string>> = {};
  for (const key of ["creditMin", "creditMax", "creditPerDayMin"] as const) {
    if (f[key].trim() !== "" && hours(f[key]) === undefined) out[key] = "Enter hours as a number, such as 5 or 5.5";
  }
  const lo = hours(f.creditMin);
  const hi = hours(f.creditMax);
  if (lo !== undefined && hi !== undefined && lo > hi) out.creditMax ??= "This is below the credit from";
  return out;
}

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

/** A trip filter made from the list's filters, or why it cannot be made. */
export type WishFilter =
  | { ok: true; filter: TripFilter; leftOut: string[] }
  | { ok: false; message: string };

/**
 * The list's filters as a trip filter (lib/domain), for a trip wish. Lengths
 * become one range (4 = "4 or more" = no upper end); lengths that are not next
 * to each other cannot be one range and are refused rather than widened. The
 * search box and the total credit have no counterpart in a trip filter: they
 * are left out and named in `leftOut`.
 */
export function asTripFilter(f: ListFilter): WishFilter {
  const filter: TripFilter = {};
  const lengths = [...new Set(f.lengths)].sort((a, b) => a - b);
  if (lengths.length > 0) {
    const min = lengths[0]!;
    const max = lengths.at(-1)!;
    if (max - min + 1 !== lengths.length) {
      const named = lengths.map((n) => (n >= 4 ? "4+" : String(n))).join(", ");
      return { ok: false, message: `A trip wish takes lengths next to each other; ${named} days are not. Choose, say, 2 and 3 days, or make two wishes.` };
    }
    filter.lengthDays = max >= 4 ? { min } : { min, max };
  }
  if (f.layover) filter.layoverAt = [f.layover];
  if (f.reportAfter) filter.reportAfter = f.reportAfter;
  if (f.releaseBefore) filter.releaseBefore = f.releaseBefore;
  if (f.daysOfWeek.length > 0) filter.daysOfWeek = [...new Set(f.daysOfWeek)].sort((a, b) => a - b);
  const perDay = hours(f.creditPerDayMin);
  if (perDay !== undefined) filter.minCreditPerDutyDay = perDay;
  if (f.redEye !== "any") filter.redEye = f.redEye === "yes";
  if (f.deadhead !== "any") filter.deadhead = f.deadhead === "yes";
  if (Object.keys(filter).length === 0) return { ok: false, message: "Set a filter first (length, layover, times, days, credit per duty day, red-eye or deadhead)." };
  const leftOut: string[] = [];
  if (f.q.trim() !== "") leftOut.push(`the search "${f.q.trim()}"`);
  if (hours(f.creditMin) !== undefined || hours(f.creditMax) !== undefined) leftOut.push("the trip's total credit (a credit range wish sets the month's)");
  return { ok: true, filter, leftOut };
}
