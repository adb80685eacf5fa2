"use client";

import { useActionState, useEffect, useRef, useState } from "react";
import { useRouter } from "next/navigation";
import type { RunSummary } from "@/lib/db/award-runs";
import { cancelRunAction } from "../../actions";
import { elapsed, PHASE_LABEL, STATE_LABEL } from "../../run-labels";

const LIVE = new Set(["queued", "running"]);

/**
 * The run's live progress bar: polls the run every second while it is waiting
 * or running, and reloads the page (its results) once it ends. "Cancel" asks
 * the worker to stop.
 */
export function RunProgress({ initial }: { initial: RunSummary }) {
  const router = useRouter();
  const [run, setRun] = useState(initial);
  const [offline, setOffline] = useState(false);
  const [cancel, cancelAction, cancelling] = useActionState(cancelRunAction, undefined);
  const ended = useRef(!LIVE.has(initial.state));
  useEffect(() => {
    if (!LIVE.has(initial.state)) return;
    let stopped = false;
    const poll = async () => {
      try {
        const response = await fetch(`/api/runs/${initial.id}`, { cache: "no-store" });
        if (!response.ok) throw new Error(String(response.status));
        const next = (await response.json()) as RunSummary;
        if (stopped) return;
        setOffline(false);
        setRun(next);
        if (!LIVE.has(next.state) && !ended.current) {
          ended.current = true;
          router.refresh();
        }
      } catch {
        if (!stopped) setOffline(true);
      }
    };
    const timer = setInterval(() => void poll(), 1000);
    void poll();
    return () => {
      stopped = true;
      clearInterval(timer);
    };
  }, [initial.id, initial.state, router]);

  const percent = run.state === "succeeded" ? 100 : run.progress.percent;
  const live = LIVE.has(run.state);
  return (
    <section aria-label="Progress" className="rounded-lg border border-slate-200 bg-white p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="font-medium">
          {STATE_LABEL[run.state] ?? run.state}
          {live ? ` · ${PHASE_LABEL[run.progress.phase] ?? run.progress.phase}` : ""}
          {run.cancelAsked && live ? " · stopping on request" : ""}
        </p>
        <p className="text-sm tabular-nums text-slate-600">
          {percent.toFixed(0)} % · {elapsed(run.progress.elapsedMs)}
        </p>
      </div>
      <div
        role="progressbar"
        aria-label="Award run progress"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={Math.round(percent)}
        className="mt-2 h-3 w-full overflow-hidden rounded-full bg-slate-100"
      >
        <div
          className={`h-full rounded-full ${live ? "transition-[width] duration-700" : ""} ${run.state === "failed" ? "bg-red-600" : run.state === "cancelled" ? "bg-amber-500" : "bg-sky-600"}`}
          style={{ width: `${Math.max(2, percent)}%` }}
        />
      </div>
      {run.progress.message && live ? <p className="mt-2 text-sm text-slate-600">{run.progress.message}</p> : null}
      {offline && live ? <p className="mt-2 text-sm text-amber-800">Cannot reach the server; still trying.</p> : null}
      {live && !run.cancelAsked ? (
        <form action={cancelAction} className="mt-3">
          <input type="hidden" name="runId" value={run.id} />
          <button type="submit" disabled={cancelling} className="rounded-md border border-slate-300 px-3 py-1.5 text-sm hover:bg-slate-50 disabled:opacity-60">
            Cancel run
          </button>
          {cancel?.status === "refused" ? <span role="alert" className="ml-3 text-sm text-red-700">{cancel.message}</span> : null}
        </form>
      ) : null}
    </section>
  );
}
