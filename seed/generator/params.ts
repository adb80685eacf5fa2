/**
 * What the bid-period generator takes. Every field has a default, so `{}`
 * makes a plausible month at Halvern for captains and first officers.
 */
import { z } from "zod";
import { localDateSchema, positionSchema } from "../../lib/domain/index.ts";

export const generatorParamsSchema = z
  .strictObject({
    seed: z.number().int().min(0).default(1),
    /** crew per position (award group) */
    crew: z.number().int().min(1).max(5000).default(30),
    /** how many pairings; when absent, enough to reach `tightness` */
    pairings: z.number().int().min(1).max(20000).optional(),
    /**
     * Trip credit ÷ crew capacity per position, where capacity is each crew
     * member's `lineCapacityMinutes` scaled by the days they are not on leave.
     * Steers the pairing count when `pairings` is absent; always reported.
     */
    tightness: z.number().gt(0).max(2).default(0.9),
    lineCapacityMinutes: z.number().int().min(600).default(85 * 60),
    /** first day of the period, base local; default the month holding a DST change */
    startDate: localDateSchema.default("2027-03-01"),
    days: z.number().int().min(7).max(62).default(31),
    positions: z.array(positionSchema).min(1).default(["captain", "first_officer"]),
    base: z.string().default("HLV"),
    periodId: z.string().optional(),
  })
  .refine((p) => new Set(p.positions).size === p.positions.length, { message: "a position is named twice", path: ["positions"] });

export type GeneratorParams = z.infer<typeof generatorParamsSchema>;
export type GeneratorInput = z.input<typeof generatorParamsSchema>;

/** Crew needed per pairing, by position (common practice for a 120–150-seat jet). */
export const CREW_PER_PAIRING = { captain: 1, first_officer: 1, purser: 1, flight_attendant: 3 } as const;
