import { z } from "zod";
import { stationCodeSchema } from "./station.ts";
import { clockTimeSchema, minutesSchema } from "./time-schemas.ts";

/** A trip's length in days, either end open. */
export const lengthDaysSchema = z
  .strictObject({
    min: z.number().int().min(1).optional(),
    max: z.number().int().min(1).optional(),
  })
  .refine((range) => range.min !== undefined || range.max !== undefined, {
    message: "a length in days needs a min, a max or both",
  })
  .refine((range) => range.min === undefined || range.max === undefined || range.min <= range.max, {
    message: "the shortest length is longer than the longest",
  });

/**
 * "Trips like this": every field given must hold (they combine with AND).
 * Clock times are base local and compare within the day (no wrap past
 * midnight). Report times read the trip's first report, release times its last
 * release, because that is when the crew member leaves and gets home.
 * `reportBefore` and `releaseAfter` are there so that "no trip reporting before
 * 06:00" can be said as a no-trip wish.
 */
export const tripFilterSchema = z
  .strictObject({
    lengthDays: lengthDaysSchema.optional(),
    layoverAt: z.array(stationCodeSchema).min(1).optional().describe("lays over at any one of these stations"),
    reportAfter: clockTimeSchema.optional().describe("first report at or after this base-local time"),
    reportBefore: clockTimeSchema.optional().describe("first report before this base-local time"),
    releaseBefore: clockTimeSchema.optional().describe("last release at or before this base-local time"),
    releaseAfter: clockTimeSchema.optional().describe("last release after this base-local time"),
    daysOfWeek: z
      .array(z.number().int().min(1).max(7))
      .min(1)
      .optional()
      .describe("touches at least one of these ISO days of the week, 1 = Monday … 7 = Sunday"),
    minCreditPerDutyDay: minutesSchema.optional().describe("credit minutes per duty period, at least"),
    maxLegsPerDuty: z.number().int().min(1).optional().describe("legs in every duty period, at most, deadheads included"),
    redEye: z.boolean().optional().describe("true: has a red-eye duty; false: has none"),
    deadhead: z.boolean().optional().describe("true: has a deadhead leg; false: has none"),
  })
  .refine((filter) => Object.values(filter).some((value) => value !== undefined), {
    message: "a trip filter needs at least one condition",
  })
  .meta({ id: "TripFilter", title: "Trip filter" });

/** A trip filter. */
export type TripFilter = z.infer<typeof tripFilterSchema>;
