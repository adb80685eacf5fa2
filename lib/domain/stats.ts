import { z } from "zod";

/**
 * Run statistics, kept apart from the award because they differ from run to run
 * (times) while the award must not. `times` are milliseconds per phase,
 * `columns` the lines generated, `rounds` the column-generation rounds, `gap`
 * the relative gap to the LP bound, `stoppedBy` which limit ended the run.
 */
export const statsSchema = z
  .strictObject({
    times: z.record(z.string().min(1), z.number().min(0)),
    columns: z.number().int().min(0),
    rounds: z.number().int().min(0),
    gap: z.number().min(0).optional(),
    lpBound: z.number().optional(),
    objective: z.number().optional(),
    stoppedBy: z.enum(["optimal", "time-limit", "iteration-limit", "cancelled"]).optional(),
  })
  .meta({ title: "Award run statistics" });

/** Run statistics. */
export type Stats = z.infer<typeof statsSchema>;
