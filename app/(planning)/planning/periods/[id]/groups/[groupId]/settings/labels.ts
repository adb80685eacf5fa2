/** Plain words for the rule parameters and settings on the rule-set screen. */

const PARAM_LABEL: Record<string, string> = {
  minMinutes: "Minimum, minutes",
  maxMinutes: "Maximum, minutes",
  atBaseMinutes: "At home base, minutes",
  awayMinutes: "Away from base, minutes",
  atLeastPrecedingDuty: "At least as long as the duty before",
  before: "Before",
  measuredOn: "Measured on",
  withinTripOnly: "Only within a trip",
  betweenTripsOnly: "Only between trips",
  table: "Table",
  notAcclimatedReductionMinutes: "Less when not acclimated, minutes",
  measure: "Adds up",
  windowHours: "Window, hours",
  windowDays: "Window, days",
  calendarYear: "In a calendar year",
  freeHours: "Free, hours",
  minHours: "Minimum, hours",
  nights: "Local nights",
  maxGapHours: "At most this many hours before a duty",
  days: "Days",
  reserveDays: "Days on a reserve line",
  per30Days: "Per 30 days of the period",
  reference: "Source",
};

const OPTION_LABEL: Record<string, Record<string, string>> = {
  measure: { fdp: "flight duty periods", duty: "all duty", flight: "flight time" },
  before: { fdp: "a flight duty period", any: "any duty" },
  measuredOn: { duty: "release to report", legs: "last arrival to next departure" },
};

/** "maxGapHours" → its plain label; an unknown key is spelt out ("someKey" → "Some key"). */
export function paramLabel(key: string): string {
  const known = PARAM_LABEL[key];
  if (known) return known;
  const words = key.replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** A choice's value in words, where it has some. */
export function optionLabel(key: string, value: string): string {
  return OPTION_LABEL[key]?.[value] ?? value;
}

/** 3900 → "65 h", 90 → "1 h 30 min". */
export function minutesText(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = Math.round(minutes % 60);
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}

export const MODE_CHOICES = [
  { value: "strict", label: "Strict seniority", explain: "In seniority order, each crew member gets the best line that still leaves every senior colleague theirs." },
  { value: "balanced", label: "Weighted balance", explain: "Raises the satisfaction of the whole group, the senior crew counting more; a floor can protect everyone." },
] as const;
