"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { z } from "zod";
import { requireRole } from "@/lib/auth/session";
import { auditRun, cancelRun, requestRun } from "@/lib/db/award-runs";
import { databaseUrl } from "@/lib/env";
import { queueSender } from "@/lib/jobs/queue";
import { publishPeriod, type PublishOutcome } from "@/lib/db/publish";
import { closeBidding, extendDeadline, openBidding } from "@/lib/db/period-lifecycle";
import { atLocalTime } from "@/lib/domain/time";
import { now } from "@/lib/clock";
import { errorMessage } from "@/app/ui/error-message";

export type ActionOutcome = { status: "refused"; message: string } | undefined;

const id = z.string().min(1).max(64);

/** "Run award" for one award group: queues the run and opens its page. */
export async function runAwardAction(_previous: ActionOutcome, form: FormData): Promise<ActionOutcome> {
  const user = await requireRole("scheduler", "admin");
  const groupId = id.safeParse(form.get("groupId"));
  if (!groupId.success) return { status: "refused", message: "The request named no award group; nothing was queued." };
  let runId: string;
  try {
    const preview = form.get("preview") === "yes";
    ({ runId } = await requestRun(await queueSender(databaseUrl()), { groupId: groupId.data, requestedById: user.id, preview }));
    await auditRun(user.id, "award-run.requested", runId, { groupId: groupId.data, preview: String(preview) });
  } catch (error) {
    return { status: "refused", message: errorMessage(error) };
  }
  redirect(`/planning/runs/${runId}`);
}

/** "Cancel" on a queued or running run. */
export async function cancelRunAction(_previous: ActionOutcome, form: FormData): Promise<ActionOutcome> {
  const user = await requireRole("scheduler", "admin");
  const runId = id.safeParse(form.get("runId"));
  if (!runId.success) return { status: "refused", message: "The request named no run; nothing was changed." };
  try {
    const outcome = await cancelRun(runId.data);
    await auditRun(user.id, "award-run.cancel", runId.data, { outcome });
  } catch (error) {
    return { status: "refused", message: errorMessage(error) };
  }
  revalidatePath(`/planning/runs/${runId.data}`);
  return undefined;
}

export type PublishState = PublishOutcome | { status: "refused"; message: string } | undefined;

/** "Publish award": the chosen run of every award group, after the scheduler confirms they reviewed them. */
export async function publishAction(_previous: PublishState, form: FormData): Promise<PublishState> {
  const user = await requireRole("scheduler", "admin");
  const periodId = id.safeParse(form.get("periodId"));
  if (!periodId.success) return { status: "refused", message: "The request named no bid period; nothing was published." };
  if (form.get("reviewed") !== "yes") return { status: "refused", message: "Confirm that you reviewed the chosen runs; nothing was published." };
  const runs: Record<string, string> = {};
  for (const [key, value] of form.entries()) {
    if (key.startsWith("run:") && typeof value === "string" && value) runs[key.slice(4)] = value;
  }
  try {
    const outcome = await publishPeriod({ periodId: periodId.data, runs, reviewerId: user.id });
    revalidatePath(`/planning/periods/${periodId.data}`);
    return outcome;
  } catch (error) {
    return { status: "refused", message: errorMessage(error) };
  }
}

export type StepState = { status: "done" | "refused"; message: string } | undefined;

/** The bidding window's steps on the period page: open, extend the deadline, close (early only when confirmed). */
export async function biddingStepAction(_previous: StepState, form: FormData): Promise<StepState> {
  const user = await requireRole("scheduler", "admin");
  const periodId = id.safeParse(form.get("periodId"));
  const step = z.enum(["open", "extend", "close"]).safeParse(form.get("step"));
  if (!periodId.success || !step.success) return { status: "refused", message: "The request was malformed; nothing was changed." };
  if (form.get("confirmed") !== "yes") return { status: "refused", message: "Tick the confirmation first; nothing was changed." };
  try {
    let message: string;
    if (step.data === "open") message = await openBidding(periodId.data, user.id, now());
    else if (step.data === "close") message = await closeBidding(periodId.data, user.id, { early: form.get("early") === "yes" }, now());
    else {
      const when = z.object({ date: z.iso.date(), time: z.string().regex(/^\d{2}:\d{2}$/), zone: z.string().min(1) }).safeParse({ date: form.get("date"), time: form.get("time"), zone: form.get("zone") });
      if (!when.success) return { status: "refused", message: "Give the new deadline as a date and a time; nothing was changed." };
      message = await extendDeadline(periodId.data, new Date(atLocalTime(when.data.date, when.data.time, when.data.zone)), user.id, now());
    }
    revalidatePath(`/planning/periods/${periodId.data}`);
    return { status: "done", message };
  } catch (error) {
    return { status: "refused", message: errorMessage(error) };
  }
}
