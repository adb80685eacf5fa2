/** Helpers of the award-job tests: a group's time limit, and watching a run until it settles. */
import { db } from "@/lib/db/client";
import type { RunProgress } from "@/lib/db/award-runs";

/** Sets the time limit (and optionally the mode) of the award group of `position` in the only period. */
export async function groupWithLimit(position: "captain" | "first_officer", seconds: number): Promise<string> {
  const group = await db().awardGroup.findFirstOrThrow({ where: { position } });
  const settings = { ...(group.settings as Record<string, unknown>), timeLimitSeconds: seconds };
  await db().awardGroup.update({ where: { id: group.id }, data: { settings } });
  return group.id;
}

/**
 * Polls run `runId` every 100 ms until `until` holds (or `timeoutMs` passes),
 * and returns the run with every distinct progress it saw on the way.
 */
export async function watchRun(runId: string, until: (run: { state: string; progress: RunProgress }) => boolean, timeoutMs: number) {
  const seen: RunProgress[] = [];
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const run = await db().awardRun.findUniqueOrThrow({ where: { id: runId } });
    const progress = run.progress as unknown as RunProgress;
    const last = seen.at(-1);
    if (!last || last.percent !== progress.percent || last.phase !== progress.phase || last.message !== progress.message) seen.push(progress);
    if (until({ state: run.state, progress }) || Date.now() > deadline) return { run, seen };
    await new Promise((r) => setTimeout(r, 100));
  }
}
