"use client";

import { useActionState } from "react";
import { ActionMessage } from "../../action-message";
import { createPeriodAction } from "./actions";

const field = "mt-1 block w-full rounded-md border border-slate-300 px-2 py-1.5";

export function CreatePeriodForm({ bases, startDate, endDate }: { bases: Array<{ code: string; name: string; zone: string; crew: number }>; startDate: string; endDate: string }) {
  const [state, action, pending] = useActionState(createPeriodAction, undefined);
  // After a refusal the form is drawn again (a new key) with what was typed.
  const v = (name: string, fallback = "") => state?.values[name] ?? fallback;
  return (
    <form key={state?.attempt ?? 0} action={action} aria-label="New bid period" className="max-w-xl space-y-4 rounded-lg border border-slate-200 bg-white p-4">
      <label className="block text-sm font-medium">
        Base
        <select name="baseCode" required className={field} defaultValue={v("baseCode", bases[0]?.code)}>
          {bases.map((b) => (
            <option key={b.code} value={b.code}>
              {b.code} · {b.name} ({b.zone}, {b.crew} crew)
            </option>
          ))}
        </select>
      </label>
      <div className="grid gap-3 sm:grid-cols-2">
        <label className="block text-sm font-medium">
          First day
          <input type="date" name="startDate" required defaultValue={v("startDate", startDate)} className={field} />
        </label>
        <label className="block text-sm font-medium">
          Last day
          <input type="date" name="endDate" required defaultValue={v("endDate", endDate)} className={field} />
        </label>
      </div>
      <label className="block text-sm font-medium">
        Name <span className="font-normal text-slate-500">(optional; a calendar month is named after itself)</span>
        <input type="text" name="name" maxLength={80} defaultValue={v("name")} className={field} />
      </label>
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium">Bidding deadline, base local time</legend>
        <p className="text-sm text-slate-600">
          Leave these empty for the usual deadline: 18:00, 19 days after the first day&apos;s date in the month before (the 20th of the month before, for a period starting on the 1st). Bidding opens when you open it on the period&apos;s page.
        </p>
        <div className="grid gap-3 sm:grid-cols-2">
          <label className="block text-sm">
            Deadline date
            <input type="date" name="deadlineDate" defaultValue={v("deadlineDate")} className={field} />
          </label>
          <label className="block text-sm">
            Deadline time
            <input type="time" name="deadlineTime" defaultValue={v("deadlineTime")} className={field} />
          </label>
        </div>
      </fieldset>
      <p className="text-sm text-slate-600">The period starts as a draft with one award group per position the base&apos;s crew hold, each with the rule set and settings of the base&apos;s last period. Crew see nothing until you open bidding.</p>
      <button type="submit" disabled={pending} className="rounded-md bg-slate-900 px-3 py-1.5 text-sm font-semibold text-white hover:bg-slate-700 disabled:opacity-60">
        Create period
      </button>
      <ActionMessage state={state} />
    </form>
  );
}
