import { z } from "zod";
import { dutyPeriodSchema } from "./duty-period.ts";
import { crewIdSchema, pairingIdSchema } from "./ids.ts";
import { positionSchema } from "./position.ts";
import { stationCodeSchema } from "./station.ts";
import { instantMs } from "./time.ts";
import { instantSchema, localDateSchema, minutesSchema, whenFieldsValid } from "./time-schemas.ts";

function endsAfterStart(value: { start: string; end: string }): boolean {
  return instantMs(value.end) > instantMs(value.start);
}

/** Something already in a crew member's schedule that no pairing may clash with. */
export const fixedActivitySchema = z
  .strictObject({
    kind: z.enum(["vacation", "training", "medical", "office", "other"]),
    start: instantSchema,
    end: instantSchema,
    label: z.string().trim().max(120).optional(),
  })
  .refine(endsAfterStart, { message: "an activity must end after it starts", path: ["end"], ...whenFieldsValid });

/** A fixed activity. */
export type FixedActivity = z.infer<typeof fixedActivitySchema>;

/** Carry-in: the duties of a trip from the previous period that overlaps this one. */
export const carryInSchema = z.strictObject({
  pairingId: pairingIdSchema,
  dutyPeriods: z.array(dutyPeriodSchema).min(1),
});

/** A carry-in trip. */
export type CarryIn = z.infer<typeof carryInSchema>;

/** A duty flown before the period, as rolling limits need it. */
export const pastDutySchema = z
  .strictObject({
    report: instantSchema,
    release: instantSchema,
    flightMinutes: minutesSchema,
    segments: z.number().int().min(0),
    endStation: stationCodeSchema.optional().describe("where the crew member rested after it"),
  })
  .refine((duty) => instantMs(duty.release) > instantMs(duty.report), {
    ...whenFieldsValid,
    message: "a past duty must be released after its report",
    path: ["release"],
  });

/** Flight time on one calendar day (base local), for the 365-day limits. */
export const dailyFlightSchema = z.strictObject({
  date: localDateSchema,
  minutes: minutesSchema.max(1440),
});

/** What rolling limits look back on: the previous 28 days' duties and 365 days' daily flight time. */
export const lookBackSchema = z
  .strictObject({
    duties: z.array(pastDutySchema).default([]),
    dailyFlightMinutes: z.array(dailyFlightSchema).default([]),
  })
  .refine((look) => new Set(look.dailyFlightMinutes.map((day) => day.date)).size === look.dailyFlightMinutes.length, {
    message: "a date appears twice in the daily flight minutes",
    path: ["dailyFlightMinutes"],
  });

/**
 * A crew member of an award group. Seniority 1 is the most senior.
 * `carriedWeight` comes from the fairness ledger and multiplies the seniority
 * weight; 1 means nothing carried over.
 */
export const crewMemberSchema = z
  .strictObject({
    id: crewIdSchema.describe("employee number"),
    name: z.string().trim().min(1, "a crew member needs a name"),
    seniority: z.number().int().min(1),
    base: stationCodeSchema,
    position: positionSchema,
    qualifications: z.array(z.string().trim().min(1)).default([]),
    fixedActivities: z.array(fixedActivitySchema).default([]),
    carryIn: z.array(carryInSchema).default([]),
    lookBack: lookBackSchema.default({ duties: [], dailyFlightMinutes: [] }),
    carriedWeight: z.number().positive().default(1),
  })
  .meta({ id: "CrewMember", title: "Crew member" });

/** A crew member. */
export type CrewMember = z.infer<typeof crewMemberSchema>;
