/** One trip of the open period, as its page shows it. */
import { db } from "./client";
import type { SessionUser } from "./users";
import { bidScope } from "./bid-scope";
import { pairingFromRow } from "./pairing-rows";
import { AppError, layoverStations, minutesBetween, pairingSchema, tripFacts, type Pairing } from "../domain/index";

export interface TripDetail {
  pairing: Pairing;
  periodName: string;
  periodStart: string;
  periodEnd: string;
  zone: string;
  baseCode: string;
  /** IANA zone of every station the trip touches */
  zones: Record<string, string>;
  dates: string[];
  redEye: boolean;
  /** rest between duty periods: where, and minutes from release to the next report */
  layovers: { station: string; minutes: number }[];
  /** how many wishes of the user's draft already name this trip */
  inBid: boolean;
  /** whether the period still takes crew edits */
  biddingOpen: boolean;
}

/** Trip `code` of the open period at the user's base, if their position flies it; not_found otherwise. */
export async function tripDetail(user: SessionUser, code: string, now: Date): Promise<TripDetail> {
  const scope = await bidScope(user);
  const crew = await db().crewMember.findUniqueOrThrow({ where: { id: scope.crewMemberId }, select: { base: { select: { stationCode: true } } } });
  const row = await db().pairing.findUnique({
    where: { bidPeriodId_code: { bidPeriodId: scope.period.id, code } },
    include: { dutyPeriods: { orderBy: { seq: "asc" }, include: { legs: { orderBy: { seq: "asc" } } } } },
  });
  const pairing = row ? pairingSchema.parse(pairingFromRow(row, crew.base.stationCode)) : null;
  if (!pairing || (pairing.crewNeeded[scope.position as keyof Pairing["crewNeeded"]] ?? 0) === 0) {
    throw new AppError("not_found", `there is no trip ${code} for your position in ${scope.period.name}`);
  }
  const codes = [...new Set(pairing.dutyPeriods.flatMap((d) => d.legs.flatMap((l) => [l.from, l.to])))];
  const stations = await db().station.findMany({ where: { code: { in: codes } }, select: { code: true, zone: true } });
  const facts = tripFacts(pairing, scope.period.zone);
  const stops = layoverStations(pairing);
  const draft = await db().bid.findUnique({ where: { crewMemberId_bidPeriodId: { crewMemberId: scope.crewMemberId, bidPeriodId: scope.period.id } }, select: { wishes: true } });
  const wishes = Array.isArray(draft?.wishes) ? (draft.wishes as { pairingIds?: string[] }[]) : [];
  return {
    pairing,
    periodName: scope.period.name,
    periodStart: scope.period.startDate,
    periodEnd: scope.period.endDate,
    zone: scope.period.zone,
    baseCode: crew.base.stationCode,
    zones: Object.fromEntries(stations.map((s) => [s.code, s.zone])),
    dates: [...facts.dates],
    redEye: facts.redEye,
    layovers: stops.map((station, k) => ({
      station,
      minutes: Math.round(minutesBetween(pairing.dutyPeriods[k]!.release, pairing.dutyPeriods[k + 1]!.report)),
    })),
    inBid: wishes.some((w) => w.pairingIds?.includes(code)),
    biddingOpen: scope.period.state === "open" && now.getTime() < scope.period.deadline.getTime(),
  };
}
