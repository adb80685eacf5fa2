/**
 * Award runs: requested by a scheduler, claimed and worked by the award worker
 * (lib/jobs/award-worker.ts), finished with their results. The run row is the
 * source of truth; the pg-boss job only carries its id.
 *
 * - A run keeps its instance snapshot (the period export of its award group
 *   when it was requested), the SHA-256 of that snapshot's RFC 8785 canonical
 *   JSON, its settings, its progress, and then its award and solver statistics.
 * - A worker claims a run with a lease and renews it while it works. A job
 *   retried after its worker died (pg-boss expires the job) may take the run
 *   over once the lease has lapsed; a live worker's run is never taken.
 * - Results are written in one transaction, and only by the worker that holds
 *   the run: a run cancelled meanwhile stays cancelled, and no other run or
 *   published award is touched.
 */
import type PgBoss from "pg-boss";
import { AppError, awardSchema, instanceSchema, sha256Hex, wishListSchema, type Instance } from "../domain/index";
import type { AwardResult, Progress } from "../award/index";
import { AWARD_QUEUE, type AwardJob } from "../jobs/queue";
import type { Prisma } from "./generated/client";
import { fairnessReport as fairnessOf } from "../fairness/index";
import { db } from "./client";
import { reviewRun } from "./run-review";

/** A document as Prisma stores JSON: plain data, with non-finite numbers (an unproven bound's Infinity) as null. */
const json = (value: unknown): Prisma.InputJsonValue =>
  JSON.parse(JSON.stringify(value, (_key, v: unknown) => (typeof v === "number" && !Number.isFinite(v) ? null : v))) as Prisma.InputJsonValue;
import { exportPeriod } from "./period-export";

/** How long a claim holds without renewal (the worker renews it every few seconds). */
export const LEASE_SECONDS = 30;
/** The queue job outlives the run's own time limit by this much before pg-boss retries it elsewhere. */
export const EXPIRY_MARGIN_SECONDS = 120;

/** What the run page shows while the worker works: phase, percent of the run, message, time so far. */
export interface RunProgress {
  phase: Progress["phase"] | "queued" | "starting";
  percent: number;
  message: string;
  elapsedMs: number;
}

/**
 * Queues a run of award group `groupId` on the period as it stands: its
 * instance is exported now (the bids are each crew member's last submitted
 * version), hashed and stored with the run, and one job goes on the queue.
 */
export async function requestRun(
  boss: PgBoss,
  input: {
    groupId: string;
    requestedById?: string | null;
    /** a preview while bidding is open (crew see its verdict on their own wishes) */
    preview?: boolean;
    /** seconds the job outlives the time limit (tests shorten it) */
    expiryMarginSeconds?: number;
  },
): Promise<{ runId: string; instanceHash: string }> {
  const group = await db().awardGroup.findUnique({ where: { id: input.groupId }, select: { id: true, bidPeriodId: true, position: true, bidPeriod: { select: { state: true } } } });
  if (!group) throw new AppError("not_found", `no award group ${input.groupId}`);
  if (group.bidPeriod.state === "draft") throw new AppError("conflict", "bidding has not opened yet, and a run reads the crew's bids: open bidding first (a preview then runs on the bids submitted so far)");
  if (input.preview && group.bidPeriod.state !== "open") throw new AppError("conflict", "a preview runs while bidding is open; once it is closed, run the award itself");
  const bundle = await exportPeriod(db(), group.bidPeriodId);
  const instance = bundle.instances.find((i) => i.group.position === group.position);
  if (!instance) throw new AppError("internal", `the export of period ${group.bidPeriodId} has no instance for ${group.position}`);
  const instanceHash = sha256Hex(instance);
  const run = await db().awardRun.create({
    data: {
      awardGroupId: group.id,
      settings: json(instance.settings),
      instance: json(instance),
      instanceHash,
      requestedById: input.requestedById ?? null,
      preview: input.preview ?? false,
      progress: { phase: "queued", percent: 0, message: "Waiting for a worker", elapsedMs: 0 } satisfies RunProgress,
    },
  });
  const expireInSeconds = Math.ceil(instance.settings.timeLimitSeconds) + (input.expiryMarginSeconds ?? EXPIRY_MARGIN_SECONDS);
  const jobId = await boss.send(AWARD_QUEUE, { runId: run.id } satisfies AwardJob, { expireInSeconds, retryLimit: 2, retryDelay: 1 });
  if (!jobId) {
    await failRun(run.id, "the award queue refused the job");
    throw new AppError("internal", "the award queue refused the job");
  }
  await db().awardRun.update({ where: { id: run.id }, data: { jobId } });
  return { runId: run.id, instanceHash };
}

