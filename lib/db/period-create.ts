/**
 * Creating a bid period for a base (a draft with no trips yet): its dates, the
 * base's time zone, the bidding window, and one award group per position the
 * base's crew hold. Trips and crew come next, by import (period-csv-import.ts).
 *
 * Decisions (where the design was silent):
 * - A group starts from the same position's group of the base's latest earlier
 *   period (its rule set and settings), so a scheduler's choices carry from
 *   month to month; a base with no earlier period starts from the preset for
 *   the position (lib/rules presetFor) and the default settings.
 * - A base with no crew yet gets its groups when crew are imported.
 * - Periods of one base may not overlap; a period is 1 to 42 days.
 */
import { z } from "zod";
import { AppError, addDays, atLocalTime, daysBetween, localDateSchema, localDateTimeLabel, monthLabel, type Position } from "../domain/index";
import { presetFor, presetRuleSet } from "../rules/index";
import { db } from "./client";
import type { DbTx } from "./period-db";
import { defaultBiddingWindow } from "./period-import";
import { ruleSetIds } from "./period-import-database";
import { dateColumn } from "./period-export-rows";
import type { Prisma } from "./generated/client";

const localTime = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, { message: "expected a time such as 18:00" });

export const createPeriodInput = z
  .strictObject({
    baseCode: z.string().min(1, "choose a base"),
    name: z.string().trim().max(80, "a name has at most 80 characters").optional(),
    startDate: localDateSchema,
    endDate: localDateSchema,
    /** base local; default: see defaultBiddingWindow */
    opensDate: localDateSchema.optional(),
    deadlineDate: localDateSchema.optional(),
    deadlineTime: localTime.optional(),
  })
  .superRefine((v, ctx) => {
    const days = daysBetween(v.startDate, v.endDate) + 1;
    if (days < 1) ctx.addIssue({ code: "custom", path: ["endDate"], message: "the last day is before the first day" });
    else if (days > 42) ctx.addIssue({ code: "custom", path: ["endDate"], message: `a period is at most 42 days; this one is ${days}` });
    if (v.deadlineDate && v.deadlineDate >= v.startDate) ctx.addIssue({ code: "custom", path: ["deadlineDate"], message: "bidding must close before the period starts" });
    if (v.deadlineTime && !v.deadlineDate) ctx.addIssue({ code: "custom", path: ["deadlineDate"], message: "a deadline time needs its date" });
    if (v.opensDate && v.deadlineDate && v.opensDate > v.deadlineDate) ctx.addIssue({ code: "custom", path: ["opensDate"], message: "bidding must open on or before its deadline" });
  });
export type CreatePeriodInput = z.input<typeof createPeriodInput>;

const FIELD_LABEL: Record<string, string> = {
  baseCode: "Base",
  name: "Name",
  startDate: "First day",
  endDate: "Last day",
  opensDate: "Opens on",
  deadlineDate: "Deadline date",
  deadlineTime: "Deadline time",
};

/** The bases a period can be created for, with their zones. */
export async function basesForPeriods(): Promise<Array<{ code: string; name: string; zone: string; crew: number }>> {
  const bases = await db().base.findMany({ orderBy: { stationCode: "asc" }, include: { station: true, _count: { select: { crew: true } } } });
  return bases.map((b) => ({ code: b.stationCode, name: b.name, zone: b.station.zone, crew: b._count.crew }));
}

/** What a new group of `position` at `baseId` starts from (see the decisions above). */
async function groupStart(tx: DbTx, baseId: string, before: Date, position: Position): Promise<{ ruleSetId: string; settings: Prisma.InputJsonValue }> {
  const earlier = await tx.awardGroup.findFirst({
    where: { position, bidPeriod: { baseId, startDate: { lt: before } } },
    orderBy: { bidPeriod: { startDate: "desc" } },
    select: { ruleSetId: true, settings: true },
  });
  if (earlier) return { ruleSetId: earlier.ruleSetId, settings: earlier.settings as Prisma.InputJsonValue };
  const [ruleSetId] = await ruleSetIds(tx, [presetRuleSet(presetFor(position))]);
  return { ruleSetId: ruleSetId!, settings: {} };
}

