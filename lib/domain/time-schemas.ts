import { IANAZone } from "luxon";
import { z } from "zod";
import { canonicalInstant } from "./time.ts";

/**
 * An instant in UTC, ISO-8601 with a trailing "Z" (offsets are refused so that
 * every stored instant reads the same way). Parsing normalises it to
 * `YYYY-MM-DDTHH:MM:SSZ` (milliseconds kept only when not zero), so parsed
 * instants compare correctly as strings and hash the same however they were
 * written ("…08:00:00.000Z" and "…08:00:00Z" are one instant).
 */
export const instantSchema = z.iso
  .datetime({ message: "expected a UTC instant such as 2027-03-14T08:00:00Z" })
  .transform((text) => canonicalInstant(text));

/** A UTC instant as the domain passes it around: a canonical ISO string. */
export type Instant = z.infer<typeof instantSchema>;

/** A calendar date "YYYY-MM-DD" (a real date), read in the base's zone. */
export const localDateSchema = z.iso.date({ message: "expected a date such as 2027-03-14" });

/** A calendar date "YYYY-MM-DD". */
export type LocalDate = z.infer<typeof localDateSchema>;

/** A local clock time "HH:MM", 00:00..23:59, read in the base's zone. */
export const clockTimeSchema = z.iso.time({ precision: -1, message: "expected a clock time such as 06:30" });

/** A local clock time "HH:MM". */
export type ClockTime = z.infer<typeof clockTimeSchema>;

/** An IANA time-zone name that this runtime's time-zone data knows. */
export const zoneSchema = z
  .string()
  .refine((zone) => IANAZone.isValidZone(zone), {
    error: (issue) => `"${String(issue.input)}" is not a known IANA time zone`,
  });

/** A duration in whole minutes, never negative. */
export const minutesSchema = z.number().int("minutes must be whole").min(0, "minutes cannot be negative");

/**
 * For cross-field checks that read instants and dates: run only when every
 * field parsed (issues so far are other cross-field checks' own, code
 * "custom"), so a bad field is reported at its path instead of making the
 * check itself throw, and cross-field findings still add up.
 */
export const whenFieldsValid = {
  when: (payload: { issues: readonly { code?: string }[] }) => payload.issues.every((issue) => issue.code === "custom"),
};
