/**
 * Turns a bid period's rows into a bundle candidate (not yet parsed), one
 * instance per award group, and keeps beside it which row each part came
 * from, so a row that breaks the schema can be named.
 *
 * Every list has a stable order that depends on the data only, never on the
 * database's row order or its text collation (strings compare by UTF-16 code
 * units, as canonical JSON does): instances by position (captain, first officer,
 * flight attendant, purser), stations by code, pairings by first report then
 * trip number, duty periods and legs by their sequence numbers, crew by
 * seniority, activities and carry-in by start, look-back duties by report,
 * daily totals by date.
 */
import { pairingFromRow } from "./pairing-rows";
import { AppError, awardGroupKey, crewNeededSchema, positions, schemaVersion, toInstant, type Position } from "../domain/index";
import { dateText, referencedStations, type CrewRow, type PairingRow, type PeriodRow, type PeriodRows, type SubmissionRow } from "./period-export-rows";

type Key = ReadonlyArray<string | number>;

function compareKeys(a: Key, b: Key): number {
  for (let i = 0; i < Math.min(a.length, b.length); i++) {
    const x = a[i]!;
    const y = b[i]!;
    if (x < y) return -1;
    if (x > y) return 1;
  }
  return a.length - b.length;
}

/** A sorted copy of `items` by `key` (a tuple compared element by element). */
export function sortedBy<T>(items: readonly T[], key: (item: T) => Key): T[] {
  return items
    .map((item) => ({ item, key: key(item) }))
    .sort((a, b) => compareKeys(a.key, b.key))
    .map((entry) => entry.item);
}

const ms = (date: Date) => date.getTime();

/** The rows behind one instance, in the instance's order. */
export interface InstanceSources {
  group: PeriodRow["groups"][number];
  pairings: PairingRow[];
  crew: CrewRow[];
  /** by employee number */
  submissions: Map<string, SubmissionRow>;
  stations: string[];
}

/** The rows behind a bundle, in the bundle's order. */
export interface ExportSources {
  period: PeriodRow;
  instances: InstanceSources[];
}

function sortPairing(row: PairingRow): PairingRow {
  const dutyPeriods = sortedBy(row.dutyPeriods, (duty) => [duty.seq]).map((duty) => ({
    ...duty,
    legs: sortedBy(duty.legs, (leg) => [leg.seq]),
  }));
  return { ...row, dutyPeriods };
}

function sortCrew(row: CrewRow): CrewRow {
  return {
    ...row,
    activities: sortedBy(row.activities, (a) => [ms(a.startsAt), ms(a.endsAt), a.kind, a.label, a.id]),
    carryIn: sortedBy(row.carryIn, (t) => [ms(t.startsAt), ms(t.endsAt), t.pairingCode, t.id]),
    pastDuties: sortedBy(row.pastDuties, (d) => [ms(d.reportAt), ms(d.releaseAt), d.flightMinutes, d.segments, d.endStation ?? "", d.id]),
    dailyFlight: sortedBy(row.dailyFlight, (d) => [ms(d.date)]),
  };
}

/** Whether a pairing needs crew of `position`; a crewNeeded column the schema refuses is named here. */
function needs(row: PairingRow, position: Position): boolean {
  const parsed = crewNeededSchema.safeParse(row.crewNeeded);
  if (!parsed.success) {
    throw new AppError(
      "invalid",
      `Pairing ${row.code} (row ${row.id}) cannot be exported: its crewNeeded ${JSON.stringify(row.crewNeeded)} is not valid`,
    );
  }
  return (parsed.data[position] ?? 0) > 0;
}

