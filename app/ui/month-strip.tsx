import { dayOfWeek, periodDates } from "@/lib/domain/time";

const WEEKDAYS = ["M", "T", "W", "T", "F", "S", "S"];
const LONG = ["Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday", "Sunday"];

/** The period's days as a calendar of weeks; the `marked` days are filled (and say so to a screen reader). */
export function MonthStrip({ start, end, marked, label }: { start: string; end: string; marked: readonly string[]; label: string }) {
  const dates = periodDates(start, end);
  const on = new Set(marked);
  const lead = dayOfWeek(start) - 1;
  return (
    <figure className="mt-4 rounded-lg border border-slate-300 bg-white px-3 py-3">
      <figcaption className="text-sm font-medium text-slate-800">{label}</figcaption>
      <div className="mt-2 grid grid-cols-7 gap-1 text-center text-xs text-slate-700" aria-hidden="true">
        {WEEKDAYS.map((d, k) => (
          <span key={k}>{d}</span>
        ))}
      </div>
      <ol className="mt-1 grid grid-cols-7 gap-1" aria-label={label}>
        {dates.map((date, k) => {
          const hit = on.has(date);
          const n = Number(date.slice(8, 10));
          return (
            <li
              key={date}
              style={k === 0 ? { gridColumnStart: lead + 1 } : undefined}
              className={`flex h-9 items-center justify-center rounded text-sm ${hit ? "bg-sky-800 font-semibold text-white" : "bg-slate-100 text-slate-800"}`}
              data-on={hit ? "true" : undefined}
            >
              <span aria-hidden="true">{n}</span>
              <span className="sr-only">
                {LONG[dayOfWeek(date) - 1]} {n}
                {hit ? ", on this trip" : ""}
              </span>
            </li>
          );
        })}
      </ol>
    </figure>
  );
}