/** Adds the groups `positions` lack to `periodId` (inside the caller's transaction); returns the positions added. */
export async function ensureGroups(tx: DbTx, periodId: string, positions: Iterable<Position>): Promise<Position[]> {
  const period = await tx.bidPeriod.findUniqueOrThrow({ where: { id: periodId }, select: { baseId: true, startDate: true, groups: { select: { position: true } } } });
  const have = new Set(period.groups.map((g) => g.position));
  const added: Position[] = [];
  for (const position of new Set(positions)) {
    if (have.has(position)) continue;
    const start = await groupStart(tx, period.baseId, period.startDate, position);
    await tx.awardGroup.create({ data: { bidPeriodId: periodId, position, ...start } });
    added.push(position);
  }
  return added;
}

/** Creates a draft period; refuses, writing nothing, with AppError("invalid" | "conflict" | "not_found"). */
export async function createPeriod(input: unknown, actorUserId: string): Promise<{ id: string; message: string }> {
  const parsed = createPeriodInput.safeParse(input);
  if (!parsed.success) {
    // Named as the form names them.
    const lines = parsed.error.issues.map((i) => `${FIELD_LABEL[String(i.path[0])] ?? String(i.path[0])}: ${i.message}`);
    throw new AppError("invalid", `the new period was not created: ${lines.join("; ")}`, { issues: lines });
  }
  const v = parsed.data;
  const base = await db().base.findUnique({ where: { stationCode: v.baseCode }, include: { station: true } });
  if (!base) throw new AppError("not_found", `there is no base ${v.baseCode}`);
  const zone = base.station.zone;
  const window = defaultBiddingWindow(v.startDate, zone);
  const opensAt = v.opensDate ? atLocalTime(v.opensDate, "00:00", zone) : window.opensAt;
  const deadline = v.deadlineDate ? atLocalTime(v.deadlineDate, v.deadlineTime ?? "18:00", zone) : window.deadline;
  if (Date.parse(deadline) <= Date.parse(opensAt)) throw new AppError("invalid", "the new period: bidding must open before its deadline");
  const name = v.name || monthName(v.startDate, v.endDate);
  return db().$transaction(async (tx) => {
    // One base's periods do not overlap: lock the base so two schedulers cannot both create one.
    await tx.$queryRaw`SELECT id FROM "Base" WHERE id = ${base.id} FOR UPDATE`;
    const clash = await tx.bidPeriod.findFirst({
      where: { baseId: base.id, startDate: { lte: dateColumn(v.endDate) }, endDate: { gte: dateColumn(v.startDate) } },
      select: { name: true },
    });
    if (clash) throw new AppError("conflict", `${base.stationCode} already has a period over those days: ${clash.name}`);
    const period = await tx.bidPeriod.create({
      data: {
        baseId: base.id,
        name,
        startDate: dateColumn(v.startDate),
        endDate: dateColumn(v.endDate),
        zone,
        opensAt: new Date(opensAt),
        deadline: new Date(deadline),
        state: "draft",
      },
      select: { id: true },
    });
    const positions = await tx.crewMember.findMany({ where: { baseId: base.id }, distinct: ["position"], select: { position: true } });
    const groups = await ensureGroups(tx, period.id, positions.map((p) => p.position));
    await tx.auditEvent.create({
      data: { actorUserId, action: "period.created", entity: "BidPeriod", entityId: period.id, detail: { base: base.stationCode, startDate: v.startDate, endDate: v.endDate, groups } },
    });
    return {
      id: period.id,
      message: `${name} at ${base.stationCode} is a draft: bidding ${localDateTimeLabel(opensAt, zone)} to ${localDateTimeLabel(deadline, zone)}. Import its trips next.`,
    };
  });
}

/** "March 2027" for a calendar month, else "3 Mar – 30 Mar 2027". */
function monthName(start: string, end: string): string {
  const d = (s: string) => new Date(`${s}T12:00:00Z`);
  const whole = start.endsWith("-01") && addDays(end, 1).endsWith("-01") && start.slice(0, 7) === end.slice(0, 7);
  if (whole) return monthLabel(start);
  const f = (s: string) => d(s).toLocaleDateString("en-GB", { day: "numeric", month: "short", timeZone: "UTC" });
  return `${f(start)} – ${f(end)} ${end.slice(0, 4)}`;
}
