import { dayOfWeek } from "@/lib/domain/time";
import { hhmm } from "@/app/ui/format";

const WEEKDAYS = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];

/** Open time by base-local day as a month calendar: the darker the cell, the more open credit touches that day. */
export function CoverageCalendar({ days }: { days: readonly { date: string; openCreditMinutes: number; positions: number }[] }) {
  const most = Math.max(1, ...days.map((d) => d.openCreditMinutes));
  const lead = days.length ? dayOfWeek(days[0]!.date) - 1 : 0; // Monday first
  const shade = (minutes: number) => {
    if (minutes === 0) return "bg-emerald-50 text-emerald-900";
    const f = minutes / most;
    return f > 0.66 ? "bg-red-700 text-white" : f > 0.33 ? "bg-red-400 text-white" : "bg-red-100 text-red-950";
  };
  return (
    <figure className="rounded-lg border border-slate-200 bg-white p-3">
      <figcaption className="text-sm font-medium">Open time by day</figcaption>
      <div role="grid" aria-label="Open time by day of the period" className="mt-2 grid grid-cols-7 gap-1 text-center text-xs">
        {WEEKDAYS.map((d) => (
          <div key={d} role="columnheader" className="text-slate-500">
            {d}
          </div>
        ))}
        {Array.from({ length: lead }, (_, k) => (
          <div key={`lead${k}`} />
        ))}
        {days.map((d) => (
          <div
            key={d.date}
            role="gridcell"
            aria-label={`${d.date}: ${d.positions} open positions, ${hhmm(d.openCreditMinutes)} open`}
            title={`${d.date}: ${d.positions} open positions, ${hhmm(d.openCreditMinutes)} open`}
            className={`rounded px-1 py-1.5 ${shade(d.openCreditMinutes)}`}
          >
            <div className="font-semibold">{Number(d.date.slice(8))}</div>
            <div className="tabular-nums">{d.openCreditMinutes ? hhmm(d.openCreditMinutes) : "—"}</div>
          </div>
        ))}
      </div>
      <p className="mt-2 text-xs text-slate-500">Green: nothing open. Red: open credit of trips touching the day (darker is more).</p>
    </figure>
  );
}
