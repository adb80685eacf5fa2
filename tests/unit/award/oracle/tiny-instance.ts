/**
 * Tiny instances for the oracle tests: a period from the bid-period generator
 * (seed/generator) for one position, its credit window fitted to a period of
 * 7–10 days (the preset's 65–95 h is for a month), parsed again by
 * instanceSchema.
 */
import { instanceSchema, type Instance } from "@/lib/domain";
import { generatePeriod } from "@/seed/generator/generate-period";
import type { GeneratorInput } from "@/seed/generator/params";

export interface Variant {
  minCreditMinutes: number;
  maxCreditMinutes: number;
  reserve?: { min: number; max?: number };
  /** the award mode; balanced when absent */
  mode?: "balanced" | "strict";
}

/** A generated period for one position, its credit window replaced, in `variant.mode` (balanced by default). */
export function tinyInstance(params: GeneratorInput, variant: Variant, pick?: (instance: Instance) => Instance): Instance {
  let instance = generatePeriod({ positions: ["captain"], ...params }).instances[0]!;
  if (pick) instance = pick(instance);
  const rules = instance.ruleSet.rules.map((r) =>
    r.id === "credit-window" ? { ...r, params: { minMinutes: variant.minCreditMinutes, maxMinutes: variant.maxCreditMinutes } } : r,
  );
  if (!rules.some((r) => r.id === "credit-window")) throw new Error("the preset has no credit window to fit");
  return instanceSchema.parse({
    ...instance,
    ruleSet: { ...instance.ruleSet, rules },
    settings: { ...instance.settings, mode: variant.mode ?? "balanced", ...(variant.reserve ? { reserve: variant.reserve } : {}) },
  });
}
