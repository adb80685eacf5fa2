/** Plain words for a run's state and the engine's phases. */
export const STATE_LABEL: Record<string, string> = {
  queued: "Waiting",
  running: "Running",
  succeeded: "Finished",
  failed: "Failed",
  cancelled: "Cancelled",
};

export const STATE_STYLE: Record<string, string> = {
  queued: "bg-slate-100 text-slate-700",
  running: "bg-sky-50 text-sky-800",
  succeeded: "bg-emerald-50 text-emerald-800",
  failed: "bg-red-50 text-red-800",
  cancelled: "bg-amber-50 text-amber-800",
};

export const PHASE_LABEL: Record<string, string> = {
  queued: "Waiting for a worker",
  starting: "Starting",
  prepare: "Preparing the lines",
  coverage: "Covering the trips",
  wishes: "Granting wishes",
  integer: "Choosing one line each",
  done: "Done",
};

export const POSITION_LABEL: Record<string, string> = { captain: "Captains", first_officer: "First officers", flight_attendant: "Flight attendants", purser: "Pursers" };

/** One crew member's position, in the singular. */
export const POSITION_ONE: Record<string, string> = {
  captain: "Captain",
  first_officer: "First officer",
  purser: "Purser",
  flight_attendant: "Flight attendant",
};

export const MODE_LABEL: Record<string, string> = { strict: "Strict seniority", balanced: "Weighted balance" };

/** "1 min 05 s" */
export function elapsed(ms: number): string {
  const s = Math.round(ms / 1000);
  return s < 60 ? `${s} s` : `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, "0")} s`;
}
