import { z } from "zod";
import { awardGroupSchema } from "./award-group.ts";
import { crewMemberSchema } from "./crew.ts";
import { crewIdSchema } from "./ids.ts";
import { checkInstance } from "./instance-checks.ts";
import { pairingSchema } from "./pairing.ts";
import { bidPeriodSchema } from "./period.ts";
import { ruleSetSchema } from "./rule-set.ts";
import { schemaVersion } from "./schema-version.ts";
import { whenFieldsValid } from "./time-schemas.ts";
import { awardSettingsSchema } from "./settings.ts";
import { stationSchema } from "./station.ts";
import { wishListSchema } from "./wish.ts";

const instanceObjectSchema = z.strictObject({
  schemaVersion: z.literal(schemaVersion),
  period: bidPeriodSchema,
  group: awardGroupSchema,
  stations: z.array(stationSchema).min(1),
  pairings: z.array(pairingSchema),
  crew: z.array(crewMemberSchema),
  bids: z.record(crewIdSchema, wishListSchema).default({}),
  ruleSet: ruleSetSchema,
  settings: awardSettingsSchema.prefault({}),
});

/** An instance. */
export type Instance = z.infer<typeof instanceObjectSchema>;

/**
 * An instance: one award group, self-contained — everything the award engine
 * needs and nothing it must look up. `bids` maps a crew id to that crew
 * member's wishes in rank order; crew without an entry bid nothing. The cross
 * checks are listed in {@link checkInstance}.
 */
export const instanceSchema = instanceObjectSchema
  .superRefine(checkInstance, whenFieldsValid)
  .meta({ title: "Instance", description: "One award group of a bid period: everything the award engine needs." });
