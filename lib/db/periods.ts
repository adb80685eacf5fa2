/** Bid periods and their trips, as the crew and planning pages read them. */
import { db } from "./client";
import type { BidPeriodState } from "./generated/enums";
import type { SessionUser } from "./users";
import { layoverStations, pairingSchema, tripFacts } from "../domain/index";
import { pairingFromRow } from "./pairing-rows";

export interface TripSummary {
  code: string;
  /** base-local dates of the first report and the last release */
  startDate: string;
  endDate: string;
  days: number;
  layovers: string[];
  creditMinutes: number;
  blockMinutes: number;
  /** base-local clock times */
  report: string;
  release: string;
  legs: number;
  deadheads: number;
  redEye: boolean;
  /** base-local dates touched, first report to last release */
  dates: string[];
  /** ISO days of the week touched, 1 = Monday */
  daysOfWeek: number[];
  dutyPeriods: number;
  creditPerDutyDayMinutes: number;
  tafbMinutes: number;
}

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
    .map((p): TripSummary => {
      const facts = tripFacts(p, zone);
      const legs = p.dutyPeriods.flatMap((d) => d.legs);
      return {
        code: p.id,
        startDate: facts.dates[0]!,
        endDate: facts.dates[facts.dates.length - 1]!,
        days: facts.dates.length,
        layovers: layoverStations(p),
        creditMinutes: p.creditMinutes,
        blockMinutes: p.blockMinutes,
        report: facts.reportTime,
        release: facts.releaseTime,
        legs: legs.length,
        deadheads: legs.filter((l) => l.deadhead).length,
        redEye: facts.redEye,
        dates: [...facts.dates],
        daysOfWeek: [...facts.daysOfWeek].sort(),
        dutyPeriods: p.dutyPeriods.length,
        creditPerDutyDayMinutes: Math.round(facts.creditPerDutyDay),
        tafbMinutes: p.tafbMinutes,
      };
    });
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
