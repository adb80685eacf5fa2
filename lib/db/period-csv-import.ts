/**
 * CSV import into a draft bid period (docs/csv-format.md): trips.csv with
 * legs.csv, and crew.csv and/or activities.csv. Every file is read and
 * checked first (lib/imports); any problem refuses the whole import, naming
 * each bad row's file, line and column, and nothing is written. Otherwise
 * everything is written in one transaction.
 *
 * The files describe the period as it should be, so importing the same files
 * again changes nothing (and says so):
 * - trips: the period's trips become the file's; a trip whose every field is
 *   unchanged keeps its row, a changed one is rewritten, one missing from the
 *   file is removed;
 * - crew are the carrier's, kept across periods: a new employee number is
 *   added, a known one at this base is updated where its name, seniority,
 *   position or qualifications differ; crew missing from the file are kept
 *   (they may be on leave, not gone);
 * - activities: for each crew member the file names (and, when crew.csv comes
 *   along, each crew member in it) the activities touching this period
 *   become the file's (writeActivities says what happens at the edge of a
 *   period whose bidding is under way);
 * - while another period of the base is between opening and publishing, its
 *   bids and runs use the crew list as it stands: crew changes are refused
 *   until it is published;
 * - the period gains an award group for each position the crew file holds.
 * Imports change a period only while it is a draft: once bidding opens, crew
 * bid on these trips.
 */
import { AppError, canonicalJson, pairingSchema, sha256Text, type FixedActivity, type Pairing, type Position } from "../domain/index";
import { readCrewFiles, type CrewFileMember } from "../imports/crew-files";
import { problemText, type ImportProblem } from "../imports/csv-table";
import { readTripFiles } from "../imports/trip-files";
import { db } from "./client";
import type { DbTx } from "./period-db";
import { ensureGroups } from "./period-create";
import { activityColumns, bulkInsert, dutyPeriodColumns, legColumns } from "./period-import-bulk";
import { pairingRows } from "./period-import-rows";
import { pairingFromRow } from "./pairing-rows";
import { randomUUID } from "node:crypto";
import { addDays, overlaps, startOfLocalDay, toInstant } from "../domain/index";
import { Prisma } from "./generated/client";
import { CREW_LIST_LOCK } from "./locks";

/** The uploaded files' texts; any may be absent. */
export interface CsvFiles {
  trips?: string;
  legs?: string;
  crew?: string;
  activities?: string;
}

export interface Counts {
  added: number;
  changed: number;
  removed: number;
  unchanged: number;
}

export interface ActivityCounts {
  replaced: number;
  unchanged: number;
  rows: number;
  kept: number;
  /** the periods under way the kept activities fall in, e.g. "January 2027 (open for bidding)" */
  keptIn: string[];
}

/** What an import did. */
export interface CsvImportResult {
  trips?: Counts;
  crew?: Counts;
  /** crew members whose activities in this period changed / did not; rows written; activities the file lacks but left alone because they reach into a period under way */
  activities?: ActivityCounts;
  groupsAdded: Position[];
  changed: boolean;
  message: string;
}

const pairingOrder = { dutyPeriods: { orderBy: { seq: "asc" as const }, include: { legs: { orderBy: { seq: "asc" as const } } } } };

/** The refusal of an import with problems: AppError("invalid") listing them (the first 200 in the message's details). */
function refuse(problems: ImportProblem[]): never {
  const shown = problems.slice(0, 200);
  throw new AppError(
    "invalid",
    problems.length === 1
      ? `1 problem in the files; nothing was imported. ${problemText(problems[0]!)}`
      : `${problems.length} problems in the files; nothing was imported. The first: ${problemText(problems[0]!)}`,
    { problems: shown, total: problems.length },
  );
}

