import { z } from "zod";
import { hm, type RuleImpl } from "../rule.ts";
import { MINUTE, cite, itemsOf, name, reference } from "./shared.ts";

const params = z
  .object({
    maxMinutes: z.number().int().min(1),
    /** "duty": report to release; "legs": first departure to last arrival (a data set's own measure) */
    measuredOn: z.enum(["duty", "legs"]).default("duty"),
    reference,
  })
  .strict();

/** A fixed limit on the length of one duty period (14 CFR 121.467: 14 h scheduled duty). */
export const maxDuty: RuleImpl<z.infer<typeof params>> = {
  id: "max-duty",
  params,
  onDuty({ duties, params: p }) {
    const d = duties[duties.length - 1]!;
    if (d.source.kind === "look-back") return [];
    const length = p.measuredOn === "legs" && d.firstDeparture !== undefined && d.lastArrival !== undefined
      ? (d.lastArrival - d.firstDeparture) / MINUTE
      : (d.release - d.report) / MINUTE;
    if (length <= p.maxMinutes) return [];
    return [
      {
        ruleId: "max-duty",
        measured: length,
        limit: p.maxMinutes,
        unit: "minutes",
        items: itemsOf(d),
        text: `duty ${d.source.index + 1} of ${name(d)} lasts ${hm(length)}; at most ${hm(p.maxMinutes)} is allowed${cite(p.reference)}`,
      },
    ];
  },
};
