/**
 * The rule-set documents generated periods carry: the legality engine's
 * presets (lib/rules) for the group's position, with the agreement rules'
 * common-practice figures.
 */
import type { Position, RuleSet } from "../../lib/domain/index.ts";
import { presetRuleSet } from "../../lib/rules/index.ts";

export function ruleSetFor(position: Position): RuleSet {
  return presetRuleSet(position === "captain" || position === "first_officer" ? "us-flightcrew" : "us-cabin");
}
