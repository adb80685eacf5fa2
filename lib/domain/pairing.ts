import { z } from "zod";
import { dutyPeriodSchema } from "./duty-period.ts";
import { pairingIdSchema } from "./ids.ts";
import { positionSchema } from "./position.ts";
import { stationCodeSchema } from "./station.ts";
import { instantMs } from "./time.ts";
import { minutesSchema, whenFieldsValid } from "./time-schemas.ts";

/** How many crew of each position a pairing needs; a missing position needs none. */
export const crewNeededSchema = z.partialRecord(
  positionSchema,
  z.number().int("crew needed must be a whole number").min(0, "crew needed cannot be negative"),
);

/**
 * A pairing (trip): duty periods from the base back to the base, with layovers
 * between them. Block, credit and time away from base are given by the planner,
 * not derived, because rigs and guarantees differ between carriers.
 */
export const pairingSchema = z
  .strictObject({
    id: pairingIdSchema,
    base: stationCodeSchema,
    dutyPeriods: z.array(dutyPeriodSchema).min(1, "a pairing needs at least one duty period"),
    blockMinutes: minutesSchema,
    creditMinutes: minutesSchema,
    tafbMinutes: minutesSchema.describe("time away from base"),
    crewNeeded: crewNeededSchema,
    requires: z.array(z.string().trim().min(1)).default([]).describe("qualifications a crew member must hold"),
  })
  .superRefine((pairing, ctx) => {
    const duties = pairing.dutyPeriods;
    const firstLeg = duties[0]?.legs[0];
    const lastLeg = duties.at(-1)?.legs.at(-1);
    if (firstLeg && firstLeg.from !== pairing.base) {
      ctx.addIssue({
        code: "custom",
        path: ["dutyPeriods", 0, "legs", 0, "from"],
        message: `pairing ${pairing.id} starts at ${firstLeg.from}, not at its base ${pairing.base}`,
      });
    }
    if (lastLeg && lastLeg.to !== pairing.base) {
      ctx.addIssue({
        code: "custom",
        path: ["dutyPeriods", duties.length - 1, "legs"],
        message: `pairing ${pairing.id} ends at ${lastLeg.to}, not at its base ${pairing.base}`,
      });
    }
    duties.forEach((duty, k) => {
      const previous = duties[k - 1];
      if (!previous) return;
      if (instantMs(duty.report) < instantMs(previous.release)) {
        ctx.addIssue({
          code: "custom",
          path: ["dutyPeriods", k, "report"],
          message: `pairing ${pairing.id}: duty ${k + 1} reports ${duty.report}, before duty ${k} is released ${previous.release}`,
        });
      }
      const layover = previous.legs.at(-1)?.to;
      const next = duty.legs[0]?.from;
      if (layover !== next) {
        ctx.addIssue({
          code: "custom",
          path: ["dutyPeriods", k, "legs", 0, "from"],
          message: `pairing ${pairing.id}: duty ${k + 1} starts at ${next}, but duty ${k} ended at ${layover}`,
        });
      }
    });
  }, whenFieldsValid)
  .meta({ id: "Pairing", title: "Pairing" });

/** A pairing. */
export type Pairing = z.infer<typeof pairingSchema>;
