import { z } from "zod";
import { positionSchema } from "./position.ts";
import { stationCodeSchema } from "./station.ts";

/** An award group: one base × one position, awarded as one independent problem. */
export const awardGroupSchema = z
  .strictObject({ base: stationCodeSchema, position: positionSchema })
  .meta({ id: "AwardGroup", title: "Award group" });

/** An award group. */
export type AwardGroup = z.infer<typeof awardGroupSchema>;

/** A stable key for an award group, such as "HVN/captain". */
export function awardGroupKey(group: AwardGroup): string {
  return `${group.base}/${group.position}`;
}
