import { z } from "zod";
import { addDays, instantMs, localDate, startOfLocalDay } from "../../domain/time.ts";
import type { Duty } from "../duty.ts";
import { hm, type RuleEnv, type RuleImpl, type Violation } from "../rule.ts";
import { HOUR, cite, itemsOf, longestFree, name, reference } from "./shared.ts";

const params = z
  .object({
    freeHours: z.number().min(1),
    /** the window before a duty's report, in consecutive hours (14 CFR 117.25(b): 30 h in 168 h) … */
    windowHours: z.number().int().min(1).optional(),
    /** … or every window of consecutive base-local calendar days (121.467(b)(13): 24 h in any 7 days) */
    windowDays: z.number().int().min(1).optional(),
    before: z.enum(["fdp", "any"]).default("any"),
    reference,
  })
  .strict()
  .refine((p) => (p.windowHours === undefined) !== (p.windowDays === undefined), { message: "give windowHours or windowDays" });

type P = z.infer<typeof params>;
const dateOf = (ms: number, zone: string) => localDate(new Date(ms).toISOString(), zone);

/**
 * Calendar-day windows are judged once closed: the window ending on day E is
 * complete when a duty reports after E (no later item can fall in it), or when
 * the line is finished. Windows ending before the period are history's.
 */
function closedWindows(duties: readonly Duty[], p: P, env: RuleEnv, from: string, until: string): Violation[] {
  const out: Violation[] = [];
  for (let e = from < env.periodStart ? env.periodStart : from; e <= until && e <= env.periodEnd; e = addDays(e, 1)) {
    const start = instantMs(startOfLocalDay(addDays(e, -(p.windowDays! - 1)), env.zone));
    const end = instantMs(startOfLocalDay(addDays(e, 1), env.zone));
    const inside = duties.filter((d) => d.release > start && d.report < end && d.source.kind !== "look-back");
    if (!inside.length) continue;
    const best = longestFree(duties, start, end);
    if (best >= p.freeHours * 60) continue;
    out.push({
      ruleId: "free-period",
      measured: best,
      limit: p.freeHours * 60,
      unit: "minutes",
      items: itemsOf(...inside),
      text: `the longest time free from duty in the ${p.windowDays} days ending ${e} is ${hm(best)}; at least ${hm(p.freeHours * 60)} in a row is required${cite(p.reference)}`,
    });
  }
  return out;
}

/** A stretch free from all duty of at least `freeHours` inside a rolling window. */
export const freePeriod: RuleImpl<P> = {
  id: "free-period",
  params,
  onDuty({ duties, params: p, env }) {
    const d = duties[duties.length - 1]!;
    if (d.source.kind === "look-back") return [];
    if (p.windowDays !== undefined) {
      // The windows this duty closes: those ending from the previous duty's report day to the day before its own.
      const prev = duties[duties.length - 2];
      const from = prev ? dateOf(prev.report, env.zone) : env.periodStart;
      return closedWindows(duties.slice(0, -1), p, env, from, addDays(dateOf(d.report, env.zone), -1));
    }
    if (p.before === "fdp" && !d.flight) return [];
    const to = d.report;
    const best = longestFree(duties, to - p.windowHours! * HOUR, to);
    if (best >= p.freeHours * 60) return [];
    return [
      {
        ruleId: "free-period",
        measured: best,
        limit: p.freeHours * 60,
        unit: "minutes",
        items: itemsOf(d),
        text: `the longest time free from duty in the ${p.windowHours} hours before ${name(d)} is ${hm(best)}; at least ${hm(p.freeHours * 60)} in a row is required${cite(p.reference)}`,
      },
    ];
  },
  onLine({ allDuties, params: p, env }) {
    if (p.windowDays === undefined) return [];
    const last = allDuties[allDuties.length - 1];
    if (!last) return [];
    return closedWindows(allDuties, p, env, dateOf(last.report, env.zone), env.periodEnd);
  },
};
