"use client";

import Link from "next/link";
import { memo, useEffect, useMemo, useRef, useState, useTransition } from "react";
import type { TripSummary } from "@/lib/domain/trip-summary";
import { hhmm, shortDate } from "@/app/ui/format";
import { wishSchema } from "@/lib/domain/wish";
import { wishSentence } from "@/lib/domain/wish-sentence";
import { addWishFromList } from "./actions";
import { activeFilters, asTripFilter, emptyFilter, filterErrors, filterTrips, type ListFilter, type SortKey } from "./trip-list-filter";

const WEEKDAYS = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];
const field = "mt-1 block w-full rounded-md border border-slate-400 bg-white px-3 py-2.5 text-base";
const badField = "mt-1 block w-full rounded-md border border-red-700 bg-white px-3 py-2.5 text-base ring-1 ring-red-700";
const chip = (on: boolean) =>
  `min-h-11 min-w-11 rounded-md border px-3 text-base font-medium ${on ? "border-sky-800 bg-sky-800 text-white" : "border-slate-400 bg-white text-slate-900"}`;

/**
 * Cards rendered at first and added per step. With several hundred trips,
 * rendering them all made the page heavy to load and every filter change slow
 * on a phone (DEVELOPERS.md has the figures); the rest follow as the list is
 * scrolled (or "Show more" is tapped). Filters and search always read every trip.
 */
const STEP = 40;

