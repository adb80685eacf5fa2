"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requireRole } from "@/lib/auth/session";
import { copyPreviousBid, saveDraft, submitBid, type BidVersion, type StoredDraft } from "@/lib/db/bids";
import type { WishIssue } from "@/lib/db/bid-check";
import { now } from "@/lib/clock";
import { isAppError } from "@/lib/domain/index";
import { errorMessage } from "@/app/ui/error-message";

export type Refusal = { status: "invalid"; message: string; issues: WishIssue[] } | { status: "refused"; message: string };

export type SaveOutcome = { status: "saved"; draft: StoredDraft; note?: string } | { status: "conflict"; stored: StoredDraft } | Refusal;
export type SubmitOutcome = { status: "submitted"; version: BidVersion; unchanged: boolean } | { status: "conflict"; stored: StoredDraft } | Refusal;

const saveInput = z.strictObject({ periodId: z.string().min(1), baseRevision: z.number().int().min(0), wishes: z.unknown() });
const submitInput = z.strictObject({ periodId: z.string().min(1), revision: z.number().int().min(0) });
const copyInput = z.strictObject({ periodId: z.string().min(1), baseRevision: z.number().int().min(0) });

function refusal(error: unknown): Refusal {
  if (isAppError(error, "invalid") && Array.isArray(error.details?.issues)) {
    return { status: "invalid", message: errorMessage(error), issues: error.details.issues as WishIssue[] };
  }
  return { status: "refused", message: errorMessage(error) };
}

/** Autosave: the draft's next revision, or the stored draft as a conflict. */
export async function saveDraftAction(raw: unknown): Promise<SaveOutcome> {
  const user = await requireRole("crew");
  const input = saveInput.safeParse(raw);
  if (!input.success) return { status: "refused", message: "The save was malformed; nothing was changed." };
  try {
    return await saveDraft(user, input.data, now());
  } catch (error) {
    return refusal(error);
  }
}

/** Submit: a new immutable version with its receipt. */
export async function submitBidAction(raw: unknown): Promise<SubmitOutcome> {
  const user = await requireRole("crew");
  const input = submitInput.safeParse(raw);
  if (!input.success) return { status: "refused", message: "The submission was malformed; nothing was changed." };
  try {
    const result = await submitBid(user, input.data, now());
    revalidatePath("/bid");
    return result;
  } catch (error) {
    return refusal(error);
  }
}

/** Last period's bid after the draft's wishes. */
export async function copyLastPeriodAction(raw: unknown): Promise<SaveOutcome> {
  const user = await requireRole("crew");
  const input = copyInput.safeParse(raw);
  if (!input.success) return { status: "refused", message: "The request was malformed; nothing was changed." };
  try {
    const result = await copyPreviousBid(user, input.data, now());
    if (result.status === "conflict") return { status: "conflict", stored: result.stored };
    const note = `Copied ${result.copied} ${result.copied === 1 ? "wish" : "wishes"} from last period.${result.leftBehind.length ? ` Left out: ${result.leftBehind.join("; ")}.` : ""}`;
    return { status: "saved", draft: result.draft, note };
  } catch (error) {
    return refusal(error);
  }
}