/** What a claim found: the run's instance, now this worker's; a run finished or gone; a run a live worker holds. */
export type Claim = { kind: "claimed"; instance: Instance; claim: Date } | { kind: "gone" } | { kind: "held"; leaseUntil: Date };

/**
 * Takes a run for this worker. The run row is the lock, so a retried job
 * (pg-boss may retry beside a slow original) never runs a run twice at once:
 * a queued run is taken, and so is a running one whose lease has lapsed (its
 * worker died); a run held by a live worker is "held"; a finished, cancelled
 * or missing run is "gone". The claim's start time (`startedAt`) is the
 * holder's token: heartbeats, results and closing by a worker name it, so a
 * worker whose run was taken over writes nothing more.
 */
export async function claimRun(runId: string, now = new Date()): Promise<Claim> {
  const leaseUntil = new Date(now.getTime() + LEASE_SECONDS * 1000);
  const { count } = await db().awardRun.updateMany({
    where: { id: runId, cancelRequestedAt: null, OR: [{ state: "queued" }, { state: "running", leaseUntil: { lt: now } }] },
    data: {
      state: "running",
      startedAt: now,
      leaseUntil,
      progress: { phase: "starting", percent: 0, message: "Starting", elapsedMs: 0 } satisfies RunProgress,
    },
  });
  const run = await db().awardRun.findUnique({ where: { id: runId }, select: { instance: true, state: true, leaseUntil: true, cancelRequestedAt: true } });
  if (count === 1 && run) return { kind: "claimed", instance: instanceSchema.parse(run.instance), claim: now };
  if (run?.state === "running" && run.leaseUntil && run.leaseUntil >= now) return { kind: "held", leaseUntil: run.leaseUntil };
  // A run whose worker died after "Cancel" was pressed ends as cancelled, not run again.
  if (run?.state === "running") await db().awardRun.updateMany({ where: { id: runId, state: "running", leaseUntil: { lt: now } }, data: { state: "cancelled", finishedAt: now, leaseUntil: null } });
  return { kind: "gone" };
}

/**
 * Stores progress (when given) and renews the lease. Returns whether the run
 * should stop: cancel was asked for, or the run is no longer this worker's.
 */
export async function heartbeat(runId: string, claim: Date, progress?: RunProgress, now = new Date()): Promise<{ stop: boolean }> {
  const { count } = await db().awardRun.updateMany({
    where: { id: runId, state: "running", startedAt: claim },
    data: { leaseUntil: new Date(now.getTime() + LEASE_SECONDS * 1000), ...(progress ? { progress: { ...progress } } : {}) },
  });
  if (count !== 1) return { stop: true };
  const run = await db().awardRun.findUniqueOrThrow({ where: { id: runId }, select: { cancelRequestedAt: true } });
  return { stop: run.cancelRequestedAt !== null };
}

/**
 * Writes a run's results in one transaction: the award document, the solver
 * statistics and report, one awarded line per crew member, state succeeded.
 * Does nothing (and returns false) when the run is no longer running — it was
 * cancelled, or another worker holds it.
 */
