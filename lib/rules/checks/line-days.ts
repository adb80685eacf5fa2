/** Base-local calendar days a line works, shared by the days-off and days-on rules. */
import { dutyDates, type Duty } from "../duty.ts";

/** The period's dates touched by any duty (report to release, base local). */
export function workedDates(duties: readonly Duty[], zone: string, start: string, end: string): Set<string> {
  const worked = new Set<string>();
  for (const d of duties) {
    for (const date of dutyDates(d, zone).touched) {
      if (date >= start && date <= end) worked.add(date);
    }
  }
  return worked;
}
