/**
 * Publishing a bid period's award (DESIGN.md, "Publishing again"): one run per
 * award group, all groups in one transaction, with the scheduler who reviewed
 * them recorded. Crew then see their line.
 *
 * - Only a closed, awarded or published period can be published: while
 *   bidding is open the bids may still change.
 * - Each run must have finished and be fresh: its input hash must equal the
 *   hash of the group's instance exported now. A run made before a bid, a trip
 *   or a crew member changed is stale and refused, naming the group.
 * - Publishing the runs already published is a no-op with a message, checked
 *   before freshness: a later change to the crew list does not make the
 *   published award "stale";
 *   publishing other runs replaces the award (a correction), audited as such.
 * - The period row is locked for the transaction, so two schedulers
 *   publishing at once publish once.
 * - The period's fairness-ledger entries (lib/fairness/ledger.ts) are written
 *   in the same transaction, one per crew member of each chosen run, from the
 *   balance of their latest earlier period; a correction replaces them, never
 *   adds a second set. Later periods' entries are not recomputed.
 */
import { AppError, sha256Hex } from "../domain/index";
import { ledgerFor } from "../fairness/index";
import { db } from "./client";
import type { DbTx } from "./period-db";
import { latestEarlierEntries } from "./ledger-rows";
import { exportPeriod } from "./period-export";

export type PublishOutcome = { status: "published" | "corrected" | "unchanged"; message: string };

const POSITION = { captain: "captains", first_officer: "first officers", flight_attendant: "flight attendants", purser: "pursers" } as const;

export async function publishPeriod(input: { periodId: string; runs: Record<string, string>; reviewerId: string; now?: Date }): Promise<PublishOutcome> {
  const now = input.now ?? new Date();
  // The export reads many tables: done before the transaction, and compared again inside it.
  const bundle = await exportPeriod(db(), input.periodId);
  return db().$transaction(async (tx) => {
    await tx.$queryRaw`SELECT id FROM "BidPeriod" WHERE id = ${input.periodId} FOR UPDATE`;
    const period = await tx.bidPeriod.findUnique({ where: { id: input.periodId }, include: { groups: true } });
    if (!period) throw new AppError("not_found", "no such bid period");
    if (period.state === "draft" || period.state === "open") {
      throw new AppError("conflict", `bidding for ${period.name} is ${period.state === "open" ? "still open" : "not open yet"}: close it before publishing`);
    }
    // The runs already published, again: nothing to check or change (even if the crew list has changed since).
    const sameRuns = Object.keys(input.runs).length === period.groups.length && period.groups.every((g) => g.chosenRunId !== null && input.runs[g.id] === g.chosenRunId);
    if (period.state === "published" && sameRuns) {
      return { status: "unchanged", message: `${period.name} is already published with these runs; nothing was changed` };
    }
    const chosen = new Map<string, string>();
    for (const group of period.groups) {
      const label = POSITION[group.position];
      const runId = input.runs[group.id];
      if (!runId) throw new AppError("invalid", `choose a finished run for the ${label} before publishing`);
      const run = await tx.awardRun.findUnique({ where: { id: runId }, select: { awardGroupId: true, state: true, instanceHash: true, preview: true } });
      if (!run || run.awardGroupId !== group.id) throw new AppError("invalid", `the run chosen for the ${label} is not one of theirs`);
      if (run.state !== "succeeded") throw new AppError("conflict", `the run chosen for the ${label} has not finished`);
      if (run.preview) throw new AppError("conflict", `the run chosen for the ${label} is a preview: run the award itself to publish`);
      const instance = bundle.instances.find((i) => i.group.position === group.position);
      if (!instance || sha256Hex(instance) !== run.instanceHash) {
        throw new AppError("conflict", `the run chosen for the ${label} is stale: the period's bids, trips or crew changed after it ran; run the award again`);
      }
      chosen.set(group.id, runId);
    }
    const extra = Object.keys(input.runs).filter((g) => !chosen.has(g));
    if (extra.length) throw new AppError("invalid", "a run was chosen for an award group this period does not have");
    const correction = period.state === "published";
    // A run may be chosen by one group only (chosenRunId is unique): clear, then set.
    await tx.awardGroup.updateMany({ where: { bidPeriodId: period.id }, data: { chosenRunId: null } });
    for (const [groupId, runId] of chosen) {
      await tx.awardGroup.update({ where: { id: groupId }, data: { chosenRunId: runId } });
      await tx.awardRun.update({ where: { id: runId }, data: { reviewedById: input.reviewerId } });
    }
    await tx.bidPeriod.update({ where: { id: period.id }, data: { state: "published", publishedAt: now } });
    await writeLedger(tx, period.id, period.startDate, [...chosen.values()]);
    await tx.notice.create({
      data: correction
        ? { bidPeriodId: period.id, kind: "award_corrected", text: `The award for ${period.name} was corrected: see your line again.` }
        : { bidPeriodId: period.id, kind: "award_published", text: `The award for ${period.name} is published: see your line.` },
    });
    await tx.auditEvent.create({
      data: {
        actorUserId: input.reviewerId,
        action: correction ? "period.corrected" : "period.published",
        entity: "BidPeriod",
        entityId: period.id,
        detail: Object.fromEntries(chosen),
      },
    });
    return correction
      ? { status: "corrected", message: `${period.name}: the corrected award is published and replaces the earlier one` }
      : { status: "published", message: `${period.name} is published: crew now see their lines` };
  });
}

