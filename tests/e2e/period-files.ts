/**
 * The CSV files the browser tests upload: the scenario's crew (the same twelve
 * as the seeded January) with another month's trips, written by the
 * generator's own CSV writer (seed/generator/write-csv.ts).
 */
import { csvTexts } from "../../seed/generator/write-csv.ts";
import { smallScenario, smallScenarioBundle } from "../../seed/small-scenario.ts";

/** The files for the month after the one `bidMonthStart` bids in, e.g. "2027-01-01" → February 2027. */
export function monthFiles(bidMonthStart: string, seed = 12) {
  const texts = csvTexts(smallScenarioBundle(smallScenario({ seed, now: new Date(`${bidMonthStart}T12:00:00Z`) })));
  return Object.fromEntries(Object.entries(texts).map(([name, text]) => [name, { name, mimeType: "text/csv", buffer: Buffer.from(text) }])) as Record<
    keyof typeof texts,
    { name: string; mimeType: string; buffer: Buffer }
  >;
}
