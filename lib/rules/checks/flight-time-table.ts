import { z } from "zod";
import { acclimationAt } from "../acclimation.ts";
import { hm, type RuleImpl } from "../rule.ts";
import { usTableAMinutes } from "../tables/us-117.ts";
import { cite, itemsOf, minuteOfDay, name, reference } from "./shared.ts";

const params = z.object({ table: z.enum(["us-117-table-a"]), reference }).strict();

/** Scheduled flight time of one flight duty period, by time of report (14 CFR 117.11 Table A). */
export const flightTimeTable: RuleImpl<z.infer<typeof params>> = {
  id: "flight-time-limit",
  params,
  onDuty({ duties, params: p, env }) {
    const k = duties.length - 1;
    const d = duties[k]!;
    if (!d.flight || d.source.kind === "look-back") return [];
    const zone = acclimationAt(duties, k, env).zone;
    const limit = usTableAMinutes(minuteOfDay(d.report, zone));
    if (d.flightMinutes <= limit) return [];
    return [
      {
        ruleId: "flight-time-limit",
        measured: d.flightMinutes,
        limit,
        unit: "minutes",
        items: itemsOf(d),
        text: `duty ${d.source.index + 1} of ${name(d)} holds ${hm(d.flightMinutes)} of flying; at most ${hm(limit)} is allowed${cite(p.reference)}`,
      },
    ];
  },
};
