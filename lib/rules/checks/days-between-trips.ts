import { z } from "zod";
import { daysBetween, localDate } from "../../domain/time.ts";
import type { RuleImpl } from "../rule.ts";
import { cite, itemsOf, name, reference } from "./shared.ts";

const params = z.object({ days: z.number().int().min(1), reference }).strict();

/** Whole base-local calendar days free between one trip and the next (an agreement rule, common practice). */
export const daysBetweenTrips: RuleImpl<z.infer<typeof params>> = {
  id: "days-between-trips",
  params,
  pairwise: true,
  onDuty({ duties, params: p, env }) {
    const d = duties[duties.length - 1]!;
    const prev = duties[duties.length - 2];
    if (!prev || (prev.source.kind === d.source.kind && prev.source.id === d.source.id)) return [];
    if (d.source.kind !== "pairing" || prev.source.kind === "look-back" || d.report < prev.release) return [];
    const free = daysBetween(localDate(new Date(prev.release).toISOString(), env.zone), localDate(new Date(d.report).toISOString(), env.zone)) - 1;
    if (free >= p.days) return [];
    return [
      {
        ruleId: "days-between-trips",
        measured: Math.max(0, free),
        limit: p.days,
        unit: "days",
        items: itemsOf(prev, d),
        text: `${name(d)} leaves ${Math.max(0, free)} whole days free after ${name(prev)}; at least ${p.days} are required${cite(p.reference)}`,
      },
    ];
  },
};
