/** The award worker: takes award-run jobs off the queue and runs them. */
import type PgBoss from "pg-boss";
import { claimRun, failRun } from "../db/award-runs";
import { AWARD_QUEUE, type AwardJob } from "./queue";

/**
 * Registers the handler. The award engine (lib/award) is not part of this
 * version yet: a claimed run is closed as failed with a message saying so,
 * rather than left queued for ever.
 */
export async function startAwardWorker(boss: PgBoss, log: (l: string) => void): Promise<void> {
  await boss.work<AwardJob>(AWARD_QUEUE, { batchSize: 1 }, async (jobs) => {
    for (const job of jobs) {
      const { runId } = job.data;
      if (!(await claimRun(runId))) {
        log(`award run ${runId}: not queued any more, skipped`);
        continue;
      }
      await failRun(runId, "this version of Bidwright has no award engine yet");
      log(`award run ${runId}: closed (no award engine yet)`);
    }
  });
}
