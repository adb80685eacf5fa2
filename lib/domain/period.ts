import { z } from "zod";
import { daysBetween } from "./time.ts";
import { localDateSchema, whenFieldsValid, zoneSchema } from "./time-schemas.ts";

/** A bid period: its first and last dates (both included, base local) and the base's zone. */
export const bidPeriodSchema = z
  .strictObject({
    id: z.string().trim().min(1),
    name: z.string().trim().min(1),
    startDate: localDateSchema,
    endDate: localDateSchema,
    zone: zoneSchema,
  })
  .refine((period) => daysBetween(period.startDate, period.endDate) >= 0, {
    ...whenFieldsValid,
    message: "the period ends before it starts",
    path: ["endDate"],
  })
  .meta({ id: "BidPeriod", title: "Bid period" });

/** A bid period. */
export type BidPeriod = z.infer<typeof bidPeriodSchema>;
