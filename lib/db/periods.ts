/** Bid periods and their trips, as the crew and planning pages read them. */
import { db } from "./client";
import type { BidPeriodState } from "./generated/enums";
import type { SessionUser } from "./users";
import { pairingSchema, tripSummary, type TripSummary } from "../domain/index";
import { pairingFromRow } from "./pairing-rows";

export type { TripSummary } from "../domain/index";

export interface OpenPeriodView {
  id: string;
  name: string;
  baseCode: string;
  baseName: string;
  zone: string;
  startDate: string;
  endDate: string;
  deadline: string;
  trips: TripSummary[];
}

const isoDate = (d: Date) => d.toISOString().slice(0, 10);

/**
 * The open bid period of the crew member's base, with the trips that need
 * their position; null when bidding is not open at their base.
 */
export async function openPeriodForCrew(user: SessionUser): Promise<OpenPeriodView | null> {
  if (!user.crewMemberId) return null;
  const crew = await db().crewMember.findUnique({
    where: { id: user.crewMemberId },
    select: { baseId: true, position: true, base: { select: { stationCode: true, name: true } } },
  });
  if (!crew) return null;
  const period = await db().bidPeriod.findFirst({
    where: { baseId: crew.baseId, state: "open" },
    orderBy: { startDate: "asc" },
    include: {
      pairings: {
        orderBy: [{ startsAt: "asc" }, { code: "asc" }],
        include: { dutyPeriods: { orderBy: { seq: "asc" }, include: { legs: { orderBy: { seq: "asc" } } } } },
      },
    },
  });
  if (!period) return null;
  const zone = period.zone;
  const trips = period.pairings
    .map((row) => pairingSchema.parse(pairingFromRow(row, crew.base.stationCode)))
    .filter((p) => (p.crewNeeded[crew.position] ?? 0) > 0)
    .map((p) => tripSummary(p, zone));
  return {
    id: period.id,
    name: period.name,
    baseCode: crew.base.stationCode,
    baseName: crew.base.name,
    zone,
    startDate: isoDate(period.startDate),
    endDate: isoDate(period.endDate),
    deadline: period.deadline.toISOString(),
    trips,
  };
}

export interface PeriodRow {
  id: string;
  name: string;
  baseCode: string;
  startDate: string;
  endDate: string;
  zone: string;
  deadline: string;
  state: BidPeriodState;
  pairings: number;
  crew: number;
  submittedBids: number;
}

/** Every bid period, newest first, with counts for the planning home. */
export async function listPeriods(): Promise<PeriodRow[]> {
  const periods = await db().bidPeriod.findMany({
    orderBy: [{ startDate: "desc" }, { name: "asc" }],
    include: {
      base: { select: { stationCode: true, _count: { select: { crew: true } } } },
      _count: { select: { pairings: true } },
    },
  });
  const submitted = await db().bidSubmission.groupBy({ by: ["bidPeriodId", "crewMemberId"], _count: true });
  return periods.map((p) => ({
    id: p.id,
    name: p.name,
    baseCode: p.base.stationCode,
    startDate: isoDate(p.startDate),
    endDate: isoDate(p.endDate),
    zone: p.zone,
    deadline: p.deadline.toISOString(),
    state: p.state,
    pairings: p._count.pairings,
    crew: p.base._count.crew,
    submittedBids: submitted.filter((s) => s.bidPeriodId === p.id).length,
  }));
}
