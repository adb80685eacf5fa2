import { z } from "zod";
import { addDays, localDate, startOfLocalDay, instantMs } from "../../domain/time.ts";
import { hm, type RuleImpl } from "../rule.ts";
import { HOUR, cite, itemsOf, longestFree, name, reference } from "./shared.ts";

const params = z
  .object({
    freeHours: z.number().min(1),
    /** the window before a duty's report, in consecutive hours (14 CFR 117.25(b): 30 h in 168 h) … */
    windowHours: z.number().int().min(1).optional(),
    /** … or the window of consecutive base-local calendar days ending with the duty's day (121.467(b)(13)) */
    windowDays: z.number().int().min(1).optional(),
    before: z.enum(["fdp", "any"]).default("any"),
    reference,
  })
  .strict()
  .refine((p) => (p.windowHours === undefined) !== (p.windowDays === undefined), { message: "give windowHours or windowDays" });

/** A stretch free from all duty of at least `freeHours` inside a rolling window. */
export const freePeriod: RuleImpl<z.infer<typeof params>> = {
  id: "free-period",
  params,
  onDuty({ duties, params: p, env }) {
    const d = duties[duties.length - 1]!;
    if (d.source.kind === "look-back" || (p.before === "fdp" && !d.flight)) return [];
    let from: number;
    let to: number;
    if (p.windowHours !== undefined) {
      to = d.report;
      from = to - p.windowHours * HOUR;
    } else {
      const last = localDate(new Date(d.release).toISOString(), env.zone);
      from = instantMs(startOfLocalDay(addDays(last, -(p.windowDays! - 1)), env.zone));
      to = Math.max(d.release, instantMs(startOfLocalDay(addDays(last, 1), env.zone)));
    }
    // Nothing is known before the look-back starts: treat the window as free only where duties are listed.
    const free = longestFree(duties, from, p.windowHours !== undefined ? to : d.release);
    const tail = p.windowHours === undefined ? (to - d.release) / 60_000 : 0;
    const best = Math.max(free, tail);
    if (best >= p.freeHours * 60) return [];
    const window = p.windowHours !== undefined ? `the ${p.windowHours} hours before ${name(d)}` : `the ${p.windowDays} days ending with ${name(d)}`;
    return [
      {
        ruleId: "free-period",
        measured: best,
        limit: p.freeHours * 60,
        unit: "minutes",
        items: itemsOf(d),
        text: `the longest time free from duty in ${window} is ${hm(best)}; at least ${hm(p.freeHours * 60)} in a row is required${cite(p.reference)}`,
      },
    ];
  },
};