function crewOut(row: CrewRow, base: string) {
  return {
    id: row.employeeNumber,
    name: row.name,
    seniority: row.seniority,
    base,
    position: row.position,
    qualifications: row.qualifications,
    // The label column cannot be null: an empty label is an activity without one.
    fixedActivities: row.activities.map((a) => ({
      kind: a.kind,
      start: toInstant(a.startsAt),
      end: toInstant(a.endsAt),
      ...(a.label === "" ? {} : { label: a.label }),
    })),
    carryIn: row.carryIn.map((trip) => ({ pairingId: trip.pairingCode, dutyPeriods: trip.dutyPeriods })),
    lookBack: {
      duties: row.pastDuties.map((d) => ({
        report: toInstant(d.reportAt),
        release: toInstant(d.releaseAt),
        flightMinutes: d.flightMinutes,
        segments: d.segments,
        ...(d.endStation === null ? {} : { endStation: d.endStation }),
      })),
      dailyFlightMinutes: row.dailyFlight.map((d) => ({ date: dateText(d.date), minutes: d.minutes })),
    },
    carriedWeight: row.carriedWeight,
  };
}

/** The stations an instance refers to: its base, its pairings' legs, its crew's carry-in and look-back. */
function instanceStations(base: string, pairings: PairingRow[], crew: CrewRow[], known: Set<string>): string[] {
  const codes = new Set<string>([base]);
  for (const leg of pairings.flatMap((p) => p.dutyPeriods.flatMap((d) => d.legs))) codes.add(leg.fromCode).add(leg.toCode);
  for (const member of crew) for (const code of referencedStations(member)) codes.add(code);
  // A carry-in leg may name a station the carrier's table lacks (its JSON has no foreign key); leave it out.
  return sortedBy([...codes].filter((code) => code === base || known.has(code)), (code) => [code]);
}

/** The bundle candidate of a period's rows, and the rows behind each of its parts. */
export function assembleBundle(rows: PeriodRows): { candidate: unknown; sources: ExportSources } {
  const { period } = rows;
  const base = period.base.stationCode;
  const periodOut = {
    id: period.id,
    name: period.name,
    startDate: dateText(period.startDate),
    endDate: dateText(period.endDate),
    zone: period.zone,
  };
  const stationByCode = new Map(rows.stations.map((s) => [s.code, s]));
  const known = new Set(stationByCode.keys());
  const pairings = sortedBy(rows.pairings.map(sortPairing), (p) => [ms(p.dutyPeriods[0]?.reportAt ?? p.startsAt), p.code]);
  const crew = sortedBy(rows.crew.map(sortCrew), (c) => [c.seniority, c.employeeNumber]);
  const submissionOf = new Map(rows.latestSubmissions.map((s) => [s.crewMemberId, s]));
  const groups = sortedBy(period.groups, (g) => [positions.indexOf(g.position)]);

  const sources: ExportSources = { period, instances: [] };
  const instances = groups.map((group) => {
    const groupPairings = pairings.filter((p) => needs(p, group.position));
    const groupCrew = crew.filter((c) => c.position === group.position);
    const submissions = new Map<string, SubmissionRow>();
    const bids: Record<string, unknown> = {};
    for (const member of groupCrew) {
      const submission = submissionOf.get(member.id);
      if (!submission) continue;
      submissions.set(member.employeeNumber, submission);
      bids[member.employeeNumber] = submission.wishes;
    }
    const stations = instanceStations(base, groupPairings, groupCrew, known);
    sources.instances.push({ group, pairings: groupPairings, crew: groupCrew, submissions, stations });
    return {
      schemaVersion,
      period: periodOut,
      group: { base, position: group.position },
      stations: stations.map((code) => {
        const s = stationByCode.get(code);
        return s ? { code: s.code, name: s.name, zone: s.zone, longitude: s.longitude } : { code };
      }),
      pairings: groupPairings.map((p) => pairingFromRow(p, base)),
      crew: groupCrew.map((c) => crewOut(c, base)),
      bids,
      ruleSet: group.ruleSet.document,
      settings: group.settings,
    };
  });
  return { candidate: { schemaVersion, period: periodOut, instances }, sources };
}

/** "HVN/captain", for messages. */
export function groupLabel(base: string, position: Position): string {
  return awardGroupKey({ base, position });
}
