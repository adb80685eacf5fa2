"use client";

import { useActionState } from "react";
import { biddingStepAction } from "../../actions";
import { ActionMessage } from "../../action-message";

/** One step of the bidding window: a confirmation to tick, then the button. */
function Step({ periodId, step, label, confirm, children }: { periodId: string; step: "open" | "extend" | "close"; label: string; confirm: string; children?: React.ReactNode }) {
  const [state, action, pending] = useActionState(biddingStepAction, undefined);
  return (
    <form action={action} aria-label={label} className="space-y-2 rounded-md border border-slate-200 p-3">
      <input type="hidden" name="periodId" value={periodId} />
      <input type="hidden" name="step" value={step} />
      {children}
      <label className="flex items-start gap-2 text-sm">
        <input type="checkbox" name="confirmed" value="yes" required className="mt-1" />
        <span>{confirm}</span>
      </label>
      <button type="submit" disabled={pending} className="rounded-md bg-slate-900 px-3 py-1.5 text-sm font-semibold text-white hover:bg-slate-700 disabled:opacity-60">
        {label}
      </button>
      <ActionMessage state={state} />
    </form>
  );
}

export function BiddingSteps({ periodId, state, zone, deadlinePassed, name }: { periodId: string; state: string; zone: string; deadlinePassed: boolean; name: string }) {
  if (state === "draft") {
    return <Step periodId={periodId} step="open" label="Open bidding" confirm={`Open bidding for ${name}: its crew can see the trips and bid, and are told so.`} />;
  }
  if (state !== "open") return <p className="text-sm text-slate-600">Bidding is closed; each crew member&apos;s last submitted bid counts.</p>;
  return (
    <div className="grid gap-3 md:grid-cols-2">
      {!deadlinePassed ? (
        <Step periodId={periodId} step="extend" label="Extend the deadline" confirm="Extend the deadline: the crew are told the new one.">
          <input type="hidden" name="zone" value={zone} />
          <div className="flex flex-wrap gap-2 text-sm">
            <label>
              New date <input type="date" name="date" required className="ml-1 rounded border border-slate-300 px-2 py-1" />
            </label>
            <label>
              Time ({zone}) <input type="time" name="time" required defaultValue="18:00" className="ml-1 rounded border border-slate-300 px-2 py-1" />
            </label>
          </div>
        </Step>
      ) : null}
      <Step
        periodId={periodId}
        step="close"
        label={deadlinePassed ? "Close bidding" : "Close bidding early"}
        confirm={deadlinePassed ? "Close bidding: the bids are frozen for the award." : "Close bidding before the deadline: the crew are told, and the bids are frozen as they stand."}
      >
        {!deadlinePassed ? <input type="hidden" name="early" value="yes" /> : null}
      </Step>
    </div>
  );
}
