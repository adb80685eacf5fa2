/** Award runs as the worker sees them: claim, progress, finish. */
import { db } from "./client";

/**
 * Moves a queued run to running and returns true, or returns false when the
 * run is missing or already taken: the run row is the lock, so a retried job
 * (pg-boss may retry beside a slow original) never runs twice.
 */
export async function claimRun(runId: string): Promise<boolean> {
  const { count } = await db().awardRun.updateMany({
    where: { id: runId, state: "queued" },
    data: { state: "running", startedAt: new Date(), progress: { phase: "starting", fraction: 0 } },
  });
  return count === 1;
}

export async function failRun(runId: string, message: string): Promise<void> {
  await db().awardRun.update({
    where: { id: runId },
    data: { state: "failed", error: message, finishedAt: new Date() },
  });
}
