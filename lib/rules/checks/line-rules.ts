/**
 * Agreement rules over the whole line (the numbers are the rule set's; the
 * rules are common practice in collective agreements, no published source).
 */
import { z } from "zod";
import { hm, type RuleImpl } from "../rule.ts";
import { cite, reference } from "./shared.ts";
import { addDays, periodDates } from "../../domain/time.ts";
import { workedDates } from "./line-days.ts";

const creditParams = z.object({ minMinutes: z.number().int().min(0).optional(), maxMinutes: z.number().int().min(0).optional(), reference }).strict();

/** A line holder's credit stays inside the window; a reserve line is exempt from the minimum. */
export const creditWindow: RuleImpl<z.infer<typeof creditParams>> = {
  id: "credit-window",
  params: creditParams,
  onLine({ pairings, params: p, reserve }) {
    const credit = pairings.reduce((t, x) => t + x.creditMinutes, 0);
    const items = pairings.map((x) => x.id);
    if (p.maxMinutes !== undefined && credit > p.maxMinutes) {
      return [{ ruleId: "credit-window", measured: credit, limit: p.maxMinutes, unit: "minutes", items, text: `the line holds ${hm(credit)} of credit; at most ${hm(p.maxMinutes)} is allowed${cite(p.reference)}` }];
    }
    if (!reserve && p.minMinutes !== undefined && credit < p.minMinutes) {
      return [{ ruleId: "credit-window", measured: credit, limit: p.minMinutes, unit: "minutes", items, text: `the line holds ${hm(credit)} of credit; at least ${hm(p.minMinutes)} is required${cite(p.reference)}` }];
    }
    return [];
  },
};

const daysOffParams = z
  .object({
    days: z.number().int().min(0),
    /** for a reserve line, when it differs (common practice: about 12 in 30 days, 13 in 31) */
    reserveDays: z.number().int().min(0).optional(),
    /** the counts are for a 30-day period; other lengths scale and round up */
    per30Days: z.boolean().default(false),
    reference,
  })
  .strict();

/** At least so many base-local calendar days in the period free of all duty. */
export const minDaysOff: RuleImpl<z.infer<typeof daysOffParams>> = {
  id: "min-days-off",
  params: daysOffParams,
  onLine({ duties, env, params: p, reserve }) {
    const dates = periodDates(env.periodStart, env.periodEnd);
    const worked = workedDates(duties, env.zone, env.periodStart, env.periodEnd);
    const need = requiredDaysOffOf(p, dates.length, reserve);
    const off = dates.length - worked.size;
    if (off >= need) return [];
    return [{ ruleId: "min-days-off", measured: off, limit: need, unit: "days", items: [...new Set(duties.map((d) => d.source.id))], text: `the line leaves ${off} days off in the period; at least ${need} are required${cite(p.reference)}` }];
  },
};

const daysOnParams = z.object({ days: z.number().int().min(1), reference }).strict();

/**
 * At most so many base-local calendar days with duty in a row, counting the
 * days worked just before the period (look-back and carry-in): a run that
 * starts in history and goes on into the period counts whole.
 */
export const maxDaysOn: RuleImpl<z.infer<typeof daysOnParams>> = {
  id: "max-days-on",
  params: daysOnParams,
  onLine({ duties, allDuties, env, params: p }) {
    const from = addDays(env.periodStart, -(p.days + 1));
    const worked = workedDates(allDuties, env.zone, from, env.periodEnd);
    let run = 0;
    let longest = 0;
    for (const date of periodDates(from, env.periodEnd)) {
      run = worked.has(date) ? run + 1 : 0;
      if (date >= env.periodStart) longest = Math.max(longest, run); // runs wholly in history are not the line's
    }
    if (longest <= p.days) return [];
    return [{ ruleId: "max-days-on", measured: longest, limit: p.days, unit: "days", items: [...new Set(duties.map((d) => d.source.id))], text: `the line works ${longest} days in a row; at most ${p.days} are allowed${cite(p.reference)}` }];
  },
};

/**
 * The days off a line must leave in a period of `periodDays` days under a rule
 * set (0 without a min-days-off rule): what a reserve line's days off are.
 */
export function requiredDaysOff(rules: readonly { id: string; params: Record<string, unknown> }[], periodDays: number, reserve: boolean): number {
  const rule = rules.find((r) => (r.params.check ?? r.id) === "min-days-off");
  if (!rule) return 0;
  const p = daysOffParams.parse(Object.fromEntries(Object.entries(rule.params).filter(([k]) => k !== "check")));
  return requiredDaysOffOf(p, periodDays, reserve);
}

function requiredDaysOffOf(p: z.infer<typeof daysOffParams>, periodDays: number, reserve: boolean): number {
  const base = reserve ? (p.reserveDays ?? p.days) : p.days;
  return p.per30Days ? Math.ceil((base * periodDays) / 30 - 1e-9) : base;
}
