/** A pairing's database rows (duty periods and legs included) in lib/domain's shape. */
import type { Prisma } from "./generated/client";
import { toInstant } from "../domain/index";

export const pairingInclude = {
  dutyPeriods: { include: { legs: true } },
} satisfies Prisma.PairingInclude;

export type PairingRow = Prisma.PairingGetPayload<{ include: typeof pairingInclude }>;

/**
 * The pairing as lib/domain describes it (not yet parsed: callers parse with
 * pairingSchema where a bad row must be named). Duty periods and legs must
 * already be in `seq` order.
 */
export function pairingFromRow(row: PairingRow, base: string) {
  return {
    id: row.code,
    base,
    dutyPeriods: row.dutyPeriods.map((duty) => ({
      report: toInstant(duty.reportAt),
      release: toInstant(duty.releaseAt),
      legs: duty.legs.map((leg) => ({
        flightNumber: leg.flightNumber,
        from: leg.fromCode,
        to: leg.toCode,
        departure: toInstant(leg.departsAt),
        arrival: toInstant(leg.arrivesAt),
        deadhead: leg.deadhead,
        blockMinutes: leg.blockMinutes,
        ...(leg.equipment === null ? {} : { equipment: leg.equipment }),
      })),
    })),
    blockMinutes: row.blockMinutes,
    creditMinutes: row.creditMinutes,
    tafbMinutes: row.tafbMinutes,
    crewNeeded: row.crewNeeded,
    requires: row.requires,
  };
}
