"use server";

import { redirect } from "next/navigation";
import { requireRole } from "@/lib/auth/session";
import { createPeriod } from "@/lib/db/period-create";
import { errorMessage } from "@/app/ui/error-message";

/** A refusal, with what was typed so the form shows it again. */
export type CreateState = { status: "refused"; message: string; values: Record<string, string>; attempt: number } | undefined;

const FIELDS = ["baseCode", "name", "startDate", "endDate", "deadlineDate", "deadlineTime"] as const;

/** "Create period": a draft for the chosen base; then its import page. */
export async function createPeriodAction(previous: CreateState, form: FormData): Promise<CreateState> {
  const user = await requireRole("scheduler", "admin");
  const text = (name: string) => {
    const v = form.get(name);
    return typeof v === "string" && v.trim() !== "" ? v.trim() : undefined;
  };
  let id: string;
  try {
    ({ id } = await createPeriod(
      {
        baseCode: text("baseCode") ?? "",
        name: text("name"),
        startDate: text("startDate") ?? "",
        endDate: text("endDate") ?? "",
        deadlineDate: text("deadlineDate"),
        deadlineTime: text("deadlineTime"),
      },
      user.id,
    ));
  } catch (error) {
    const values = Object.fromEntries(FIELDS.map((f) => [f, text(f) ?? ""]));
    return { status: "refused", message: errorMessage(error), values, attempt: (previous?.attempt ?? 0) + 1 };
  }
  redirect(`/planning/periods/${id}/import?created=1`);
}
