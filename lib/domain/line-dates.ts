import type { Pairing } from "./pairing.ts";
import { addDays, dayNumber, dayOfWeek, periodDates } from "./time.ts";
import { tripFacts } from "./trip-facts.ts";

/** The local dates in `zone` a line works: every date any of its pairings occupies. */
export function workedDates(line: readonly Pairing[], zone: string): Set<string> {
  return new Set(line.flatMap((pairing) => tripFacts(pairing, zone).dates));
}

/** The longest run of consecutive worked dates (0 for an empty line). */
export function longestRunOfDays(worked: ReadonlySet<string>): number {
  const days = [...worked].map(dayNumber).sort((a, b) => a - b);
  let longest = 0;
  let run = 0;
  days.forEach((day, k) => {
    run = k > 0 && day === (days[k - 1] ?? Number.NaN) + 1 ? run + 1 : 1;
    longest = Math.max(longest, run);
  });
  return longest;
}

// Every line of a period is scored against the same few weekends.
const weekendMemo = new Map<string, readonly (readonly string[])[]>();

/**
 * The weekends of a period, each as its Saturday and Sunday that lie inside the
 * period: a period starting on a Sunday has that Sunday as a weekend of its own.
 */
export function periodWeekends(startDate: string, endDate: string): readonly (readonly string[])[] {
  const key = `${startDate}/${endDate}`;
  const known = weekendMemo.get(key);
  if (known) return known;
  const weekends = new Map<string, string[]>();
  for (const date of periodDates(startDate, endDate)) {
    const day = dayOfWeek(date);
    if (day < 6) continue;
    const saturday = day === 6 ? date : addDays(date, -1);
    weekends.set(saturday, [...(weekends.get(saturday) ?? []), date]);
  }
  const result = Object.freeze([...weekends.values()].map((weekend) => Object.freeze(weekend)));
  weekendMemo.set(key, result);
  return result;
}
