/**
 * The award worker: takes award-run jobs off the queue and runs them with the
 * award engine in a thread of its own (lib/award's solveAwardInThread), writing
 * progress as it goes and the results at the end (lib/db/award-runs.ts).
 *
 * While the engine works, a heartbeat renews the run's lease every few seconds
 * and stores the latest progress; it also reads whether "Cancel" was pressed,
 * and then stops the engine. A run that fails is closed with the reason; the
 * job itself then completes, since retrying a failed award gives the same
 * failure. A worker that dies leaves its job active until pg-boss expires it
 * and retries it, and the retry takes the run over once its lease has lapsed.
 */
import type PgBoss from "pg-boss";
import { solveAwardInThread, type Progress } from "../award/index";
import { isAppError } from "../domain/index";
import { claimRun, failRun, finishRun, heartbeat, markCancelled, type Claim, type RunProgress } from "../db/award-runs";
import { AWARD_QUEUE, type AwardJob } from "./queue";

export interface WorkerOptions {
  /** how often the heartbeat renews the lease, stores progress and looks for a cancel (default 1 s) */
  heartbeatMs?: number;
}

/** Runs one claimed run to its end; never throws for a failure of the run itself. */
export async function workRun(runId: string, log: (l: string) => void, options: WorkerOptions = {}): Promise<void> {
  let claim: Claim;
  try {
    claim = await claimRun(runId);
    if (claim.kind === "held") {
      // Perhaps a retry after its worker died: wait for the lease to lapse once (a live worker renews it).
      const wait = Math.max(0, claim.leaseUntil.getTime() - Date.now()) + 200;
      await new Promise((r) => setTimeout(r, wait));
      claim = await claimRun(runId);
    }
  } catch (e) {
    await failRun(runId, `the run's instance cannot be read: ${e instanceof Error ? e.message : String(e)}`);
    return;
  }
  if (claim.kind === "gone") {
    log(`award run ${runId}: finished, cancelled or gone: skipped`);
    return;
  }
  // A live worker holds it: fail this job, so pg-boss retries it later in case that worker dies too.
  if (claim.kind === "held") throw new Error(`award run ${runId} is held by a live worker`);
  const { instance, claim: token } = claim;
  const started = performance.now();
  let latest: RunProgress = { phase: "starting", percent: 0, message: "Starting", elapsedMs: 0 };
  let changed = false;
  const controller = new AbortController();
  let beating = Promise.resolve();
  const beat = () => {
    beating = beating.then(async () => {
      const { stop } = await heartbeat(runId, token, changed ? { ...latest, elapsedMs: Math.round(performance.now() - started) } : undefined);
      changed = false;
      if (stop && !controller.signal.aborted) {
        log(`award run ${runId}: stopping (cancel asked, or the run is no longer ours)`);
        controller.abort();
      }
    }).catch((e: unknown) => log(`award run ${runId}: heartbeat failed: ${e instanceof Error ? e.message : String(e)}`));
  };
  const timer = setInterval(beat, options.heartbeatMs ?? 1000);
  try {
    const result = await solveAwardInThread(instance, {
      signal: controller.signal,
      onProgress: (p: Progress) => {
        latest = { phase: p.phase, percent: Math.round(p.percent * 10) / 10, message: p.message, elapsedMs: 0 };
        changed = true;
      },
    });
    clearInterval(timer);
    await beating;
    const written = await finishRun(runId, token, result, Math.round(performance.now() - started));
    log(`award run ${runId}: ${written ? "results written" : "finished, but the run was no longer ours: results dropped"}`);
  } catch (e) {
    clearInterval(timer);
    await beating;
    if (controller.signal.aborted && isAppError(e, "conflict")) {
      await markCancelled(runId, token);
      log(`award run ${runId}: stopped (cancelled, or taken over by another worker)`);
    } else {
      const message = e instanceof Error ? e.message : String(e);
      await failRun(runId, message, token);
      log(`award run ${runId}: failed: ${message}`);
    }
  }
}

/** Registers the handler on the award queue: one run at a time per worker process. */
export async function startAwardWorker(boss: PgBoss, log: (l: string) => void, options: WorkerOptions = {}): Promise<void> {
  await boss.work<AwardJob>(AWARD_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1 }, async (jobs) => {
    for (const job of jobs) await workRun(job.data.runId, log, options);
  });
}
