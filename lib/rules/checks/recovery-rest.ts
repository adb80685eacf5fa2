import { z } from "zod";
import { addDays, atLocalTime, instantMs, localDate } from "../../domain/time.ts";
import { hm, type RuleImpl } from "../rule.ts";
import { HOUR, MINUTE, cite, itemsOf, name, reference } from "./shared.ts";

const params = z
  .object({
    minHours: z.number().min(1).default(36),
    /** local nights (8 h between 22:00 and 08:00, base local; ORO.FTL.105) the rest must hold */
    nights: z.number().int().min(0).default(2),
    /** at most this long from the end of one recovery rest to the start of the next duty */
    maxGapHours: z.number().min(1).default(168),
    reference,
  })
  .strict();

/** Local nights inside a free stretch [from, to]: each 22:00–08:00 window it covers for at least 8 h. */
function nightsIn(from: number, to: number, zone: string): number {
  let n = 0;
  const first = localDate(new Date(from).toISOString(), zone);
  for (let date = addDays(first, -1); instantMs(atLocalTime(date, "22:00", zone)) < to; date = addDays(date, 1)) {
    const start = instantMs(atLocalTime(date, "22:00", zone));
    const end = instantMs(atLocalTime(addDays(date, 1), "08:00", zone));
    if (Math.min(end, to) - Math.max(start, from) >= 8 * HOUR) n++;
  }
  return n;
}

/**
 * Recurrent extended recovery rest (ORO.FTL.235(d)): a rest of at least 36 h
 * holding 2 local nights; at most 168 h from the end of one to the start of
 * the next, so every duty must be released within 168 h of the last one. Time before the
 * first duty known (history included) counts as such a rest.
 */
export const recoveryRest: RuleImpl<z.infer<typeof params>> = {
  id: "recovery-rest",
  params,
  onDuty({ duties, params: p, env }) {
    const k = duties.length - 1;
    const d = duties[k]!;
    if (d.source.kind === "look-back") return [];
    let lastEnd = duties[0]!.report; // the unknown before the first duty counts as rest
    for (let i = 1; i <= k; i++) {
      const from = duties[i - 1]!.release;
      const to = duties[i]!.report;
      if (to - from >= p.minHours * HOUR && nightsIn(from, to, env.zone) >= p.nights) lastEnd = to;
    }
    // The next recovery rest can start only after this duty: its release must come within the limit.
    const gap = (d.release - lastEnd) / MINUTE;
    if (gap <= p.maxGapHours * 60) return [];
    return [
      {
        ruleId: "recovery-rest",
        measured: gap,
        limit: p.maxGapHours * 60,
        unit: "minutes",
        items: itemsOf(d),
        text: `${name(d)} ends ${hm(gap)} after the last rest of ${p.minHours} h with ${p.nights} local nights; at most ${hm(p.maxGapHours * 60)} may pass before the next such rest${cite(p.reference)}`,
      },
    ];
  },
};
