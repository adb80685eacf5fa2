import { z } from "zod";
import { hm, type RuleImpl } from "../rule.ts";
import { MINUTE, cite, itemsOf, name, reference } from "./shared.ts";

const params = z
  .object({
    /** the rest required, when no at-base/away split is given */
    minMinutes: z.number().int().min(0).optional(),
    /** rest ending at the home base / away from it (ORO.FTL.235(a)/(b)) */
    atBaseMinutes: z.number().int().min(0).optional(),
    awayMinutes: z.number().int().min(0).optional(),
    /** the rest must also be at least as long as the duty before it (ORO.FTL.235) */
    atLeastPrecedingDuty: z.boolean().default(false),
    /** "fdp": only rest before a flight duty counts (14 CFR 117.25(e)); "any": before any duty */
    before: z.enum(["fdp", "any"]).default("any"),
    /** "duty": release to report; "legs": last arrival to next departure (a data set's own measure) */
    measuredOn: z.enum(["duty", "legs"]).default("duty"),
    /** only between duty periods of one trip (a layover) … */
    withinTripOnly: z.boolean().default(false),
    /** … or only between trips (the rest at base an agreement asks for) */
    betweenTripsOnly: z.boolean().default(false),
    reference,
  })
  .strict();

/** Rest from one duty's release to the next duty's report. */
export const minRest: RuleImpl<z.infer<typeof params>> = {
  id: "min-rest",
  params,
  pairwise: true,
  onDuty({ duties, params: p, env }) {
    const d = duties[duties.length - 1]!;
    const prev = duties[duties.length - 2];
    if (!prev) return [];
    if (p.before === "fdp" && !d.flight) return [];
    const sameTrip = prev.source.kind === d.source.kind && prev.source.id === d.source.id;
    if ((p.withinTripOnly && !sameTrip) || (p.betweenTripsOnly && sameTrip)) return [];
    const endsAtBase = prev.to === undefined || prev.to === env.crew.base;
    let need = (endsAtBase ? p.atBaseMinutes : p.awayMinutes) ?? p.minMinutes ?? 0;
    if (p.atLeastPrecedingDuty) need = Math.max(need, (prev.release - prev.report) / MINUTE);
    const rest = p.measuredOn === "legs" && d.firstDeparture !== undefined && prev.lastArrival !== undefined
      ? (d.firstDeparture - prev.lastArrival) / MINUTE
      : (d.report - prev.release) / MINUTE;
    if (rest >= need || rest < 0) return []; // an overlap is no-overlap's to report
    return [
      {
        ruleId: "min-rest",
        measured: rest,
        limit: need,
        unit: "minutes",
        items: itemsOf(prev, d),
        text: `rest before ${name(d)} is ${hm(rest)}; at least ${hm(need)} is required${cite(p.reference)}`,
      },
    ];
  },
};
