/**
 * Rule implementations by id. A rule in a rule-set document is looked up by
 * its `check` parameter when it has one (several rules can share one
 * implementation: three cumulative limits, say), else by its own id.
 */
import type { Rule, RuleSet } from "../domain/index.ts";
import { AppError } from "../domain/index.ts";
import { cumulative } from "./checks/cumulative.ts";
import { daysBetweenTrips } from "./checks/days-between-trips.ts";
import { recoveryRest } from "./checks/recovery-rest.ts";
import { fdpTable } from "./checks/fdp-table.ts";
import { flightTimeTable } from "./checks/flight-time-table.ts";
import { freePeriod } from "./checks/free-period.ts";
import { creditWindow, maxDaysOn, minDaysOff } from "./checks/line-rules.ts";
import { maxDuty } from "./checks/max-duty.ts";
import { minRest } from "./checks/min-rest.ts";
import type { RuleImpl } from "./rule.ts";

const IMPLEMENTATIONS: readonly RuleImpl<never>[] = [
  minRest, maxDuty, fdpTable, flightTimeTable, cumulative, freePeriod, recoveryRest, creditWindow, minDaysOff, maxDaysOn, daysBetweenTrips,
] as unknown as RuleImpl<never>[];

export const REGISTRY: ReadonlyMap<string, RuleImpl<unknown>> = new Map(IMPLEMENTATIONS.map((r) => [r.id, r as RuleImpl<unknown>]));

/**
 * The rules of a document that judge duties and rests (no line-only rules such
 * as the credit window or days off): what a single trip can be held to.
 */
export function dutyRulesOnly(ruleSet: RuleSet): RuleSet {
  return { ...ruleSet, rules: ruleSet.rules.filter((r) => REGISTRY.get(String(r.params.check ?? r.id))?.onDuty !== undefined) };
}

/** A rule of a document, bound to its implementation with parsed parameters. */
export interface BoundRule {
  rule: Rule;
  impl: RuleImpl<unknown>;
  params: unknown;
}

/** Binds every rule of a document; an unknown rule or bad parameters is an error naming the rule. */
export function bindRules(rules: readonly Rule[]): BoundRule[] {
  return rules.map((rule, k) => {
    const { check, ...rest } = rule.params as Record<string, unknown>;
    const implId = typeof check === "string" ? check : rule.id;
    const impl = REGISTRY.get(implId);
    if (!impl) throw new AppError("invalid", `rules[${k}] "${rule.id}": no check named "${implId}" (known: ${[...REGISTRY.keys()].join(", ")})`);
    const parsed = impl.params.safeParse(rest);
    if (!parsed.success) {
      const why = parsed.error.issues.map((i) => `${i.path.join(".") || "params"}: ${i.message}`).join("; ");
      throw new AppError("invalid", `rules[${k}] "${rule.id}": ${why}`);
    }
    return { rule, impl, params: parsed.data };
  });
}
