/** Display helpers shared by pages. */

/** 754 → "12:34" (hours may pass 24: credit and block are durations). */
export function hhmm(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = Math.round(minutes % 60);
  return `${h}:${String(m).padStart(2, "0")}`;
}

/** "2027-01-04" → "Mon, Jan 4" (a plain calendar date: no zone shift). */
export function shortDate(date: string): string {
  const d = new Date(`${date}T12:00:00Z`);
  return d.toLocaleDateString("en-US", { weekday: "short", day: "numeric", month: "short", timeZone: "UTC" });
}

/** An instant in a zone, e.g. "Sun, Dec 20, 18:00 MST" (the one time module formats it). */
export { localDateTimeLabel as zonedDateTime } from "@/lib/domain/time";
