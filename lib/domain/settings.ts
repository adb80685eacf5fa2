import { z } from "zod";

/** How many reserve lines the award group must and may have. No `max` means up to the whole group. */
export const reserveBoundsSchema = z
  .strictObject({
    min: z.number().int().min(0).default(0),
    max: z.number().int().min(0).optional(),
  })
  .refine((bounds) => bounds.max === undefined || bounds.min <= bounds.max, {
    message: "the reserve minimum is above the maximum",
    path: ["max"],
  });

/**
 * Award settings of one award group; every field has a default, so `{}` parses.
 * - `mode`: "strict" seniority (lexicographic, the default, as most agreements
 *   ask) or "balanced" (weighted satisfaction).
 * - `rankDecay`: the weight of wish rank r is rankDecay^r.
 * - `baseLineValue` B: added to every line-holder line so holding a line beats reserve.
 * - `seniorityWeight` β: balanced mode weighs crew i of n by 1 + β(n − i)/n.
 * - `fairnessFloor` φ: balanced mode keeps every satisfaction at φ or more (elastic).
 * - `timeLimitSeconds`, `iterationLimit`, `seed`: solver limits and tie-breaking.
 */
export const awardSettingsSchema = z
  .strictObject({
    mode: z.enum(["strict", "balanced"]).default("strict"),
    rankDecay: z.number().gt(0, "rank decay must be above 0").max(1, "rank decay must be at most 1").default(0.8),
    baseLineValue: z.number().positive().default(1),
    seniorityWeight: z.number().min(0).default(1),
    fairnessFloor: z.number().min(0).max(1).optional(),
    reserve: reserveBoundsSchema.default({ min: 0 }),
    timeLimitSeconds: z.number().positive().max(86_400).default(600),
    iterationLimit: z.number().int().positive().optional(),
    seed: z.number().int().min(0).optional(),
  })
  .meta({ id: "AwardSettings", title: "Award settings" });

/** Award settings. */
export type AwardSettings = z.infer<typeof awardSettingsSchema>;