export async function finishRun(runId: string, claim: Date, result: AwardResult, elapsedMs: number): Promise<boolean> {
  const award = awardSchema.parse(result.award);
  return db().$transaction(async (tx) => {
    const run = await tx.awardRun.findUnique({ where: { id: runId }, select: { state: true, startedAt: true } });
    if (!run || run.state !== "running" || run.startedAt?.getTime() !== claim.getTime()) return false;
    const crew = await tx.crewMember.findMany({
      where: { employeeNumber: { in: award.lines.map((l) => l.crewId) } },
      select: { id: true, employeeNumber: true },
    });
    const idOf = new Map(crew.map((c) => [c.employeeNumber, c.id]));
    const missing = award.lines.filter((l) => !idOf.has(l.crewId)).map((l) => l.crewId);
    if (missing.length) throw new AppError("invalid", `the award names crew the database does not know: ${missing.join(", ")}`);
    await tx.awardedLine.deleteMany({ where: { awardRunId: runId } });
    await tx.awardedLine.createMany({
      data: award.lines.map((l) => ({
        awardRunId: runId,
        crewMemberId: idOf.get(l.crewId)!,
        kind: l.kind,
        pairingCodes: l.pairings,
        reserveDays: l.reserveDays,
        creditMinutes: l.creditMinutes,
        score: l.score,
        satisfaction: l.satisfaction,
      })),
    });
    await tx.awardRun.update({
      where: { id: runId },
      data: {
        state: "succeeded",
        award: json(award),
        stats: json({ ...result.stats, report: result.report }),
        finishedAt: new Date(),
        leaseUntil: null,
        progress: { phase: "done", percent: 100, message: "Done", elapsedMs } satisfies RunProgress,
      },
    });
    // A closed period whose every award group now has a finished run is awarded (ready to review and publish).
    const period = await tx.bidPeriod.findFirst({ where: { groups: { some: { runs: { some: { id: runId } } } } }, select: { id: true, state: true, groups: { select: { runs: { where: { state: "succeeded" }, select: { id: true }, take: 1 } } } } });
    if (period?.state === "closed" && period.groups.every((g) => g.runs.length > 0)) await tx.bidPeriod.update({ where: { id: period.id }, data: { state: "awarded" } });
    return true;
  });
}

/** Closes a queued or running run as failed with a message saying why (a finished run, or one another worker holds, is left as it is). */
export async function failRun(runId: string, message: string, claim?: Date): Promise<void> {
  await db().awardRun.updateMany({
    where: { id: runId, state: { in: ["queued", "running"] }, ...(claim ? { startedAt: claim } : {}) },
    data: { state: "failed", error: message, finishedAt: new Date(), leaseUntil: null },
  });
}

/** Closes a run its worker stopped on request as cancelled. */
export async function markCancelled(runId: string, claim: Date): Promise<void> {
  await db().awardRun.updateMany({
    where: { id: runId, state: "running", startedAt: claim, cancelRequestedAt: { not: null } },
    data: { state: "cancelled", finishedAt: new Date(), leaseUntil: null },
  });
}

/**
 * "Cancel": a queued run is cancelled at once (its job then finds nothing to
 * claim); a running one is asked to stop, and its worker closes it as
 * cancelled at its next check. A finished run cannot be cancelled.
 */
export async function cancelRun(runId: string, now = new Date()): Promise<"cancelled" | "stopping"> {
  const queued = await db().awardRun.updateMany({ where: { id: runId, state: "queued" }, data: { state: "cancelled", cancelRequestedAt: now, finishedAt: now } });
  if (queued.count === 1) return "cancelled";
  const running = await db().awardRun.updateMany({ where: { id: runId, state: "running" }, data: { cancelRequestedAt: now } });
  if (running.count === 1) return "stopping";
  const run = await db().awardRun.findUnique({ where: { id: runId }, select: { state: true } });
  if (!run) throw new AppError("not_found", `no award run ${runId}`);
  throw new AppError("conflict", `the run has ${run.state === "succeeded" ? "finished" : run.state === "failed" ? "failed" : "been cancelled"} already: there is nothing to cancel`);
}

/** A run as the planning pages list it. */
export interface RunSummary {
  id: string;
  state: "queued" | "running" | "succeeded" | "failed" | "cancelled";
  progress: RunProgress;
  error: string | null;
  createdAt: string;
  finishedAt: string | null;
  requestedBy: string | null;
  cancelAsked: boolean;
  mode: string;
  timeLimitSeconds: number;
  preview: boolean;
}