/** The period's ledger entries from its chosen runs, replacing any it had. */
async function writeLedger(tx: DbTx, periodId: string, startDate: Date, runIds: string[]): Promise<void> {
  await tx.fairnessEntry.deleteMany({ where: { bidPeriodId: periodId } });
  const lines = await tx.awardedLine.findMany({ where: { awardRunId: { in: runIds } }, select: { awardRunId: true, crewMemberId: true, satisfaction: true } });
  const earlier = await latestEarlierEntries(tx, lines.map((l) => l.crewMemberId), startDate);
  const previous = new Map([...earlier].map(([id, e]) => [id, e.balance]));
  for (const runId of runIds) {
    const steps = ledgerFor(lines.filter((l) => l.awardRunId === runId), previous);
    await tx.fairnessEntry.createMany({
      data: [...steps].map(([crewMemberId, step]) => ({ crewMemberId, bidPeriodId: periodId, awardRunId: runId, ...step })),
    });
  }
}

/** The period's ledger as its page shows it: each crew member's satisfaction, balance and the weight carried forward, most owed first. */
export async function periodLedger(periodId: string) {
  const rows = await db().fairnessEntry.findMany({
    where: { bidPeriodId: periodId },
    orderBy: [{ balance: "desc" }, { crewMember: { seniority: "asc" } }],
    select: { satisfaction: true, balance: true, carriedWeight: true, crewMember: { select: { name: true, seniority: true, position: true } } },
  });
  return rows.map((r) => ({ name: r.crewMember.name, seniority: r.crewMember.seniority, position: r.crewMember.position, satisfaction: r.satisfaction, balance: r.balance, carriedWeight: r.carriedWeight }));
}

/** A crew member's line in the latest published period of their base, or null when none is published. */
export async function publishedLine(crewMemberId: string) {
  const line = await db().awardedLine.findFirst({
    where: { crewMemberId, awardRun: { chosenFor: { bidPeriod: { state: "published" } } } },
    orderBy: { awardRun: { awardGroup: { bidPeriod: { startDate: "desc" } } } },
    select: {
      kind: true, pairingCodes: true, reserveDays: true, creditMinutes: true,
      awardRun: { select: { awardGroup: { select: { bidPeriod: { select: { id: true, name: true, zone: true, publishedAt: true } } } } } },
    },
  });
  if (!line) return null;
  const period = line.awardRun.awardGroup.bidPeriod;
  const trips = await db().pairing.findMany({
    where: { bidPeriodId: period.id, code: { in: line.pairingCodes } },
    orderBy: { startsAt: "asc" },
    select: { code: true, startsAt: true, endsAt: true, creditMinutes: true },
  });
  return {
    period: { name: period.name, zone: period.zone, publishedAt: period.publishedAt!.toISOString() },
    kind: line.kind,
    creditMinutes: line.creditMinutes,
    reserveDays: line.reserveDays,
    trips: trips.map((t) => ({ code: t.code, startsAt: t.startsAt.toISOString(), endsAt: t.endsAt.toISOString(), creditMinutes: t.creditMinutes })),
  };
}
