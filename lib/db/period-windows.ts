/**
 * Which of a crew member's rows belong to a bid period. Crew rows (activities,
 * carry-in, look-back, daily flight totals) are not tied to a period in the
 * database, so the export picks them by time; the import stores rows outside
 * these windows too (they are facts about the crew member) but lists them,
 * because this period's export will leave them out.
 */
import { addDays, instantMs, startOfLocalDay } from "../domain/index";

/** How far back the look-back duties reach (DESIGN.md: "the previous 28 days' duties"). */
export const LOOK_BACK_DAYS = 28;
/** How far back the daily flight totals reach (the 365-day rolling limits, 14 CFR 117.23(b)). */
export const DAILY_FLIGHT_DAYS = 365;

/** The time windows of a bid period; instants as epoch ms, dates as "YYYY-MM-DD". */
export interface PeriodWindows {
  /** 00:00 base local on the first date */
  startMs: number;
  /** 00:00 base local on the day after the last date (exclusive) */
  endMs: number;
  /** 00:00 base local, LOOK_BACK_DAYS before the first date */
  lookBackStartMs: number;
  /** first date of the daily flight totals (included) */
  dailyFrom: string;
  /** the period's first date: daily totals run up to the day before it */
  dailyUntil: string;
}

/** The windows of a period given by its dates and zone. */
export function periodWindows(period: { startDate: string; endDate: string; zone: string }): PeriodWindows {
  const at = (date: string) => instantMs(startOfLocalDay(date, period.zone));
  return {
    startMs: at(period.startDate),
    endMs: at(addDays(period.endDate, 1)),
    lookBackStartMs: at(addDays(period.startDate, -LOOK_BACK_DAYS)),
    dailyFrom: addDays(period.startDate, -DAILY_FLIGHT_DAYS),
    dailyUntil: period.startDate,
  };
}

/**
 * The rules, one predicate each (start/end as epoch ms):
 * - a fixed activity belongs when it overlaps the period;
 * - a carry-in trip when it starts before the period and ends inside or after
 *   its start (a trip that ends before is look-back, not carry-in);
 * - a past duty when it reports before the period and is released after the
 *   look-back start;
 * - a daily flight total when its date is one of the DAILY_FLIGHT_DAYS dates
 *   before the period.
 */
export const inWindow = {
  activity: (w: PeriodWindows, start: number, end: number) => start < w.endMs && end > w.startMs,
  carryIn: (w: PeriodWindows, start: number, end: number) => start < w.startMs && end > w.startMs,
  pastDuty: (w: PeriodWindows, report: number, release: number) => report < w.startMs && release > w.lookBackStartMs,
  dailyFlight: (w: PeriodWindows, date: string) => date >= w.dailyFrom && date < w.dailyUntil,
};