/** The period's trips with search, filters and sort, all on the phone. */
export function TripBrowser({ trips }: { trips: TripSummary[] }) {
  const [filter, setFilterState] = useState<ListFilter>(emptyFilter);
  const [sort, setSortState] = useState<SortKey>("date");
  const [limit, setLimit] = useState(STEP);
  const shown = useMemo(() => filterTrips(trips, filter, sort), [trips, filter, sort]);
  const stations = useMemo(() => [...new Set(trips.flatMap((t) => t.layovers))].sort(), [trips]);
  // A new filter or order starts again at the top of the list.
  const setFilter = (next: ListFilter | ((f: ListFilter) => ListFilter)) => {
    setFilterState(next);
    setLimit(STEP);
  };
  const setSort = (next: SortKey) => {
    setSortState(next);
    setLimit(STEP);
  };
  const set = <K extends keyof ListFilter>(key: K, value: ListFilter[K]) => setFilter((f) => ({ ...f, [key]: value }));
  const toggle = (key: "lengths" | "daysOfWeek", n: number) =>
    setFilter((f) => ({ ...f, [key]: f[key].includes(n) ? f[key].filter((x) => x !== n) : [...f[key], n] }));
  const more = useRef<HTMLDivElement>(null);
  const hasMore = shown.length > limit;
  useEffect(() => {
    const el = more.current;
    if (!el || !hasMore || typeof IntersectionObserver === "undefined") return;
    const io = new IntersectionObserver((entries) => {
      if (entries.some((e) => e.isIntersecting)) setLimit((n) => n + STEP);
    }, { rootMargin: "600px 0px" });
    io.observe(el);
    return () => io.disconnect();
  }, [hasMore, limit]);
  const active = activeFilters(filter);
  const errors = filterErrors(filter);

  return (
    <div className="mt-4">
      <div className="flex gap-2">
        <label className="min-w-0 flex-1">
          <span className="sr-only">Search by trip number or station</span>
          <input
            type="search"
            value={filter.q}
            onChange={(e) => set("q", e.target.value)}
            placeholder="Trip or station"
            className={`${field} mt-0`}
          />
        </label>
        <label className="w-36 shrink-0">
          <span className="sr-only">Sort</span>
          <select value={sort} onChange={(e) => setSort(e.target.value as SortKey)} className={`${field} mt-0`}>
            <option value="date">By date</option>
            <option value="credit">Most credit</option>
            <option value="creditPerDay">Most credit per day</option>
            <option value="length">Longest</option>
            <option value="report">Earliest report</option>
          </select>
        </label>
      </div>

      <details className="mt-3 rounded-lg border border-slate-300 bg-white">
        <summary className="flex min-h-12 cursor-pointer items-center px-4 text-base font-medium">
          Filters{active > 0 ? ` (${active} on)` : ""}
        </summary>
        <div className="space-y-4 border-t border-slate-200 px-4 py-4">
          <fieldset>
            <legend className="text-sm font-medium text-slate-800">Length</legend>
            <div className="mt-1 flex flex-wrap gap-2">
              {[1, 2, 3, 4].map((n) => (
                <button key={n} type="button" aria-pressed={filter.lengths.includes(n)} onClick={() => toggle("lengths", n)} className={chip(filter.lengths.includes(n))}>
                  {n === 4 ? "4+ days" : n === 1 ? "1 day" : `${n} days`}
                </button>
              ))}
            </div>
          </fieldset>
          <label className="block">
            <span className="text-sm font-medium text-slate-800">Layover at</span>
            <select value={filter.layover} onChange={(e) => set("layover", e.target.value)} className={field}>
              <option value="">Any station</option>
              {stations.map((s) => (
                <option key={s} value={s}>
                  {s}
                </option>
              ))}
            </select>
          </label>
          <div className="grid grid-cols-2 gap-3">
            <label className="block">
              <span className="text-sm font-medium text-slate-800">Report at or after</span>
              <input type="time" value={filter.reportAfter} onChange={(e) => set("reportAfter", e.target.value)} className={field} />
            </label>
            <label className="block">
              <span className="text-sm font-medium text-slate-800">Release by</span>
              <input type="time" value={filter.releaseBefore} onChange={(e) => set("releaseBefore", e.target.value)} className={field} />
            </label>
          </div>
          <fieldset>
            <legend className="text-sm font-medium text-slate-800">Touches any of these days</legend>
            <div className="mt-1 flex flex-wrap gap-2">
              {WEEKDAYS.map((d, k) => (
                <button key={d} type="button" aria-pressed={filter.daysOfWeek.includes(k + 1)} onClick={() => toggle("daysOfWeek", k + 1)} className={chip(filter.daysOfWeek.includes(k + 1))}>
                  {d}
                </button>
              ))}
            </div>
          </fieldset>
          <div className="grid grid-cols-2 gap-3">
            <HoursInput id="creditMin" label="Credit from (h)" value={filter.creditMin} error={errors.creditMin} onChange={(v) => set("creditMin", v)} />
            <HoursInput id="creditMax" label="Credit to (h)" value={filter.creditMax} error={errors.creditMax} onChange={(v) => set("creditMax", v)} />
          </div>
          <HoursInput id="creditPerDayMin" label="Credit per duty day, at least (h)" value={filter.creditPerDayMin} error={errors.creditPerDayMin} onChange={(v) => set("creditPerDayMin", v)} />
          <div className="grid grid-cols-2 gap-3">
            <label className="block">
              <span className="text-sm font-medium text-slate-800">Red-eye</span>
              <select value={filter.redEye} onChange={(e) => set("redEye", e.target.value as ListFilter["redEye"])} className={field}>
                <option value="any">Either</option>
                <option value="yes">Only red-eyes</option>
                <option value="no">No red-eyes</option>
              </select>
            </label>
            <label className="block">
              <span className="text-sm font-medium text-slate-800">Deadhead</span>
              <select value={filter.deadhead} onChange={(e) => set("deadhead", e.target.value as ListFilter["deadhead"])} className={field}>
                <option value="any">Either</option>
                <option value="yes">With a deadhead</option>
                <option value="no">No deadheads</option>
              </select>
            </label>
          </div>
          <button type="button" onClick={() => setFilter({ ...emptyFilter, q: filter.q })} className="min-h-11 rounded-md border border-slate-400 px-4 text-base font-medium">
            Clear filters
          </button>
        </div>
      </details>

      <p className="mt-3 text-sm text-slate-700" aria-live="polite">
        {shown.length === trips.length ? `${trips.length} trips` : `${shown.length} of ${trips.length} trips`}
      </p>
      {active > 0 ? <WishFromFilters filter={filter} /> : null}
      <ul className="mt-2 grid gap-3 sm:grid-cols-2 lg:grid-cols-3" aria-label="Trips">
        {shown.slice(0, limit).map((t) => (
          <TripCard key={t.code} trip={t} />
        ))}
      </ul>
      {hasMore ? (
        <div ref={more} className="mt-3">
          <button type="button" onClick={() => setLimit((n) => n + STEP)} className="min-h-12 w-full rounded-md border border-slate-400 bg-white px-4 text-base font-medium">
            Show more trips ({shown.length - limit} left)
          </button>
        </div>
      ) : null}
    </div>
  );
}

