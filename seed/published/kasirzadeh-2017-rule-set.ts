/**
 * The rule-set document of the published data set: the limits its pairings
 * were built under, written as parameters of the same rule-set document the
 * presets use (lib/domain/rule-set.ts), so the legality engine reads them the
 * same way.
 */
import type { RuleSet } from "../../lib/domain/index.ts";

/** Minimum rest inside a pairing: 8 h (the data set's README: every rest lasts at least 8 h). */
export const MIN_REST_IN_PAIRING_MIN = 8 * 60;
/** Maximum duty: 12 h (the data set's README: every duty lasts at most 12 h). */
export const MAX_DUTY_MIN = 12 * 60;
/**
 * Monthly credit maximum per line: 85 h. The paper bounds monthly credit per
 * pilot but this value is our own assumption, not the paper's.
 */
export const MONTHLY_CREDIT_MAX_MIN = 85 * 60;

/**
 * Whether a limit is measured on the legs (first departure to last arrival for
 * a duty, last arrival to next first departure for a rest) or on the duty
 * (report to release). The data set states its limits on the legs — it carries
 * no report or release times — and its pairings keep them only when measured
 * that way: with our 60 min report and 30 min release added, the longest duty
 * of instance 2 is 13 h 30 and its shortest rest 7 h 01.
 */
export type MeasuredOn = "legs" | "duty";

/** The rule-set document of the published data set (Kasirzadeh, Saddoune & Soumis 2017). */
export function kasirzadehRuleSet(): RuleSet {
  const measuredOn: MeasuredOn = "legs";
  return {
    name: "Published data set (Kasirzadeh, Saddoune & Soumis 2017)",
    preset: "kasirzadeh-2017",
    description:
      "The limits the published pairings were built under: 8 h rest inside pairings and 12 h duty, both measured on " +
      "the legs, as the data set states them. The 85 h monthly credit maximum is our assumption; the paper bounds " +
      "monthly credit without a value in the files.",
    rules: [
      {
        id: "min-rest-in-pairing",
        params: { check: "min-rest", minMinutes: MIN_REST_IN_PAIRING_MIN, measuredOn, withinTripOnly: true },
        text: "Inside a pairing, at least 8 h pass between the last arrival of one duty period and the first departure of the next.",
      },
      {
        id: "max-duty",
        params: { maxMinutes: MAX_DUTY_MIN, measuredOn },
        text: "A duty period lasts at most 12 h from its first departure to its last arrival.",
      },
      {
        id: "credit-window",
        params: { minMinutes: 0, maxMinutes: MONTHLY_CREDIT_MAX_MIN },
        text: "A line holds at most 85 h of credit in the month.",
      },
    ],
  };
}