const summarySelect = {
  id: true, state: true, progress: true, error: true, createdAt: true, finishedAt: true, settings: true, cancelRequestedAt: true, preview: true,
  requestedBy: { select: { name: true } },
} as const;

function summary(run: {
  id: string; state: RunSummary["state"]; progress: unknown; error: string | null; createdAt: Date; finishedAt: Date | null; settings: unknown; cancelRequestedAt: Date | null; preview: boolean;
  requestedBy: { name: string } | null;
}): RunSummary {
  const settings = (run.settings ?? {}) as { mode?: string; timeLimitSeconds?: number };
  const progress = run.progress as Partial<RunProgress>;
  return {
    id: run.id,
    state: run.state,
    progress: { phase: progress.phase ?? "queued", percent: progress.percent ?? 0, message: progress.message ?? "", elapsedMs: progress.elapsedMs ?? 0 },
    error: run.error,
    createdAt: run.createdAt.toISOString(),
    finishedAt: run.finishedAt?.toISOString() ?? null,
    requestedBy: run.requestedBy?.name ?? null,
    cancelAsked: run.cancelRequestedAt !== null,
    mode: settings.mode ?? "strict",
    timeLimitSeconds: settings.timeLimitSeconds ?? 0,
    preview: run.preview,
  };
}

/** A bid period's award groups with their settings and runs, newest run first. */
export async function periodRuns(periodId: string) {
  const period = await db().bidPeriod.findUnique({
    where: { id: periodId },
    include: {
      base: { select: { stationCode: true } },
      groups: { orderBy: { position: "asc" }, include: { runs: { orderBy: { createdAt: "desc" }, select: summarySelect } } },
    },
  });
  if (!period) throw new AppError("not_found", "no such bid period");
  return {
    id: period.id,
    name: period.name,
    baseCode: period.base.stationCode,
    state: period.state,
    zone: period.zone,
    deadline: period.deadline.toISOString(),
    groups: period.groups.map((g) => {
      const settings = (g.settings ?? {}) as { mode?: string; timeLimitSeconds?: number };
      return { id: g.id, position: g.position, chosenRunId: g.chosenRunId, mode: settings.mode ?? "strict", timeLimitSeconds: settings.timeLimitSeconds ?? 600, runs: g.runs.map(summary) };
    }),
  };
}

/** One run with its group and period, and (when it succeeded) its award and report. */
export async function runDetail(runId: string) {
  const run = await db().awardRun.findUnique({
    where: { id: runId },
    select: { ...summarySelect, award: true, stats: true, instance: true, instanceHash: true, awardGroup: { select: { position: true, bidPeriod: { select: { id: true, name: true, zone: true } } } } },
  });
  if (!run) throw new AppError("not_found", "no such award run");
  const award = run.award ? awardSchema.parse(run.award) : null;
  const report = (run.stats as { report?: { openPositions?: number; openCreditMinutes?: number; provenOptimal?: boolean; warnings?: string[] } } | null)?.report ?? null;
  const crew = award
    ? await db().crewMember.findMany({ where: { employeeNumber: { in: award.lines.map((l) => l.crewId) } }, select: { employeeNumber: true, name: true, seniority: true } })
    : [];
  const review = award ? reviewRun(instanceSchema.parse(run.instance), award) : null;
  return { ...summary(run), instanceHash: run.instanceHash, position: run.awardGroup.position, period: run.awardGroup.bidPeriod, award, report, crew, review };
}

/** What the progress bar polls: state, progress and error of one run. */
export async function runStatus(runId: string): Promise<RunSummary> {
  const run = await db().awardRun.findUnique({ where: { id: runId }, select: summarySelect });
  if (!run) throw new AppError("not_found", "no such award run");
  return summary(run);
}

/** An audit entry for a scheduler's action on a run. */
export async function auditRun(actorUserId: string, action: "award-run.requested" | "award-run.cancel", runId: string, detail: Record<string, string> = {}): Promise<void> {
  await db().auditEvent.create({ data: { actorUserId, action, entity: "AwardRun", entityId: runId, detail } });
}

