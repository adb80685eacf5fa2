import { z } from "zod";
import { addDays } from "../../domain/time.ts";
import { dutyDates } from "../duty.ts";
import { hm, type RuleImpl } from "../rule.ts";
import { HOUR, MINUTE, cite, itemsOf, name, overlapMinutes, reference } from "./shared.ts";

const params = z
  .object({
    /** what is added up: flight duty periods, all duty, or scheduled flight time */
    measure: z.enum(["fdp", "duty", "flight"]),
    /** a rolling window of consecutive hours (168, 672, …) … */
    windowHours: z.number().int().min(1).optional(),
    /** … or of consecutive base-local calendar days (365 for 14 CFR 117.23(b)) … */
    windowDays: z.number().int().min(1).optional(),
    /** … or the calendar year so far (ORO.FTL.210(b)(2): 900 h in a calendar year) */
    calendarYear: z.boolean().optional(),
    maxMinutes: z.number().int().min(1),
    reference,
  })
  .strict()
  .refine((p) => [p.windowHours, p.windowDays, p.calendarYear || undefined].filter((x) => x !== undefined).length === 1, {
    message: "give one of windowHours, windowDays or calendarYear",
  });

/** Daily totals by date with running sums, made once per crew's map. */
const sums = new WeakMap<ReadonlyMap<string, number>, { dates: string[]; before: Float64Array }>();

/** Σ of the daily totals dated from `first` to `last` (inclusive). */
function dailySum(daily: ReadonlyMap<string, number>, first: string, last: string): number {
  let known = sums.get(daily);
  if (!known) {
    const dates = [...daily.keys()].sort();
    const before = new Float64Array(dates.length + 1);
    dates.forEach((date, k) => (before[k + 1] = before[k]! + daily.get(date)!));
    known = { dates, before };
    sums.set(daily, known);
  }
  // the first index whose date is ≥ `date`
  const lowerBound = (date: string) => {
    let lo = 0;
    let hi = known.dates.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (known.dates[mid]! < date) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  };
  const from = lowerBound(first);
  const to = last < first ? from : lowerBound(`${last}\uffff`);
  return known.before[to]! - known.before[from]!;
}

const label = { fdp: "flight duty", duty: "duty", flight: "flight time" } as const;

/**
 * A cumulative limit over a rolling window, checked on every window that ends
 * as a new duty ends: the sum only grows with the duty, so those windows are
 * the ones a new duty can break.
 */
export const cumulative: RuleImpl<z.infer<typeof params>> = {
  id: "cumulative-limit",
  params,
  onDuty({ duties, params: p, env, dailyFlight }) {
    const d = duties[duties.length - 1]!;
    if (d.source.kind === "look-back") return [];
    let total = 0;
    let window: string;
    if (p.windowHours !== undefined) {
      const from = d.release - p.windowHours * HOUR;
      for (const x of duties) {
        if (x.release <= from) continue;
        if (p.measure === "flight") total += x.flightMinutes; // a duty's flying counts where the duty ends in the window
        else if (p.measure === "duty" || x.flight) total += overlapMinutes(x, from, d.release);
      }
      window = `${p.windowHours} consecutive hours`;
    } else {
      // Calendar days: flight time by the base-local date of each duty's report.
      const last = dutyDates(d, env.zone).report;
      const first = p.calendarYear ? `${last.slice(0, 4)}-01-01` : addDays(last, -(p.windowDays! - 1));
      total += dailySum(dailyFlight, first, last);
      for (const x of duties) {
        if (x.source.kind === "look-back") continue; // already in the daily totals
        const date = dutyDates(x, env.zone).report;
        if (date >= first && date <= last) total += p.measure === "flight" ? x.flightMinutes : (x.release - x.report) / MINUTE;
      }
      window = p.calendarYear ? `calendar year ${last.slice(0, 4)}` : `${p.windowDays} consecutive days`;
    }
    if (total <= p.maxMinutes) return [];
    return [
      {
        ruleId: "cumulative-limit",
        measured: total,
        limit: p.maxMinutes,
        unit: "minutes",
        items: itemsOf(d),
        text: `with ${name(d)}, ${label[p.measure]} in ${window} reaches ${hm(total)}; at most ${hm(p.maxMinutes)} is allowed${cite(p.reference)}`,
      },
    ];
  },
};