/** Imports `files` into the draft period `periodId`; see the module comment. */
export async function importCsvFiles(periodId: string, actorUserId: string, files: CsvFiles): Promise<CsvImportResult> {
  const given = (Object.keys(files) as Array<keyof CsvFiles>).filter((k) => files[k] !== undefined);
  if (given.length === 0) throw new AppError("invalid", "choose at least one file to import");
  if ((files.trips === undefined) !== (files.legs === undefined)) {
    throw new AppError("invalid", "import trips.csv and legs.csv together: a trip's legs are in legs.csv");
  }
  const period = await db().bidPeriod.findUnique({ where: { id: periodId }, include: { base: { select: { id: true, stationCode: true } } } });
  if (!period) throw new AppError("not_found", "no such bid period");
  draftOnly(period);
  const baseCode = period.base.stationCode;
  const startDate = period.startDate.toISOString().slice(0, 10);
  const endDate = period.endDate.toISOString().slice(0, 10);
  const problems: ImportProblem[] = [];

  let pairings: Pairing[] | undefined;
  if (files.trips !== undefined && files.legs !== undefined) {
    const stations = new Set((await db().station.findMany({ select: { code: true } })).map((s) => s.code));
    const read = readTripFiles(files.trips, files.legs, { baseCode, zone: period.zone, startDate, endDate, stations });
    problems.push(...read.problems);
    pairings = read.pairings;
  }
  const periodStart = startOfLocalDay(startDate, period.zone);
  const periodEnd = startOfLocalDay(addDays(endDate, 1), period.zone);
  const readCrew = async (client: DbTx | ReturnType<typeof db>) => {
    if (files.crew === undefined && files.activities === undefined) return undefined;
    const rows = await client.crewMember.findMany({ select: { employeeNumber: true, seniority: true, base: { select: { stationCode: true } } } });
    const known = new Map(rows.map((r) => [r.employeeNumber, { seniority: r.seniority, baseCode: r.base.stationCode }]));
    return readCrewFiles(files.crew, files.activities, { baseCode, periodStart, periodEnd, known });
  };
  // Checked first without locks, so bad files are refused at once with every problem…
  const precheck = await readCrew(db());
  problems.push(...(precheck?.problems ?? []));
  if (problems.length > 0) refuse(problems);

  try {
    return await db().$transaction(
      async (tx) => {
        // …then again under the carrier's crew lock: employee and seniority numbers are the carrier's, so two
        // imports into two periods must not both pass the check against the same crew list.
        await tx.$executeRawUnsafe(`SELECT pg_advisory_xact_lock(${CREW_LIST_LOCK})`);
        await tx.$queryRaw`SELECT id FROM "BidPeriod" WHERE id = ${periodId} FOR UPDATE`;
        draftOnly(await tx.bidPeriod.findUniqueOrThrow({ where: { id: periodId }, select: { name: true, state: true } }));
        const crewFiles = await readCrew(tx);
        if (crewFiles && crewFiles.problems.length > 0) refuse(crewFiles.problems);
        const active = await activePeriods(tx, period.base.id, periodId);
        const result: CsvImportResult = { groupsAdded: [], changed: false, message: "" };
        if (pairings) result.trips = await writeTrips(tx, periodId, baseCode, pairings);
        if (crewFiles?.crew) result.crew = await writeCrew(tx, period.base.id, crewFiles.crew, active);
        if (crewFiles?.activities) {
          const named = new Set([...crewFiles.activities.keys(), ...(crewFiles.crew ?? []).map((c) => c.employeeNumber)]);
          result.activities = await writeActivities(tx, named, crewFiles.activities, periodStart, periodEnd, active);
        }
        if (crewFiles?.crew) result.groupsAdded = await ensureGroups(tx, periodId, crewFiles.crew.map((c) => c.position));
        const moved = (c?: Counts) => !!c && c.added + c.changed + c.removed > 0;
        result.changed = moved(result.trips) || moved(result.crew) || (result.activities?.replaced ?? 0) > 0 || result.groupsAdded.length > 0;
        result.message = summary(result);
        if (result.changed) {
          const hashes = Object.fromEntries(given.map((k) => [`${k}.csv`, sha256Text(files[k]!)]));
          await tx.auditEvent.create({
            data: { actorUserId, action: "period.imported", entity: "BidPeriod", entityId: periodId, detail: JSON.parse(JSON.stringify({ files: hashes, ...result, message: undefined })) },
          });
        }
        return result;
      },
      { timeout: 120_000, maxWait: 10_000 },
    );
  } catch (error) {
    throw uniqueClash(error);
  }
}


/** Periods of the base, other than `periodId`, whose bidding has opened and whose award is not yet published. */
async function activePeriods(tx: DbTx, baseId: string, periodId: string) {
  const rows = await tx.bidPeriod.findMany({
    where: { baseId, id: { not: periodId }, state: { in: ["open", "closed", "awarded"] } },
    select: { name: true, state: true, startDate: true, endDate: true, zone: true },
  });
  return rows.map((p) => ({
    name: p.name,
    state: p.state,
    start: startOfLocalDay(p.startDate.toISOString().slice(0, 10), p.zone),
    end: startOfLocalDay(addDays(p.endDate.toISOString().slice(0, 10), 1), p.zone),
  }));
}
type Active = Awaited<ReturnType<typeof activePeriods>>;

/** A unique constraint hit by a write that raced another (should the lock ever be bypassed) as a conflict. */
function uniqueClash(error: unknown): unknown {
  if (error instanceof Prisma.PrismaClientKnownRequestError && error.code === "P2002") {
    return new AppError("conflict", "the crew list changed while these files were being imported; nothing was imported: please import them again");
  }
  return error;
}

