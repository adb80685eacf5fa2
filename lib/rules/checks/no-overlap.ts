import { z } from "zod";
import type { RuleImpl } from "../rule.ts";
import { hm, type Violation } from "../rule.ts";
import { MINUTE, itemsOf, name } from "./shared.ts";

/** Built in to every rule set: nothing in a line may overlap anything else. */
export const noOverlap: RuleImpl<Record<string, never>> = {
  id: "no-overlap",
  params: z.object({}).strict() as never,
  pairwise: true,
  onDuty({ duties }) {
    const d = duties[duties.length - 1]!;
    const prev = duties[duties.length - 2];
    if (!prev || d.report >= prev.release) return [];
    const v: Violation = {
      ruleId: "no-overlap",
      measured: (prev.release - d.report) / MINUTE,
      limit: 0,
      unit: "minutes",
      items: itemsOf(prev, d),
      text: `${name(d)} starts ${hm((prev.release - d.report) / MINUTE)} before ${name(prev)} ends; a line cannot hold both`,
    };
    return [v];
  },
};
