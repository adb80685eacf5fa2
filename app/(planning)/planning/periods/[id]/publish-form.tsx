"use client";

import { useActionState } from "react";
import { publishAction } from "../../actions";
import { ActionMessage } from "../../action-message";

export interface PublishChoice {
  groupId: string;
  label: string;
  /** finished runs, newest first */
  runs: { id: string; label: string }[];
  chosenRunId: string | null;
}

/** Choose one finished run per award group, confirm the review, publish. */
export function PublishForm({ periodId, groups, published }: { periodId: string; groups: PublishChoice[]; published: boolean }) {
  const [state, action, pending] = useActionState(publishAction, undefined);
  const ready = groups.every((g) => g.runs.length > 0);
  return (
    <form action={action} className="space-y-3 rounded-lg border border-slate-200 bg-white p-4" aria-label="Publish">
      <h2 className="font-semibold">{published ? "Publish a correction" : "Publish the award"}</h2>
      <input type="hidden" name="periodId" value={periodId} />
      {groups.map((g) => (
        <label key={g.groupId} className="block text-sm">
          <span className="font-medium">{g.label}</span>
          <select name={`run:${g.groupId}`} defaultValue={g.chosenRunId ?? g.runs[0]?.id ?? ""} className="mt-1 block w-full rounded-md border border-slate-300 px-2 py-1.5" disabled={g.runs.length === 0}>
            {g.runs.length === 0 ? <option value="">No finished run yet</option> : null}
            {g.runs.map((r) => (
              <option key={r.id} value={r.id}>
                {r.label}
              </option>
            ))}
          </select>
        </label>
      ))}
      <label className="flex items-start gap-2 text-sm">
        <input type="checkbox" name="reviewed" value="yes" required className="mt-1" />
        <span>I have reviewed these runs and take responsibility for publishing them to the crew.</span>
      </label>
      <button type="submit" disabled={!ready || pending} className="rounded-md bg-slate-900 px-4 py-2 text-sm font-semibold text-white hover:bg-slate-700 disabled:opacity-60">
        {pending ? "Publishing…" : published ? "Publish correction" : "Publish award"}
      </button>
      <ActionMessage state={state} />
    </form>
  );
}
