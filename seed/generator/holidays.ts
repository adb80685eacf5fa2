/**
 * Dates many crew want free. Fixed-date holidays and two floating US ones
 * (Thanksgiving: fourth Thursday of November; Memorial Day: last Monday of
 * May) — dates from memory, as common knowledge; popularity is common practice.
 */
import { addDays, dayOfWeek } from "../../lib/domain/time.ts";

const FIXED = ["01-01", "02-14", "07-04", "10-31", "12-24", "12-25", "12-26", "12-31"];

/** The holidays between `start` and `end` (inclusive, YYYY-MM-DD). */
export function holidaysBetween(start: string, end: string): string[] {
  const out: string[] = [];
  for (let d = start; d <= end; d = addDays(d, 1)) {
    const md = d.slice(5);
    const dom = Number(d.slice(8));
    const dow = dayOfWeek(d);
    const thanksgiving = md.startsWith("11-") && dow === 4 && dom >= 22 && dom <= 28;
    const memorial = md.startsWith("05-") && dow === 1 && dom >= 25;
    if (FIXED.includes(md) || thanksgiving || memorial) out.push(d);
  }
  return out;
}

/** Saturdays and Sundays between `start` and `end`. */
export function weekendDates(start: string, end: string): string[] {
  const out: string[] = [];
  for (let d = start; d <= end; d = addDays(d, 1)) if (dayOfWeek(d) >= 6) out.push(d);
  return out;
}