/** Two finished runs of one award group side by side: the totals of each, and every crew member whose line differs. */
export async function compareRuns(firstId: string, secondId: string) {
  const load = async (id: string) => {
    const run = await db().awardRun.findUnique({ where: { id }, select: { id: true, state: true, awardGroupId: true, createdAt: true, settings: true, award: true } });
    if (!run) throw new AppError("not_found", `no award run ${id}`);
    if (run.state !== "succeeded" || !run.award) throw new AppError("conflict", "only finished runs can be compared");
    return { ...run, award: awardSchema.parse(run.award) };
  };
  const [a, b] = await Promise.all([load(firstId), load(secondId)]);
  if (a.awardGroupId !== b.awardGroupId) throw new AppError("invalid", "the two runs are of different award groups: compare runs of one group");
  const crew = await db().crewMember.findMany({
    where: { employeeNumber: { in: [...new Set([...a.award.lines, ...b.award.lines].map((l) => l.crewId))] } },
    select: { employeeNumber: true, name: true, seniority: true },
  });
  const who = new Map(crew.map((c) => [c.employeeNumber, c]));
  const totals = (award: typeof a.award) => {
    const report = fairnessOf(award.lines.map((l) => ({ seniority: who.get(l.crewId)?.seniority ?? 0, satisfaction: l.satisfaction })));
    return {
      openPositions: award.openPairings.reduce((t, o) => t + o.positionsOpen, 0),
      openCreditMinutes: award.openPairings.reduce((t, o) => t + o.openCreditMinutes, 0),
      reserveLines: award.lines.filter((l) => l.kind === "reserve").length,
      meanSatisfaction: report.mean,
      jain: report.jain,
      gini: report.gini,
    };
  };
  const byCrew = new Map(b.award.lines.map((l) => [l.crewId, l]));
  const changed = a.award.lines.flatMap((l) => {
    const other = byCrew.get(l.crewId);
    if (other && other.kind === l.kind && other.pairings.join(" ") === l.pairings.join(" ")) return [];
    const c = who.get(l.crewId);
    return [{
      crewId: l.crewId,
      name: c?.name ?? l.crewId,
      seniority: c?.seniority ?? 0,
      first: { kind: l.kind, pairings: l.pairings, satisfaction: l.satisfaction },
      second: other ? { kind: other.kind, pairings: other.pairings, satisfaction: other.satisfaction } : null,
      satisfactionChange: (other?.satisfaction ?? 0) - l.satisfaction,
    }];
  });
  return {
    first: { id: a.id, createdAt: a.createdAt.toISOString(), totals: totals(a.award) },
    second: { id: b.id, createdAt: b.createdAt.toISOString(), totals: totals(b.award) },
    changed: changed.sort((x, y) => x.seniority - y.seniority),
  };
}

/**
 * What a crew member sees of the latest finished preview of their period:
 * for each wish of the bid version the preview read (their last submitted
 * one), whether its line grants it in full. Nothing about anyone else.
 */
export async function previewVerdict(crewMemberId: string, periodId: string) {
  const member = await db().crewMember.findUnique({ where: { id: crewMemberId }, select: { employeeNumber: true, position: true } });
  if (!member) return null;
  const run = await db().awardRun.findFirst({
    where: { preview: true, state: "succeeded", awardGroup: { bidPeriodId: periodId, position: member.position } },
    orderBy: { createdAt: "desc" },
    select: { createdAt: true, award: true, instance: true },
  });
  if (!run?.award) return null;
  const award = awardSchema.parse(run.award);
  const line = award.lines.find((l) => l.crewId === member.employeeNumber);
  const bids = (run.instance as { bids?: Record<string, unknown> }).bids ?? {};
  const wishes = wishListSchema.safeParse(bids[member.employeeNumber] ?? []);
  if (!line || !wishes.success) return null;
  const granted = new Set(line.grantedWishes);
  return {
    at: run.createdAt.toISOString(),
    kind: line.kind,
    wishes: wishes.data.map((wish, rank) => ({ rank, wish, granted: granted.has(rank) })),
  };
}
