/**
 * A bid period's bidding window (DESIGN.md, "Bidding window"): draft → open →
 * closed, each step an explicit action of a scheduler, audited, with an in-app
 * notice to the crew where it concerns them. (Awarded and published follow
 * from the award runs and publish.ts.)
 *
 * - Open: a draft with trips and award groups becomes visible to its crew;
 *   one period per base is open at a time.
 * - Extend: while open and before the deadline passes, to a later deadline.
 * - Close: allowed once the deadline has passed; before it only as "close
 *   early", which tells the crew. Closing freezes the bids: the last
 *   submitted version of each counts (bid-scope.ts refuses edits).
 * Each step locks the period row, so two schedulers cannot both act on the
 * state they saw.
 */
import { AppError, localDateTimeLabel } from "../domain/index";
import type { Prisma } from "./generated/client";
import { db } from "./client";

type Tx = Prisma.TransactionClient;

async function locked(tx: Tx, periodId: string) {
  await tx.$queryRaw`SELECT id FROM "BidPeriod" WHERE id = ${periodId} FOR UPDATE`;
  const period = await tx.bidPeriod.findUnique({ where: { id: periodId }, include: { _count: { select: { pairings: true, groups: true } } } });
  if (!period) throw new AppError("not_found", "no such bid period");
  return period;
}

async function audit(tx: Tx, actorUserId: string, action: string, periodId: string, detail: Record<string, string> = {}) {
  await tx.auditEvent.create({ data: { actorUserId, action, entity: "BidPeriod", entityId: periodId, detail } });
}

/** Draft → open: crew at the base can see the trips and bid until the deadline. */
export async function openBidding(periodId: string, actorUserId: string, now = new Date()): Promise<string> {
  return db().$transaction(async (tx) => {
    const period = await locked(tx, periodId);
    if (period.state !== "draft") throw new AppError("conflict", `bidding for ${period.name} has been opened already (it is ${period.state})`);
    if (period._count.pairings === 0 || period._count.groups === 0) throw new AppError("invalid", `${period.name} has no trips or no award groups yet: import them before opening bidding`);
    if (now.getTime() >= period.deadline.getTime()) throw new AppError("invalid", `the deadline of ${period.name} has passed already: set a later one before opening bidding`);
    // Crew bid in one period at a time: their pages show their base's open period. The base row's lock
    // keeps two schedulers opening two periods of one base at once from both passing this check.
    await tx.$queryRaw`SELECT id FROM "Base" WHERE id = ${period.baseId} FOR UPDATE`;
    const other = await tx.bidPeriod.findFirst({ where: { baseId: period.baseId, state: "open", id: { not: periodId } }, select: { name: true } });
    if (other) throw new AppError("conflict", `bidding for ${other.name} at this base is still open: close it before opening ${period.name}`);
    await tx.bidPeriod.update({ where: { id: periodId }, data: { state: "open", opensAt: now } });
    await audit(tx, actorUserId, "period.opened", periodId);
    const deadline = localDateTimeLabel(period.deadline.toISOString(), period.zone);
    await tx.notice.create({ data: { bidPeriodId: periodId, kind: "bidding_opened", text: `Bidding for ${period.name} is open until ${deadline}.` } });
    return `Bidding for ${period.name} is open until ${deadline}`;
  });
}

/** A later deadline, while bidding is open and the current deadline has not passed. */
export async function extendDeadline(periodId: string, deadline: Date, actorUserId: string, now = new Date()): Promise<string> {
  return db().$transaction(async (tx) => {
    const period = await locked(tx, periodId);
    if (period.state !== "open") throw new AppError("conflict", `bidding for ${period.name} is not open: its deadline cannot be extended`);
    if (now.getTime() >= period.deadline.getTime()) throw new AppError("conflict", `the deadline of ${period.name} has passed: it can no longer be extended`);
    if (deadline.getTime() <= period.deadline.getTime()) {
      throw new AppError("invalid", `the new deadline must be after the current one (${localDateTimeLabel(period.deadline.toISOString(), period.zone)})`);
    }
    await tx.bidPeriod.update({ where: { id: periodId }, data: { deadline } });
    const label = localDateTimeLabel(deadline.toISOString(), period.zone);
    await audit(tx, actorUserId, "period.deadline-extended", periodId, { from: period.deadline.toISOString(), to: deadline.toISOString() });
    await tx.notice.create({ data: { bidPeriodId: periodId, kind: "deadline_extended", text: `The bidding deadline for ${period.name} is extended to ${label}.` } });
    return `The deadline is now ${label}`;
  });
}

/** Open → closed: after the deadline, or before it with `early` (the crew are told). */
export async function closeBidding(periodId: string, actorUserId: string, options: { early?: boolean } = {}, now = new Date()): Promise<string> {
  return db().$transaction(async (tx) => {
    const period = await locked(tx, periodId);
    if (period.state !== "open") throw new AppError("conflict", `bidding for ${period.name} is not open (it is ${period.state})`);
    const before = now.getTime() < period.deadline.getTime();
    if (before && !options.early) {
      throw new AppError("conflict", `the deadline of ${period.name} (${localDateTimeLabel(period.deadline.toISOString(), period.zone)}) has not passed: confirm closing early, which tells the crew`);
    }
    await tx.bidPeriod.update({ where: { id: periodId }, data: { state: "closed", closedAt: now } });
    await audit(tx, actorUserId, before ? "period.closed-early" : "period.closed", periodId);
    if (before) {
      await tx.notice.create({ data: { bidPeriodId: periodId, kind: "closed_early", text: `Bidding for ${period.name} was closed early, at ${localDateTimeLabel(now.toISOString(), period.zone)}. Your last submitted bid counts.` } });
    }
    return `Bidding for ${period.name} is closed: each crew member's last submitted bid counts`;
  });
}

/** The latest notices for the crew of a base (newest first). */
export async function noticesForCrew(crewMemberId: string, take = 5) {
  const crew = await db().crewMember.findUnique({ where: { id: crewMemberId }, select: { baseId: true } });
  if (!crew) return [];
  const rows = await db().notice.findMany({ where: { bidPeriod: { baseId: crew.baseId } }, orderBy: { createdAt: "desc" }, take, select: { id: true, kind: true, text: true, createdAt: true, bidPeriod: { select: { zone: true } } } });
  return rows.map((r) => ({ id: r.id, kind: r.kind, text: r.text, createdAt: r.createdAt.toISOString(), zone: r.bidPeriod.zone }));
}
