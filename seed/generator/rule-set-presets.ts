/**
 * The rule-set documents generated periods carry: the legality engine's
 * presets (lib/rules) for the group's position, with the agreement rules'
 * common-practice figures.
 */
import type { Position, RuleSet } from "../../lib/domain/index.ts";
import { presetFor, presetRuleSet } from "../../lib/rules/index.ts";

export function ruleSetFor(position: Position): RuleSet {
  return presetRuleSet(presetFor(position));
}
