/**
 * The shipped rule-set presets: data, not code paths. Each holds the
 * regulatory limits it follows (sections named in every rule's sentence) and
 * the agreement rules an operator layers on top, with parameters to change.
 * Figures: ../shared/reference/duty-rest-rules.md (read from the published
 * texts); agreement figures are common practice, no published source.
 */
import type { Rule, RuleSet } from "../domain/index.ts";

export type PresetId = "us-flightcrew" | "us-cabin" | "eu-crew";

/**
 * Agreement rules, common practice: credit window, days off (reserve: 12 per
 * 30 days), days on in a row, rest at base between trips; with `daysBetweenTrips`,
 * whole calendar days free between trips.
 */
export function agreementRules(
  o: { minCredit?: number; maxCredit?: number; daysOff?: number; maxDaysOn?: number; restAtBase?: number; daysBetweenTrips?: number } = {},
): Rule[] {
  const between: Rule[] = o.daysBetweenTrips
    ? [{ id: "days-between-trips", params: { days: o.daysBetweenTrips }, text: `At least ${o.daysBetweenTrips} whole calendar days free between trips (agreement).` }]
    : [];
  return [
    { id: "rest-at-base", params: { check: "min-rest", minMinutes: o.restAtBase ?? 720, betweenTripsOnly: true }, text: "At least 12 hours of rest at base between trips (agreement, common practice)." },
    ...between,
    { id: "credit-window", params: { minMinutes: o.minCredit ?? 65 * 60, maxMinutes: o.maxCredit ?? 95 * 60 }, text: "A line holds between 65 and 95 hours of credit (agreement)." },
    { id: "min-days-off", params: { days: o.daysOff ?? 10, reserveDays: 12, per30Days: true }, text: "At least 10 days off per 30 days in the period; 12 on a reserve line (agreement, common practice)." },
    { id: "max-days-on", params: { days: o.maxDaysOn ?? 6 }, text: "At most 6 duty days in a row (agreement)." },
  ];
}

const US_FLIGHTCREW: Rule[] = [
  { id: "fdp-limit", params: { table: "us-117-table-b", notAcclimatedReductionMinutes: 30, reference: "14 CFR 117.13" }, text: "A flight duty period stays within Table B for its acclimated start time and segments; 30 minutes less when not acclimated." },
  { id: "flight-time-limit", params: { table: "us-117-table-a", reference: "14 CFR 117.11" }, text: "Flight time in one flight duty period stays within Table A for its report time." },
  { id: "rest-before-fdp", params: { check: "min-rest", minMinutes: 600, before: "fdp", reference: "14 CFR 117.25(e)" }, text: "10 consecutive hours of rest, measured from release, before every flight duty period." },
  { id: "free-30-in-168", params: { check: "free-period", freeHours: 30, windowHours: 168, before: "fdp", reference: "14 CFR 117.25(b)" }, text: "30 consecutive hours free from all duty within the 168 hours before every flight duty period." },
  { id: "fdp-60-in-168", params: { check: "cumulative-limit", measure: "fdp", windowHours: 168, maxMinutes: 3600, reference: "14 CFR 117.23(c)(1)" }, text: "At most 60 flight duty period hours in any 168 consecutive hours." },
  { id: "fdp-190-in-672", params: { check: "cumulative-limit", measure: "fdp", windowHours: 672, maxMinutes: 11400, reference: "14 CFR 117.23(c)(2)" }, text: "At most 190 flight duty period hours in any 672 consecutive hours." },
  { id: "flight-100-in-672", params: { check: "cumulative-limit", measure: "flight", windowHours: 672, maxMinutes: 6000, reference: "14 CFR 117.23(b)(1)" }, text: "At most 100 hours of flight time in any 672 consecutive hours." },
  { id: "flight-1000-in-365-days", params: { check: "cumulative-limit", measure: "flight", windowDays: 365, maxMinutes: 60000, reference: "14 CFR 117.23(b)(2)" }, text: "At most 1,000 hours of flight time in any 365 consecutive calendar days." },
];

const US_CABIN: Rule[] = [
  { id: "max-scheduled-duty", params: { check: "max-duty", maxMinutes: 840, reference: "14 CFR 121.467(b)" }, text: "A scheduled duty period lasts at most 14 hours." },
  { id: "rest-after-duty", params: { check: "min-rest", minMinutes: 600, before: "any", reference: "14 CFR 121.467(b) (10 h since the 2022 amendment)" }, text: "At least 10 consecutive hours of rest after every scheduled duty period; not reducible." },
  { id: "free-24-in-7-days", params: { check: "free-period", freeHours: 24, windowDays: 7, before: "any", reference: "14 CFR 121.467(b)(13)" }, text: "At least 24 consecutive hours free from duty in any 7 consecutive calendar days." },
];

