import type { TripFilter } from "./trip-filter.ts";
import type { Wish } from "./wish.ts";
import { addDays } from "./time.ts";

// One readable sentence per wish, the way a colleague would say it: the bid
// page lists these, and the same words serve the preview and explanations.

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
const DAYS = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];

/** 4500 → "75 h", 4530 → "75:30 h". */
export function hoursLabel(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return m === 0 ? `${h} h` : `${h}:${String(m).padStart(2, "0")} h`;
}

const day = (date: string) => Number(date.slice(8, 10));
const month = (date: string) => MONTHS[Number(date.slice(5, 7)) - 1]!;

/** Sorted dates as runs: ["2026-12-24", "2026-12-25", "2026-12-26", "2026-12-31"] → "24–26 Dec, 31 Dec". */
export function datesLabel(dates: readonly string[]): string {
  const sorted = [...new Set(dates)].sort();
  const runs: [string, string][] = [];
  for (const date of sorted) {
    const last = runs.at(-1);
    if (last && addDays(last[1], 1) === date) last[1] = date;
    else runs.push([date, date]);
  }
  return runs
    .map(([a, b]) => {
      if (a === b) return `${day(a)} ${month(a)}`;
      if (a.slice(0, 7) === b.slice(0, 7)) return `${day(a)}–${day(b)} ${month(a)}`;
      return `${day(a)} ${month(a)} – ${day(b)} ${month(b)}`;
    })
    .join(", ");
}

const orList = (items: readonly string[]) => (items.length <= 1 ? (items[0] ?? "") : `${items.slice(0, -1).join(", ")} or ${items.at(-1)}`);

/** The conditions of a trip filter as phrases: "of 3 days", "laying over at PLM", … */
export function filterPhrases(filter: TripFilter): string[] {
  const out: string[] = [];
  const { lengthDays: len } = filter;
  if (len) {
    const d = (n: number) => (n === 1 ? "1 day" : `${n} days`);
    if (len.min !== undefined && len.max !== undefined) out.push(len.min === len.max ? `of ${d(len.min)}` : `of ${len.min}–${len.max} days`);
    else if (len.min !== undefined) out.push(`of at least ${d(len.min)}`);
    else if (len.max !== undefined) out.push(`of at most ${d(len.max)}`);
  }
  if (filter.layoverAt) out.push(`laying over at ${orList(filter.layoverAt)}`);
  if (filter.reportAfter) out.push(`reporting at or after ${filter.reportAfter}`);
  if (filter.reportBefore) out.push(`reporting before ${filter.reportBefore}`);
  if (filter.releaseBefore) out.push(`released by ${filter.releaseBefore}`);
  if (filter.releaseAfter) out.push(`released after ${filter.releaseAfter}`);
  if (filter.daysOfWeek) out.push(`touching ${orList([...filter.daysOfWeek].sort().map((n) => DAYS[n - 1]!))}`);
  if (filter.minCreditPerDutyDay !== undefined) out.push(`with at least ${hoursLabel(filter.minCreditPerDutyDay)} credit per duty day`);
  if (filter.maxLegsPerDuty !== undefined) out.push(`with at most ${filter.maxLegsPerDuty} ${filter.maxLegsPerDuty === 1 ? "leg" : "legs"} per duty period`);
  if (filter.redEye === true) out.push("with a red-eye");
  if (filter.redEye === false) out.push("without red-eyes");
  if (filter.deadhead === true) out.push("with a deadhead");
  if (filter.deadhead === false) out.push("without deadheads");
  return out;
}

function selectionText(wish: { pairingIds?: string[] | undefined; filter?: TripFilter | undefined }): string {
  const parts: string[] = [];
  if (wish.pairingIds) parts.push(`${wish.pairingIds.length === 1 ? "trip" : "trips"} ${wish.pairingIds.join(", ")}`);
  if (wish.filter) parts.push(`trips ${filterPhrases(wish.filter).join(", ")}`);
  return parts.join(", or ");
}

/** The wish as one sentence, e.g. "Keep 24–26 Dec free". */
export function wishSentence(wish: Wish): string {
  switch (wish.kind) {
    case "trip": {
      const what = selectionText(wish);
      return wish.count > 1 ? `At least ${wish.count} of: ${what}` : `Give me ${what}`;
    }
    case "no-trip":
      return `Keep me off ${selectionText(wish)}`;
    case "free-days":
      return `Keep ${datesLabel(wish.dates)} free`;
    case "rhythm": {
      const parts: string[] = [];
      if (wish.maxDaysOn !== undefined) parts.push(`at most ${wish.maxDaysOn} ${wish.maxDaysOn === 1 ? "day" : "days"} on in a row`);
      if (wish.weekendsOff) parts.push("weekends free");
      const text = parts.join(", and ");
      return text.charAt(0).toUpperCase() + text.slice(1);
    }
    case "credit": {
      const { minMinutes: lo, maxMinutes: hi } = wish;
      if (lo !== undefined && hi !== undefined) return `Credit between ${hoursLabel(lo).replace(" h", "")} and ${hoursLabel(hi)}`;
      if (lo !== undefined) return `Credit of at least ${hoursLabel(lo)}`;
      return `Credit of at most ${hoursLabel(hi!)}`;
    }
    case "buddy":
      return `Fly the same trips as employee ${wish.crewId}`;
  }
}
