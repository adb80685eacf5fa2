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
 *   become the file's;
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
import { addDays, startOfLocalDay, toInstant } from "../domain/index";

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

/** What an import did. */
export interface CsvImportResult {
  trips?: Counts;
  crew?: Counts;
  /** crew members whose activities in this period were replaced / left as they were */
  activities?: { replaced: number; unchanged: number; rows: number };
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
    throw new AppError("invalid", "trips.csv and legs.csv are imported together: a trip's legs are in legs.csv");
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
  let crewFiles: ReturnType<typeof readCrewFiles> | undefined;
  if (files.crew !== undefined || files.activities !== undefined) {
    const rows = await db().crewMember.findMany({ select: { employeeNumber: true, seniority: true, base: { select: { stationCode: true } } } });
    const known = new Map(rows.map((r) => [r.employeeNumber, { seniority: r.seniority, baseCode: r.base.stationCode }]));
    crewFiles = readCrewFiles(files.crew, files.activities, {
      baseCode,
      periodStart: startOfLocalDay(startDate, period.zone),
      periodEnd: startOfLocalDay(addDays(endDate, 1), period.zone),
      known,
    });
    problems.push(...crewFiles.problems);
  }
  if (problems.length > 0) refuse(problems);

  return db().$transaction(
    async (tx) => {
      await tx.$queryRaw`SELECT id FROM "BidPeriod" WHERE id = ${periodId} FOR UPDATE`;
      draftOnly(await tx.bidPeriod.findUniqueOrThrow({ where: { id: periodId }, select: { name: true, state: true } }));
      const result: CsvImportResult = { groupsAdded: [], changed: false, message: "" };
      if (pairings) result.trips = await writeTrips(tx, periodId, baseCode, pairings);
      const ids = new Map<string, string>();
      if (crewFiles?.crew) result.crew = await writeCrew(tx, period.base.id, crewFiles.crew, ids);
      if (crewFiles?.activities) {
        const named = new Set([...crewFiles.activities.keys(), ...(crewFiles.crew ?? []).map((c) => c.employeeNumber)]);
        result.activities = await writeActivities(tx, named, crewFiles.activities, startOfLocalDay(startDate, period.zone), startOfLocalDay(addDays(endDate, 1), period.zone));
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

async function writeCrew(tx: DbTx, baseId: string, crew: CrewFileMember[], ids: Map<string, string>): Promise<Counts> {
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
    ids.set(c.employeeNumber, row.id);
    const same = row.name === c.name && row.seniority === c.seniority && row.position === c.position && canonicalJson(row.qualifications) === canonicalJson(c.qualifications);
    if (same) counts.unchanged += 1;
    else updates.push({ id: row.id, c });
  }
  // Seniority is unique: park the renumbered crew on free negative numbers first, so a swap never collides.
  const renumbered = updates.filter(({ c }) => byNumber.get(c.employeeNumber)!.seniority !== c.seniority);
  for (const [k, { id }] of renumbered.entries()) await tx.crewMember.update({ where: { id }, data: { seniority: -(k + 1) } });
  for (const { id, c } of updates) {
    await tx.crewMember.update({ where: { id }, data: { name: c.name, seniority: c.seniority, position: c.position, qualifications: c.qualifications } });
    counts.changed += 1;
  }
  for (const c of creates) {
    const id = randomUUID();
    ids.set(c.employeeNumber, id);
    await tx.crewMember.create({ data: { id, employeeNumber: c.employeeNumber, name: c.name, seniority: c.seniority, baseId, position: c.position, qualifications: c.qualifications } });
    counts.added += 1;
  }
  return counts;
}

async function writeActivities(
  tx: DbTx,
  named: Set<string>,
  activities: Map<string, FixedActivity[]>,
  periodStart: string,
  periodEnd: string,
): Promise<{ replaced: number; unchanged: number; rows: number }> {
  const crew = await tx.crewMember.findMany({ where: { employeeNumber: { in: [...named] } }, select: { id: true, employeeNumber: true } });
  const touching = { startsAt: { lt: new Date(periodEnd) }, endsAt: { gt: new Date(periodStart) } };
  const rows = await tx.fixedActivity.findMany({ where: { crewMemberId: { in: crew.map((c) => c.id) }, ...touching }, orderBy: [{ startsAt: "asc" }, { kind: "asc" }] });
  const key = (list: FixedActivity[]) => canonicalJson([...list].sort((a, b) => a.start.localeCompare(b.start) || a.kind.localeCompare(b.kind) || (a.label ?? "").localeCompare(b.label ?? "")));
  let replaced = 0;
  let unchanged = 0;
  let written = 0;
  const inserts: Array<{ id: string; crewMemberId: string; kind: FixedActivity["kind"]; startsAt: Date; endsAt: Date; label: string }> = [];
  const clear: string[] = [];
  for (const c of crew) {
    const now = rows
      .filter((r) => r.crewMemberId === c.id)
      .map((r) => ({ kind: r.kind, start: toInstant(r.startsAt), end: toInstant(r.endsAt), ...(r.label ? { label: r.label } : {}) }));
    const wanted = activities.get(c.employeeNumber) ?? [];
    if (key(now as FixedActivity[]) === key(wanted)) {
      unchanged += 1;
      continue;
    }
    replaced += 1;
    clear.push(c.id);
    for (const a of wanted) inserts.push({ id: randomUUID(), crewMemberId: c.id, kind: a.kind, startsAt: new Date(a.start), endsAt: new Date(a.end), label: a.label ?? "" });
    written += wanted.length;
  }
  if (clear.length > 0) await tx.fixedActivity.deleteMany({ where: { crewMemberId: { in: clear }, ...touching } });
  await bulkInsert(tx, "FixedActivity", activityColumns, inserts);
  return { replaced, unchanged, rows: written };
}

function summary(r: CsvImportResult): string {
  if (!r.changed) return "Nothing changed: the files match what the period holds already.";
  const parts: string[] = [];
  const counts = (c: Counts) =>
    [c.added && `${c.added} added`, c.changed && `${c.changed} changed`, c.removed && `${c.removed} removed`, c.unchanged && `${c.unchanged} unchanged`].filter(Boolean).join(", ");
  if (r.trips) parts.push(`trips: ${counts(r.trips)}`);
  if (r.crew) parts.push(`crew: ${counts(r.crew)}`);
  if (r.activities) parts.push(`activities: replaced for ${r.activities.replaced} crew (${r.activities.rows} rows), ${r.activities.unchanged} unchanged`);
  if (r.groupsAdded.length > 0) parts.push(`new award groups: ${r.groupsAdded.join(", ")}`);
  return `Imported. ${parts.join("; ")}.`;
}
