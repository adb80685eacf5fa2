"use server";

import { redirect } from "next/navigation";
import { requireRole } from "@/lib/auth/session";
import { createPeriod } from "@/lib/db/period-create";
import { errorMessage } from "@/app/ui/error-message";

export type CreateState = { status: "refused"; message: string } | undefined;

/** "Create period": a draft for the chosen base; then its import page. */
export async function createPeriodAction(_previous: CreateState, form: FormData): Promise<CreateState> {
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
        opensDate: text("opensDate"),
        deadlineDate: text("deadlineDate"),
        deadlineTime: text("deadlineTime"),
      },
      user.id,
    ));
  } catch (error) {
    return { status: "refused", message: errorMessage(error) };
  }
  redirect(`/planning/periods/${id}/import?created=1`);
}