function draftOnly(period: { name: string; state: string }): void {
  if (period.state !== "draft") {
    throw new AppError("conflict", `imports change a period only while it is a draft, and ${period.name} is ${period.state}: crew bid on its trips as they are`);
  }
}

async function writeTrips(tx: DbTx, periodId: string, baseCode: string, pairings: Pairing[]): Promise<Counts> {
  const existing = await tx.pairing.findMany({ where: { bidPeriodId: periodId }, include: pairingOrder });
  const stored = new Map(existing.map((row) => [row.code, { id: row.id, json: canonicalJson(pairingSchema.parse(pairingFromRow(row, baseCode))) }]));
  const counts: Counts = { added: 0, changed: 0, removed: 0, unchanged: 0 };
  const drop: string[] = [];
  const insert: Pairing[] = [];
  const inFile = new Set<string>();
  for (const p of pairings) {
    inFile.add(p.id);
    const old = stored.get(p.id);
    if (!old) {
      counts.added += 1;
      insert.push(p);
    } else if (old.json !== canonicalJson(p)) {
      counts.changed += 1;
      drop.push(old.id);
      insert.push(p);
    } else counts.unchanged += 1;
  }
  for (const [code, old] of stored) {
    if (!inFile.has(code)) {
      counts.removed += 1;
      drop.push(old.id);
    }
  }
  if (drop.length > 0) await tx.pairing.deleteMany({ where: { id: { in: drop } } });
  const rows = insert.map((p) => pairingRows(p, periodId));
  if (rows.length > 0) {
    await tx.pairing.createMany({ data: rows.map((r) => r.pairing) });
    await bulkInsert(tx, "DutyPeriod", dutyPeriodColumns, rows.flatMap((r) => r.dutyPeriods));
    await bulkInsert(tx, "Leg", legColumns, rows.flatMap((r) => r.legs));
  }
  return counts;
}

const STATE_WORDS: Record<string, string> = { open: "open for bidding", closed: "bidding closed", awarded: "awarded, not yet published" };

/** "January 2027 (open for bidding)" and "February 2027 (bidding closed)". */
const activeNames = (periods: Active) => periods.map((p) => `${p.name} (${STATE_WORDS[p.state] ?? p.state})`).join(" and ");

async function writeCrew(tx: DbTx, baseId: string, crew: CrewFileMember[], active: Active): Promise<Counts> {
  const existing = await tx.crewMember.findMany({ where: { employeeNumber: { in: crew.map((c) => c.employeeNumber) } } });
  const byNumber = new Map(existing.map((r) => [r.employeeNumber, r]));
  const counts: Counts = { added: 0, changed: 0, removed: 0, unchanged: 0 };
  const updates: Array<{ id: string; c: CrewFileMember }> = [];
  const creates: CrewFileMember[] = [];
  for (const c of crew) {
    const row = byNumber.get(c.employeeNumber);
    if (!row) {
      creates.push(c);
      continue;
    }
    const same = row.name === c.name && row.seniority === c.seniority && row.position === c.position && canonicalJson(row.qualifications) === canonicalJson(c.qualifications);
    if (same) counts.unchanged += 1;
    else updates.push({ id: row.id, c });
  }
  // The base's crew list is read live by every period's export: while another period's bidding is under way,
  // changing it would change the crew its bids and runs were made with.
  if (active.length > 0 && updates.length + creates.length > 0) {
    const who = [...updates.map((u) => u.c), ...creates].slice(0, 5).map((c) => `employee ${c.employeeNumber} (line ${c.line})`);
    throw new AppError(
      "conflict",
      `the crew list in crew.csv differs (${who.join(", ")}${updates.length + creates.length > 5 ? " …" : ""}) while ${activeNames(active)} at this base is not yet published, and its bids and runs use the crew as they are: import crew changes once it is published. Nothing was imported`,
    );
  }
  // Seniority is unique: park the renumbered crew on free negative numbers first, so a swap never collides.
  const renumbered = updates.filter(({ c }) => byNumber.get(c.employeeNumber)!.seniority !== c.seniority);
  for (const [k, { id }] of renumbered.entries()) await tx.crewMember.update({ where: { id }, data: { seniority: -(k + 1) } });
  for (const { id, c } of updates) {
    await tx.crewMember.update({ where: { id }, data: { name: c.name, seniority: c.seniority, position: c.position, qualifications: c.qualifications } });
    counts.changed += 1;
  }
  for (const c of creates) {
    await tx.crewMember.create({ data: { id: randomUUID(), employeeNumber: c.employeeNumber, name: c.name, seniority: c.seniority, baseId, position: c.position, qualifications: c.qualifications } });
    counts.added += 1;
  }
  return counts;
}

