/**
 * The parts of an import that depend on what the database already holds:
 * conflicts that refuse the bundle, and the rows (base, rule sets) it reuses.
 * All run inside the import's transaction.
 */
import { AppError, canonicalJson, ruleSetSchema, sha256Hex, type RuleSet } from "../domain/index";
import type { Prisma } from "./generated/client";
import type { DbTx } from "./period-db";
import { dateText } from "./period-export-rows";
import type { ImportPlan } from "./period-import-rows";
import { CREW_LIST_LOCK } from "./locks";

async function stationConflicts(tx: DbTx, plan: ImportPlan, problems: string[]): Promise<void> {
  const existing = await tx.station.findMany({ where: { code: { in: plan.stations.map((s) => s.station.code) } } });
  const byCode = new Map(existing.map((row) => [row.code, row]));
  for (const { place, station } of plan.stations) {
    const row = byCode.get(station.code);
    // A different name is cosmetic: the database's name is kept. Zone and longitude change legality.
    if (row && (row.zone !== station.zone || row.longitude !== station.longitude)) {
      problems.push(
        `${place} "${station.code}" is in ${station.zone} at longitude ${station.longitude}, but the database has station ${row.code} in ${row.zone} at longitude ${row.longitude}`,
      );
    }
  }
}

async function periodConflicts(tx: DbTx, plan: ImportPlan, problems: string[]): Promise<void> {
  const { id, startDate, endDate } = plan.period;
  const same = await tx.bidPeriod.findUnique({ where: { id }, select: { name: true } });
  if (same) problems.push(`period.id "${id}": the database already has a bid period with this id ("${same.name}")`);
  // A base's periods do not overlap (as period-create.ts keeps them); the base row is locked by the caller when it exists.
  const clash = await tx.bidPeriod.findFirst({
    where: { base: { stationCode: plan.baseCode }, startDate: { lte: endDate as Date }, endDate: { gte: startDate as Date }, NOT: { id } },
    select: { id: true, name: true, startDate: true, endDate: true },
  });
  if (clash) {
    problems.push(
      `period ${dateText(startDate as Date)} to ${dateText(endDate as Date)}: base ${plan.baseCode} already has a bid period over those days ("${clash.name}", ${dateText(clash.startDate)} to ${dateText(clash.endDate)})`,
    );
  }
}

async function crewConflicts(tx: DbTx, plan: ImportPlan, problems: string[]): Promise<void> {
  const numbers = plan.crew.map((c) => c.row.employeeNumber);
  const seniorities = plan.crew.map((c) => c.row.seniority);
  const rows = await tx.crewMember.findMany({
    where: { OR: [{ employeeNumber: { in: numbers } }, { seniority: { in: seniorities } }] },
    select: { employeeNumber: true, seniority: true, name: true, position: true, base: { select: { stationCode: true } } },
  });
  const byNumber = new Map(rows.map((row) => [row.employeeNumber, row]));
  const bySeniority = new Map(rows.map((row) => [row.seniority, row]));
  for (const { place, row } of plan.crew) {
    const taken = byNumber.get(row.employeeNumber);
    if (taken) {
      problems.push(
        `${place}.id "${row.employeeNumber}": employee number ${row.employeeNumber} is already in the database (${taken.name}, ${taken.position} at ${taken.base.stationCode})`,
      );
    }
    const holder = bySeniority.get(row.seniority);
    if (holder && holder.employeeNumber !== row.employeeNumber) {
      problems.push(`${place}.seniority ${row.seniority}: seniority number ${row.seniority} is held by employee ${holder.employeeNumber} in the database`);
    }
  }
}

/**
 * Throws AppError("conflict") listing every clash with the database, each
 * naming its place in the bundle: a station with another zone or longitude, a
 * period id or (base, start date) already taken, an employee or seniority
 * number already held.
 */
export async function refuseConflicts(tx: DbTx, plan: ImportPlan): Promise<void> {
  // The same locks as "New period" and a CSV import take: the base row, and the carrier's crew list.
  await tx.$queryRaw`SELECT id FROM "Base" WHERE "stationCode" = ${plan.baseCode} FOR UPDATE`;
  await tx.$executeRawUnsafe(`SELECT pg_advisory_xact_lock(${CREW_LIST_LOCK})`);
  const problems: string[] = [];
  await stationConflicts(tx, plan, problems);
  await periodConflicts(tx, plan, problems);
  await crewConflicts(tx, plan, problems);
  if (problems.length > 0) {
    throw new AppError("conflict", `the bundle cannot be imported: ${problems.join("; ")}`, { issues: problems });
  }
}

/** The id of the base at `plan.baseCode`, created when the carrier has none there yet. */
export async function baseId(tx: DbTx, plan: ImportPlan): Promise<string> {
  const found = await tx.base.findUnique({ where: { stationCode: plan.baseCode }, select: { id: true } });
  if (found) return found.id;
  return (await tx.base.create({ data: { stationCode: plan.baseCode, name: plan.baseName }, select: { id: true } })).id;
}

function sameDocument(stored: unknown, document: RuleSet): boolean {
  const parsed = ruleSetSchema.safeParse(stored);
  return parsed.success && canonicalJson(parsed.data) === canonicalJson(document);
}

/**
 * The RuleSet row of each document, in order. A row with the document's name
 * and the identical document is reused. When the name is taken by another
 * document, the import keeps the bundle's rules (the period's awards must be
 * reproducible with them) in a row named "<name> (variant <first 8 hex digits
 * of the document's hash>)"; the document itself is stored unchanged, so the
 * export gives back the bundle's own. Importing the same variant again reuses it.
 */
export async function ruleSetIds(tx: DbTx, documents: RuleSet[]): Promise<string[]> {
  const ids: string[] = [];
  for (const document of documents) {
    const names = [document.name, `${document.name} (variant ${sha256Hex(document).slice(0, 8)})`];
    let id: string | undefined;
    for (const name of names) {
      const row = await tx.ruleSet.findUnique({ where: { name } });
      if (!row) {
        const data = { name, preset: document.preset, document: JSON.parse(JSON.stringify(document)) as Prisma.InputJsonValue };
        id = (await tx.ruleSet.create({ data, select: { id: true } })).id;
        break;
      }
      if (sameDocument(row.document, document)) {
        id = row.id;
        break;
      }
    }
    if (id === undefined) {
      throw new AppError("conflict", `rule set "${document.name}": both "${names[0]}" and "${names[1]}" hold other documents`);
    }
    ids.push(id);
  }
  return ids;
}
