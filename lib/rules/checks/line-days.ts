/** Base-local calendar days a line works, shared by the days-off and days-on rules. */
import { localDatesTouched } from "../../domain/time.ts";
import type { Duty } from "../duty.ts";

/** The period's dates touched by any duty (report to release, base local). */
export function workedDates(duties: readonly Duty[], zone: string, start: string, end: string): Set<string> {
  const worked = new Set<string>();
  for (const d of duties) {
    for (const date of localDatesTouched(new Date(d.report).toISOString(), new Date(d.release).toISOString(), zone)) {
      if (date >= start && date <= end) worked.add(date);
    }
  }
  return worked;
}