/**
 * Each named crew member's activities touching the period become the file's: what the file lacks is removed,
 * what it adds is written, what is in both stays as it is. An activity that reaches into a period whose bidding
 * is under way is left alone when the file lacks it (it belongs to that period too), and refused when the file
 * adds it (it would change that period).
 */
async function writeActivities(
  tx: DbTx,
  named: Set<string>,
  activities: Map<string, FixedActivity[]>,
  periodStart: string,
  periodEnd: string,
  active: Active,
): Promise<ActivityCounts> {
  const crew = await tx.crewMember.findMany({ where: { employeeNumber: { in: [...named] } }, select: { id: true, employeeNumber: true } });
  const touching = { startsAt: { lt: new Date(periodEnd) }, endsAt: { gt: new Date(periodStart) } };
  const rows = await tx.fixedActivity.findMany({ where: { crewMemberId: { in: crew.map((c) => c.id) }, ...touching } });
  const counts: ActivityCounts = { replaced: 0, unchanged: 0, rows: 0, kept: 0, keptIn: [] };
  const inserts: Array<{ id: string; crewMemberId: string; kind: FixedActivity["kind"]; startsAt: Date; endsAt: Date; label: string }> = [];
  const removals: string[] = [];
  const reaches = (a: { start: string; end: string }) => active.find((p) => overlaps(a.start, a.end, p.start, p.end));
  for (const c of crew) {
    const now = rows
      .filter((r) => r.crewMemberId === c.id)
      .map((r) => ({ id: r.id, activity: { kind: r.kind, start: toInstant(r.startsAt), end: toInstant(r.endsAt), ...(r.label ? { label: r.label } : {}) } as FixedActivity }));
    const wanted = activities.get(c.employeeNumber) ?? [];
    const have = new Set(now.map((n) => canonicalJson(n.activity)));
    const want = new Set(wanted.map((a) => canonicalJson(a)));
    const added = wanted.filter((a, k) => !have.has(canonicalJson(a)) && wanted.findIndex((b) => canonicalJson(b) === canonicalJson(a)) === k);
    const gone = now.filter((n) => !want.has(canonicalJson(n.activity)));
    for (const a of added) {
      const hit = reaches(a);
      if (hit) {
        throw new AppError(
          "conflict",
          `the activities file adds employee ${c.employeeNumber}'s ${a.kind} from ${a.start} to ${a.end}, which reaches into ${hit.name} (${STATE_WORDS[hit.state] ?? hit.state}): that period's bids and runs use the activities as they are; nothing was imported`,
        );
      }
    }
    const kept = gone.filter((n) => reaches(n.activity));
    const removed = gone.filter((n) => !reaches(n.activity));
    counts.kept += kept.length;
    for (const n of kept) {
      const p = reaches(n.activity)!;
      const label = `${p.name} (${STATE_WORDS[p.state] ?? p.state})`;
      if (!counts.keptIn.includes(label)) counts.keptIn.push(label);
    }
    if (added.length === 0 && removed.length === 0) {
      counts.unchanged += 1;
      continue;
    }
    counts.replaced += 1;
    removals.push(...removed.map((n) => n.id));
    for (const a of added) inserts.push({ id: randomUUID(), crewMemberId: c.id, kind: a.kind, startsAt: new Date(a.start), endsAt: new Date(a.end), label: a.label ?? "" });
    counts.rows += added.length;
  }
  if (removals.length > 0) await tx.fixedActivity.deleteMany({ where: { id: { in: removals } } });
  await bulkInsert(tx, "FixedActivity", activityColumns, inserts);
  return counts;
}

function summary(r: CsvImportResult): string {
  if (!r.changed) return "Nothing changed: the files match what the period holds already.";
  const parts: string[] = [];
  const counts = (c: Counts) =>
    [c.added && `${c.added} added`, c.changed && `${c.changed} changed`, c.removed && `${c.removed} removed`, c.unchanged && `${c.unchanged} unchanged`].filter(Boolean).join(", ");
  if (r.trips) parts.push(`trips: ${counts(r.trips)}`);
  if (r.crew) parts.push(`crew: ${counts(r.crew)}`);
  if (r.activities) {
    const kept = r.activities.kept
      ? `; ${r.activities.kept} ${r.activities.kept === 1 ? "activity" : "activities"} not in the file kept, as they also fall in ${r.activities.keptIn.join(" and ")}`
      : "";
    parts.push(`activities: ${r.activities.rows} written for ${r.activities.replaced} crew, ${r.activities.unchanged} crew unchanged${kept}`);
  }
  if (r.groupsAdded.length > 0) parts.push(`new award groups: ${r.groupsAdded.join(", ")}`);
  return `Imported. ${parts.join("; ")}.`;
}
