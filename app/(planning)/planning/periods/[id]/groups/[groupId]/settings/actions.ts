"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requireRole } from "@/lib/auth/session";
import { saveGroupSettings } from "@/lib/db/group-settings";
import { isAppError } from "@/lib/domain/index";
import { errorMessage } from "@/app/ui/error-message";

/** The answer of a save: a status, and on refusal each bad field's message by field ("settings.timeLimitSeconds", "rules.credit-window"). */
export type SettingsState = { status: "done" | "refused"; message: string; fields?: Record<string, string> } | undefined;

const id = z.string().min(1).max(64);

/** "Save" on the rule-set and settings screen: the whole form, as JSON in `payload`, checked and saved by lib/db. */
export async function saveSettingsAction(_previous: SettingsState, form: FormData): Promise<SettingsState> {
  const user = await requireRole("scheduler", "admin");
  const groupId = id.safeParse(form.get("groupId"));
  if (!groupId.success) return { status: "refused", message: "The request named no award group; nothing was saved." };
  let payload: unknown;
  try {
    payload = JSON.parse(String(form.get("payload") ?? ""));
  } catch {
    return { status: "refused", message: "The form could not be read; nothing was saved." };
  }
  try {
    const outcome = await saveGroupSettings(groupId.data, user.id, payload);
    revalidatePath(`/planning/periods/${outcome.periodId}`);
    revalidatePath(`/planning/periods/${outcome.periodId}/groups/${groupId.data}/settings`);
    return { status: "done", message: outcome.message };
  } catch (error) {
    const fields = isAppError(error, "invalid") ? (error.details?.fields as Record<string, string> | undefined) : undefined;
    return { status: "refused", message: errorMessage(error), fields };
  }
}
