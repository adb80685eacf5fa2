import { z } from "zod";
import { awardGroupKey } from "./award-group.ts";
import { canonicalJson } from "./hash.ts";
import { instanceSchema } from "./instance.ts";
import { schemaVersion } from "./schema-version.ts";
import { bidPeriodSchema } from "./period.ts";

/**
 * A bundle: one bid period with one instance per award group — what the
 * generator and the period export write. A period is per base, so every
 * instance shares the bundle's period and base, and no group appears twice.
 */
export const bundleSchema = z
  .strictObject({
    schemaVersion: z.literal(schemaVersion),
    period: bidPeriodSchema,
    instances: z.array(instanceSchema).min(1, "a bundle holds at least one instance"),
  })
  .superRefine((bundle, ctx) => {
    const period = canonicalJson(bundle.period);
    const bases = new Set<string>();
    const groupAt = new Map<string, number>();
    bundle.instances.forEach((instance, k) => {
      if (canonicalJson(instance.period) !== period) {
        ctx.addIssue({
          code: "custom",
          path: ["instances", k, "period"],
          message: `instances[${k}].period differs from the bundle's period "${bundle.period.id}"`,
        });
      }
      bases.add(instance.group.base);
      const key = awardGroupKey(instance.group);
      const first = groupAt.get(key);
      if (first === undefined) groupAt.set(key, k);
      else {
        ctx.addIssue({
          code: "custom",
          path: ["instances", k, "group"],
          message: `instances[${k}].group ${key} repeats instances[${first}]`,
        });
      }
    });
    if (bases.size > 1) {
      ctx.addIssue({
        code: "custom",
        path: ["instances"],
        message: `a bid period covers one base, but these instances are for ${[...bases].sort().join(", ")}`,
      });
    }
  })
  .meta({ title: "Bundle", description: "A bid period: one instance per award group." });

/** A bundle. */
export type Bundle = z.infer<typeof bundleSchema>;
