import { z } from "zod";
import { zoneSchema } from "./time-schemas.ts";

/** A station code: three or four capital letters. */
export const stationCodeSchema = z
  .string()
  .regex(/^[A-Z]{3,4}$/, { message: "a station code is 3 or 4 capital letters, such as HVN" });

/** A station code. */
export type StationCode = z.infer<typeof stationCodeSchema>;

/**
 * A station: where legs depart and arrive, with the IANA zone its local days and
 * clock times are read in, and its longitude (degrees east, negative west),
 * which acclimation rules compare across a trip.
 */
export const stationSchema = z
  .strictObject({
    code: stationCodeSchema,
    name: z.string().trim().min(1, "a station needs a name"),
    zone: zoneSchema,
    longitude: z.number().min(-180).max(180),
  })
  .meta({ id: "Station", title: "Station" });

/** A station. */
export type Station = z.infer<typeof stationSchema>;
