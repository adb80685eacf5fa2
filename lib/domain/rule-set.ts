import { z } from "zod";

/** A rule's parameters: plain values a planner can read and change. */
export const ruleParamsSchema = z.record(z.string().min(1), z.union([z.number(), z.string(), z.boolean()]));

/** One rule of a rule set, by id, with its parameters and a plain sentence saying what it asks. */
export const ruleSchema = z.strictObject({
  id: z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, { message: "a rule id is kebab-case, such as min-rest" }),
  params: ruleParamsSchema.default({}),
  text: z.string().trim().min(1, "a rule needs a sentence saying what it asks"),
});

/** A rule. */
export type Rule = z.infer<typeof ruleSchema>;

/**
 * A rule-set document: which rules are in force for an award group and with
 * what parameters. Presets are data, not code paths; the rules themselves are
 * defined by the legality engine.
 */
export const ruleSetSchema = z
  .strictObject({
    name: z.string().trim().min(1),
    preset: z.string().trim().min(1),
    description: z.string().optional(),
    rules: z.array(ruleSchema),
  })
  .superRefine((ruleSet, ctx) => {
    const seen = new Map<string, number>();
    ruleSet.rules.forEach((rule, k) => {
      const first = seen.get(rule.id);
      if (first !== undefined) {
        ctx.addIssue({
          code: "custom",
          path: ["rules", k, "id"],
          message: `rules[${k}].id "${rule.id}" repeats rules[${first}]`,
        });
      } else seen.set(rule.id, k);
    });
  })
  .meta({ id: "RuleSet", title: "Rule set" });

/** A rule-set document. */
export type RuleSet = z.infer<typeof ruleSetSchema>;
