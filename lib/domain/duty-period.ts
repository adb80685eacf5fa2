import { z } from "zod";
import { stationCodeSchema } from "./station.ts";
import { instantMs } from "./time.ts";
import { instantSchema, minutesSchema, whenFieldsValid } from "./time-schemas.ts";

/**
 * A leg: one flight, operated or ridden as a deadhead (positioning as a
 * passenger). Instants are UTC. `blockMinutes` is given rather than derived,
 * because carriers count block of deadheads differently.
 */
export const legSchema = z
  .strictObject({
    flightNumber: z.string().trim().min(1, "a leg needs a flight number").max(10),
    from: stationCodeSchema,
    to: stationCodeSchema,
    departure: instantSchema,
    arrival: instantSchema,
    deadhead: z.boolean().default(false),
    blockMinutes: minutesSchema,
    equipment: z.string().trim().min(1).optional(),
  })
  .superRefine((leg, ctx) => {
    if (instantMs(leg.arrival) <= instantMs(leg.departure)) {
      ctx.addIssue({
        code: "custom",
        path: ["arrival"],
        message: `flight ${leg.flightNumber}: arrival ${leg.arrival} is not after its departure ${leg.departure}`,
      });
    }
  }, whenFieldsValid)
  .meta({ id: "Leg", title: "Leg" });

/** A leg. */
export type Leg = z.infer<typeof legSchema>;

/**
 * A duty period: from report to release, with its legs in order. Report comes at
 * or before the first departure and release at or after the last arrival; each
 * leg departs where the previous one arrived, no earlier than it arrived.
 */
export const dutyPeriodSchema = z
  .strictObject({
    report: instantSchema,
    release: instantSchema,
    legs: z.array(legSchema).min(1, "a duty period needs at least one leg"),
  })
  .superRefine((duty, ctx) => {
    const first = duty.legs[0];
    const last = duty.legs.at(-1);
    if (!first || !last) return;
    if (instantMs(duty.report) > instantMs(first.departure)) {
      ctx.addIssue({
        code: "custom",
        path: ["report"],
        message: `report ${duty.report} is after the first departure ${first.departure} (flight ${first.flightNumber})`,
      });
    }
    if (instantMs(duty.release) < instantMs(last.arrival)) {
      ctx.addIssue({
        code: "custom",
        path: ["release"],
        message: `release ${duty.release} is before the last arrival ${last.arrival} (flight ${last.flightNumber})`,
      });
    }
    duty.legs.forEach((leg, k) => {
      const previous = duty.legs[k - 1];
      if (!previous) return;
      if (leg.from !== previous.to) {
        ctx.addIssue({
          code: "custom",
          path: ["legs", k, "from"],
          message: `flight ${leg.flightNumber} departs ${leg.from} but flight ${previous.flightNumber} arrived at ${previous.to}`,
        });
      }
      if (instantMs(leg.departure) < instantMs(previous.arrival)) {
        ctx.addIssue({
          code: "custom",
          path: ["legs", k, "departure"],
          message: `flight ${leg.flightNumber} departs ${leg.departure}, before flight ${previous.flightNumber} arrives ${previous.arrival}`,
        });
      }
    });
  }, whenFieldsValid)
  .meta({ id: "DutyPeriod", title: "Duty period" });

/** A duty period. */
export type DutyPeriod = z.infer<typeof dutyPeriodSchema>;