function HoursInput({ id, label, value, error, onChange }: { id: string; label: string; value: string; error: string | undefined; onChange: (value: string) => void }) {
  return (
    <div>
      <label htmlFor={`filter-${id}`} className="block text-sm font-medium text-slate-800">
        {label}
      </label>
      <input
        id={`filter-${id}`}
        inputMode="decimal"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `filter-${id}-error` : undefined}
        className={error ? badField : field}
      />
      {error ? (
        <p id={`filter-${id}-error`} className="mt-1 text-sm font-medium text-red-800">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/**
 * "Use these filters as a trip wish": the list's filters as a trip filter,
 * read with wishSchema (as the wish form reads its fields) and appended to the
 * bid on the server, which checks it again with bidSchema.
 */
function WishFromFilters({ filter }: { filter: ListFilter }) {
  const [pending, start] = useTransition();
  const [refusal, setRefusal] = useState<string | null>(null);
  const made = asTripFilter(filter);
  const wish = made.ok ? wishSchema.safeParse({ kind: "trip", filter: made.filter, count: 1 }) : null;
  const problem = !made.ok ? made.message : wish && !wish.success ? (wish.error.issues[0]?.message ?? "These filters do not make a wish.") : null;
  return (
    <section aria-label="Make a wish from these filters" className="mt-2 rounded-lg border border-sky-800 bg-sky-50 px-3 py-3">
      {wish?.success ? (
        <p className="text-sm text-slate-900">
          <span className="font-medium">Your wish would read:</span> <span data-wish-preview>{wishSentence(wish.data)}</span>
        </p>
      ) : null}
      {made.ok && made.leftOut.length > 0 ? <p className="mt-1 text-sm text-slate-800">A trip wish leaves out {made.leftOut.join(" and ")}.</p> : null}
      {problem ? <p className="text-sm font-medium text-red-800">{problem}</p> : null}
      {refusal ? (
        <p role="alert" className="mt-1 text-sm font-medium text-red-800">
          {refusal}
        </p>
      ) : null}
      <button
        type="button"
        disabled={!wish?.success || pending}
        onClick={() =>
          start(async () => {
            if (!wish?.success) return;
            setRefusal(null);
            const outcome = await addWishFromList({ wish: wish.data });
            // On success the action moves to the bid page; only a refusal comes back.
            if (outcome) setRefusal(outcome.message);
          })
        }
        className="mt-2 min-h-12 w-full rounded-md bg-sky-800 px-4 text-base font-semibold text-white hover:bg-sky-900 disabled:opacity-50"
      >
        {pending ? "Adding…" : "Use these filters as a trip wish"}
      </button>
    </section>
  );
}

/** One trip; memoised, since a filter change keeps most cards as they were. */
const TripCard = memo(function TripCard({ trip }: { trip: TripSummary }) {
  const dates = trip.startDate === trip.endDate ? shortDate(trip.startDate) : `${shortDate(trip.startDate)} – ${shortDate(trip.endDate)}`;
  return (
    <li data-trip={trip.code} style={{ contentVisibility: "auto", containIntrinsicSize: "auto 7rem" }}>
      <Link href={`/trips/${trip.code}`} className="block rounded-lg border border-slate-300 bg-white px-4 py-3 shadow-sm hover:border-sky-700 focus-visible:outline-2 focus-visible:outline-sky-700">
        <span className="flex items-baseline justify-between gap-2">
          <span className="font-mono text-base font-semibold text-sky-900">{trip.code}</span>
          <span className="text-sm text-slate-700">
            {trip.days === 1 ? "1 day" : `${trip.days} days`} · <span className="font-mono text-slate-900">{hhmm(trip.creditMinutes)}</span> credit
          </span>
        </span>
        <span className="mt-0.5 block text-sm font-medium">
          {dates}
          {trip.redEye ? <span className="ml-2 rounded bg-slate-800 px-1.5 py-0.5 text-xs font-medium text-white">red-eye</span> : null}
        </span>
        <span className="mt-1.5 flex flex-wrap gap-x-4 gap-y-0.5 text-sm text-slate-800">
          <span>
            <span className="text-slate-600">Report</span> <span className="font-mono">{trip.report}</span>
          </span>
          <span>
            <span className="text-slate-600">Release</span> <span className="font-mono">{trip.release}</span>
          </span>
          <span>
            <span className="text-slate-600">Layovers</span> {trip.layovers.length ? trip.layovers.join(", ") : "none"}
          </span>
          <span>
            <span className="text-slate-600">Legs</span> {trip.legs}
            {trip.deadheads ? ` (${trip.deadheads} deadhead)` : ""}
          </span>
        </span>
      </Link>
    </li>
  );
});
