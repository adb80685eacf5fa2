/**
 * The rule-set documents generated periods carry until the legality engine
 * ships its presets (lib/rules): the preset name plus the agreement rules a
 * generated line should respect, as parameters. The numbers are ours (common
 * practice ranges), not any carrier's.
 */
import type { Position, Rule, RuleSet } from "../../lib/domain/index.ts";

const agreement = (minCredit: number, maxCredit: number): Rule[] => [
  { id: "credit-window", params: { minMinutes: minCredit, maxMinutes: maxCredit }, text: `A line holds between ${minCredit / 60} and ${maxCredit / 60} hours of credit.` },
  { id: "min-days-off", params: { days: 10 }, text: "A line leaves at least 10 calendar days off in the period (base local)." },
  { id: "max-days-on", params: { days: 6 }, text: "At most 6 duty days in a row." },
];

export function ruleSetFor(position: Position): RuleSet {
  return position === "captain" || position === "first_officer"
    ? { name: "Flight deck (US Part 117)", preset: "us-flightcrew", description: "Follows 14 CFR Part 117 (limits come with the legality engine).", rules: agreement(3900, 5700) }
    : { name: "Cabin (US 121.467)", preset: "us-cabin", description: "Follows 14 CFR 121.467 (limits come with the legality engine).", rules: agreement(3900, 6000) };
}
