"use server";

import { redirect } from "next/navigation";
import { z } from "zod";
import { requireRole } from "@/lib/auth/session";
import { addTripWish, appendWish } from "@/lib/db/bids";
import { now } from "@/lib/clock";
import { isAppError, pairingIdSchema } from "@/lib/domain/index";
import type { WishIssue } from "@/lib/db/bid-check";
import { errorMessage } from "@/app/ui/error-message";

/** "Add to my bid" on a trip's page: a trip wish for it at the end of the draft, then the bid page. */
export async function addTripToBid(_: string | null, form: FormData): Promise<string | null> {
  const user = await requireRole("crew");
  const code = pairingIdSchema.safeParse(form.get("code"));
  if (!code.success) return "that is not a trip number";
  try {
    await addTripWish(user, code.data, now());
  } catch (error) {
    return errorMessage(error);
  }
  redirect(`/bid?added=${encodeURIComponent(code.data)}`);
}

export type AddWishRefusal = { message: string; issues: WishIssue[] };

const addWishInput = z.strictObject({ wish: z.unknown() });

/**
 * "Use these filters as a trip wish" on the trip list: the wish (already read
 * with wishSchema on the phone, as the wish form does) is appended to the
 * draft on the server, which checks it again with bidSchema, then the bid page.
 */
export async function addWishFromList(raw: unknown): Promise<AddWishRefusal> {
  const user = await requireRole("crew");
  const input = addWishInput.safeParse(raw);
  if (!input.success) return { message: "The request was malformed; nothing was changed.", issues: [] };
  let rank: number;
  try {
    rank = (await appendWish(user, input.data.wish, now())).wishes.length;
  } catch (error) {
    const issues = isAppError(error, "invalid") && Array.isArray(error.details?.issues) ? (error.details.issues as WishIssue[]) : [];
    return { message: errorMessage(error), issues };
  }
  redirect(`/bid?wish=${rank}`);
}
