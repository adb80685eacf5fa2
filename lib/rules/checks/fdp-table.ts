import { z } from "zod";
import { localTime } from "../../domain/time.ts";
import { acclimationAt } from "../acclimation.ts";
import { hm, type RuleImpl } from "../rule.ts";
import { euTableTwoMinutes } from "../tables/eu-oro-ftl.ts";
import { usTableBMinutes } from "../tables/us-117.ts";
import { MINUTE, cite, itemsOf, minuteOfDay, name, reference } from "./shared.ts";

const params = z
  .object({
    /** which published table: 14 CFR 117.13 Table B, or ORO.FTL.205(b)(1) Table 2 */
    table: z.enum(["us-117-table-b", "eu-oro-ftl-205-table-2"]),
    /** 117.13(b): 30 minutes less for a crew member who is not acclimated */
    notAcclimatedReductionMinutes: z.number().int().min(0).default(30),
    reference,
  })
  .strict();

/** The flight duty period limit of a published table, by scheduled start (acclimated local time) and segments. */
export const fdpTable: RuleImpl<z.infer<typeof params>> = {
  id: "fdp-limit",
  params,
  onDuty({ duties, params: p, env }) {
    const k = duties.length - 1;
    const d = duties[k]!;
    if (!d.flight || d.source.kind === "look-back") return [];
    const acc = acclimationAt(duties, k, env);
    const start = minuteOfDay(d.report, acc.zone);
    const base = p.table === "us-117-table-b" ? usTableBMinutes(start, d.segments) : euTableTwoMinutes(start, d.segments);
    const limit = acc.acclimated ? base : base - p.notAcclimatedReductionMinutes;
    const fdp = (d.release - d.report) / MINUTE;
    if (fdp <= limit) return [];
    const clock = localTime(new Date(d.report).toISOString(), acc.zone);
    return [
      {
        ruleId: "fdp-limit",
        measured: fdp,
        limit,
        unit: "minutes",
        items: itemsOf(d),
        text:
          `flight duty ${d.source.index + 1} of ${name(d)} lasts ${hm(fdp)}; starting at ${clock} with ${d.segments} ` +
          `segment${d.segments === 1 ? "" : "s"}${acc.acclimated ? "" : " (not acclimated)"} at most ${hm(limit)} is allowed${cite(p.reference)}`,
      },
    ];
  },
};
