/**
 * The database rows a bid period's export reads, fetched in one repeatable-read
 * transaction so that every query sees the same snapshot (a bid submitted
 * halfway through an export is either wholly in it or wholly out).
 */
import { pairingInclude, type PairingRow } from "./pairing-rows";
import { AppError } from "../domain/index";
import type {
  BidSubmission,
  CarryInTrip,
  CrewMember,
  DailyFlightTotal,
  FixedActivity,
  PastDuty,
  Prisma,
  Station,
} from "./generated/client";
import type { Db, DbTx } from "./period-db";
import { periodWindows, type PeriodWindows } from "./period-windows";
import { latestEarlierEntries } from "./ledger-rows";

const periodInclude = {
  base: true,
  groups: { include: { ruleSet: true } },
} satisfies Prisma.BidPeriodInclude;


/** A bid period row with its base and award groups (each with its rule set). */
export type PeriodRow = Prisma.BidPeriodGetPayload<{ include: typeof periodInclude }>;
/** A crew member row with the children that fall in the period's windows. */
export type CrewRow = CrewMember & {
  activities: FixedActivity[];
  carryIn: CarryInTrip[];
  pastDuties: PastDuty[];
  dailyFlight: DailyFlightTotal[];
};
/** A submitted bid version. */
export type SubmissionRow = BidSubmission;
/** A station row. */
export type StationRow = Station;

/** Everything an export reads; the order of each list is not yet the export's order. */
export interface PeriodRows {
  period: PeriodRow;
  pairings: PairingRow[];
  crew: CrewRow[];
  /** the highest revision of each crew member's submitted bid for this period */
  latestSubmissions: SubmissionRow[];
  stations: StationRow[];
}

/** A "YYYY-MM-DD" date as the value of a `@db.Date` column. */
export function dateColumn(date: string): Date {
  return new Date(`${date}T00:00:00Z`);
}

/** A `@db.Date` column's value as "YYYY-MM-DD". */
export function dateText(value: Date): string {
  return value.toISOString().slice(0, 10);
}

/** Reads the rows of bid period `periodId`; AppError("not_found") when there is none. */
export async function loadPeriodRows(prisma: Db, periodId: string): Promise<PeriodRows> {
  return prisma.$transaction(
    async (tx) => {
      const period = await tx.bidPeriod.findUnique({ where: { id: periodId }, include: periodInclude });
      if (!period) throw new AppError("not_found", `there is no bid period "${periodId}"`);
      const windows = periodWindows({
        startDate: dateText(period.startDate),
        endDate: dateText(period.endDate),
        zone: period.zone,
      });
      const positions = period.groups.map((group) => group.position);
      const pairings = await tx.pairing.findMany({ where: { bidPeriodId: period.id }, include: pairingInclude });
      const crew = await loadCrew(tx, { baseId: period.baseId, position: { in: positions } }, windows, period.startDate);
      const submissions = await tx.bidSubmission.findMany({ where: { bidPeriodId: period.id } });
      const latest = new Map<string, SubmissionRow>();
      for (const row of submissions) {
        const seen = latest.get(row.crewMemberId);
        if (!seen || row.revision > seen.revision) latest.set(row.crewMemberId, row);
      }
      const codes = new Set<string>([period.base.stationCode]);
      for (const pairing of pairings) {
        for (const leg of pairing.dutyPeriods.flatMap((duty) => duty.legs)) codes.add(leg.fromCode).add(leg.toCode);
      }
      for (const member of crew) for (const code of referencedStations(member)) codes.add(code);
      const stations = await tx.station.findMany({ where: { code: { in: [...codes] } } });
      return { period, pairings, crew, latestSubmissions: [...latest.values()], stations };
    },
    { isolationLevel: "RepeatableRead", timeout: 60_000, maxWait: 10_000 },
  );
}

function groupBy<T extends { crewMemberId: string }>(rows: T[]): Map<string, T[]> {
  const by = new Map<string, T[]>();
  for (const row of rows) {
    const list = by.get(row.crewMemberId);
    if (list) list.push(row);
    else by.set(row.crewMemberId, [row]);
  }
  return by;
}

/**
 * The crew rows and their children in the period's windows (the predicates of
 * `inWindow`, restated as queries). One query per table, one after another:
 * sibling includes would be sent concurrently on the transaction's single
 * connection, which node-postgres only queues (and warns about).
 */
async function loadCrew(tx: DbTx, where: Prisma.CrewMemberWhereInput, w: PeriodWindows, startDate: Date): Promise<CrewRow[]> {
  const crew = await tx.crewMember.findMany({ where });
  const ids = { crewMemberId: { in: crew.map((member) => member.id) } };
  const start = new Date(w.startMs);
  const activities = groupBy(
    await tx.fixedActivity.findMany({ where: { ...ids, startsAt: { lt: new Date(w.endMs) }, endsAt: { gt: start } } }),
  );
  const carryIn = groupBy(await tx.carryInTrip.findMany({ where: { ...ids, startsAt: { lt: start }, endsAt: { gt: start } } }));
  const pastDuties = groupBy(
    await tx.pastDuty.findMany({ where: { ...ids, reportAt: { lt: start }, releaseAt: { gt: new Date(w.lookBackStartMs) } } }),
  );
  const dailyFlight = groupBy(
    await tx.dailyFlightTotal.findMany({ where: { ...ids, date: { gte: dateColumn(w.dailyFrom), lt: startDate } } }),
  );
  // The fairness ledger's weight from the latest earlier published period overrides the stored one (lib/fairness/ledger.ts).
  const carried = await latestEarlierEntries(tx, crew.map((member) => member.id), startDate);
  return crew.map((member) => ({
    ...member,
    carriedWeight: carried.get(member.id)?.carriedWeight ?? member.carriedWeight,
    activities: activities.get(member.id) ?? [],
    carryIn: carryIn.get(member.id) ?? [],
    pastDuties: pastDuties.get(member.id) ?? [],
    dailyFlight: dailyFlight.get(member.id) ?? [],
  }));
}

/**
 * Station codes a crew member's carry-in and look-back name. Carry-in duty
 * periods are a JSON column; anything that is not shaped like legs is skipped
 * here and reported by the bundle's parse.
 */
export function referencedStations(member: CrewRow): string[] {
  const codes: string[] = [];
  for (const duty of member.pastDuties) if (duty.endStation) codes.push(duty.endStation);
  for (const trip of member.carryIn) {
    if (!Array.isArray(trip.dutyPeriods)) continue;
    for (const duty of trip.dutyPeriods) {
      const legs = (duty as { legs?: unknown } | null)?.legs;
      if (!Array.isArray(legs)) continue;
      for (const leg of legs as Array<{ from?: unknown; to?: unknown } | null>) {
        if (typeof leg?.from === "string") codes.push(leg.from);
        if (typeof leg?.to === "string") codes.push(leg.to);
      }
    }
  }
  return codes;
}

export type { PairingRow };