const EU_CREW: Rule[] = [
  { id: "fdp-limit", params: { table: "eu-oro-ftl-205-table-2", notAcclimatedReductionMinutes: 0, reference: "ORO.FTL.205(b)(1) Table 2" }, text: "A flight duty period stays within Table 2 for its start at reference time and sectors." },
  { id: "rest-at-and-away", params: { check: "min-rest", atBaseMinutes: 720, awayMinutes: 600, atLeastPrecedingDuty: true, reference: "ORO.FTL.235(a)/(b)" }, text: "Rest at least as long as the preceding duty, and at least 12 hours at home base or 10 hours away." },
  { id: "duty-60-in-7-days", params: { check: "cumulative-limit", measure: "duty", windowHours: 168, maxMinutes: 3600, reference: "ORO.FTL.210(a)(1)" }, text: "At most 60 duty hours in any 7 consecutive days." },
  { id: "duty-110-in-14-days", params: { check: "cumulative-limit", measure: "duty", windowHours: 336, maxMinutes: 6600, reference: "ORO.FTL.210(a)(2)" }, text: "At most 110 duty hours in any 14 consecutive days." },
  { id: "duty-190-in-28-days", params: { check: "cumulative-limit", measure: "duty", windowHours: 672, maxMinutes: 11400, reference: "ORO.FTL.210(a)(3)" }, text: "At most 190 duty hours in any 28 consecutive days." },
  { id: "flight-100-in-28-days", params: { check: "cumulative-limit", measure: "flight", windowHours: 672, maxMinutes: 6000, reference: "ORO.FTL.210(b)(1)" }, text: "At most 100 hours of flight time in any 28 consecutive days." },
  { id: "flight-900-in-calendar-year", params: { check: "cumulative-limit", measure: "flight", calendarYear: true, maxMinutes: 54000, reference: "ORO.FTL.210(b)(2)" }, text: "At most 900 hours of flight time in a calendar year." },
  // 12 consecutive calendar months are read as 365 consecutive days (366 across a 29 February).
  { id: "flight-1000-in-12-months", params: { check: "cumulative-limit", measure: "flight", windowDays: 365, maxMinutes: 60000, reference: "ORO.FTL.210(b)(3)" }, text: "At most 1,000 hours of flight time in any 12 consecutive calendar months." },
  { id: "recovery-rest", params: { minHours: 36, nights: 2, maxGapHours: 168, reference: "ORO.FTL.235(d)" }, text: "A recovery rest of at least 36 hours with 2 local nights, at most 168 hours before every duty." },
];

const PRESETS: Record<PresetId, { name: string; description: string; rules: Rule[] }> = {
  "us-flightcrew": {
    name: "Flight deck (US Part 117)",
    description: "Follows 14 CFR Part 117 for flightcrew: Table A and Table B limits, 117.25 rest, 117.23 cumulative limits; agreement rules on top.",
    rules: US_FLIGHTCREW,
  },
  "us-cabin": {
    name: "Cabin (US 121.467)",
    description: "Follows 14 CFR 121.467 for flight attendants (14 h scheduled duty, 10 h rest as amended in 2022, 24 h free in 7 days); agreement rules on top.",
    rules: US_CABIN,
  },
  "eu-crew": {
    name: "Crew (EU ORO.FTL)",
    description: "Follows Regulation (EU) No 965/2012 ORO.FTL: Table 2 FDP limits, .210 cumulative duty and flight time, .235 rest at and away from base; agreement rules on top.",
    rules: EU_CREW,
  },
};

/** A preset's rule-set document, with agreement rules (override their figures with `agreement`). */
export function presetRuleSet(id: PresetId, agreement?: Parameters<typeof agreementRules>[0]): RuleSet {
  const p = PRESETS[id];
  return { name: p.name, preset: id, description: p.description, rules: [...p.rules, ...agreementRules(agreement)] };
}

export const PRESET_IDS = Object.keys(PRESETS) as PresetId[];

/** The preset a new award group of `position` starts from: flight-deck crew and cabin crew follow different rules. */
export function presetFor(position: "captain" | "first_officer" | "purser" | "flight_attendant"): PresetId {
  return position === "captain" || position === "first_officer" ? "us-flightcrew" : "us-cabin";
}
