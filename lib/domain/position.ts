import { z } from "zod";

/** The positions crew hold; the same four values as the database's Position enum. */
export const positions = ["captain", "first_officer", "flight_attendant", "purser"] as const;

/** A crew position; with a base it names an award group. */
export const positionSchema = z.enum(positions);

/** A crew position. */
export type Position = z.infer<typeof positionSchema>;
