"use server";

import { redirect } from "next/navigation";
import { requireRole } from "@/lib/auth/session";
import { addTripWish } from "@/lib/db/bids";
import { now } from "@/lib/clock";
import { pairingIdSchema } from "@/lib/domain/index";
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
