import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/session";
import { openPeriodForCrew, type TripSummary } from "@/lib/db/periods";
import { hhmm, shortDate, zonedDateTime } from "@/app/ui/format";

export const metadata: Metadata = { title: "Trips" };

export default async function TripsPage() {
  const user = await requireRole("crew");
  const period = await openPeriodForCrew(user);
  if (!period) {
    return (
      <section>
        <h1 className="text-xl font-semibold">Trips</h1>
        <p className="mt-3 text-slate-600">Bidding is not open at your base right now.</p>
      </section>
    );
  }
  return (
    <section>
      <h1 className="text-xl font-semibold">
        {period.name} <span className="font-normal text-slate-500">· {period.baseName} ({period.baseCode})</span>
      </h1>
      <p className="mt-1 text-sm text-slate-600">
        {period.trips.length} trips for your position · bids close {zonedDateTime(period.deadline, period.zone)}
      </p>
      <p className="mt-1 text-xs text-slate-500">Times are local to {period.baseCode} ({period.zone}).</p>
      <ul className="mt-4 grid gap-3 sm:grid-cols-2 lg:grid-cols-3" aria-label="Trips">
        {period.trips.map((t) => (
          <TripCard key={t.code} trip={t} />
        ))}
      </ul>
    </section>
  );
}

function TripCard({ trip }: { trip: TripSummary }) {
  const dates = trip.startDate === trip.endDate ? shortDate(trip.startDate) : `${shortDate(trip.startDate)} – ${shortDate(trip.endDate)}`;
  return (
    <li className="rounded-lg border border-slate-200 bg-white px-4 py-3 shadow-sm" data-trip={trip.code}>
      <div className="flex items-baseline justify-between gap-2">
        <span className="font-mono text-base font-semibold text-sky-900">{trip.code}</span>
        <span className="text-sm text-slate-600">
          {trip.days === 1 ? "1 day" : `${trip.days} days`} · <span className="font-mono text-slate-900">{hhmm(trip.creditMinutes)}</span> credit
        </span>
      </div>
      <p className="mt-0.5 text-sm font-medium">
        {dates}
        {trip.redEye ? <span className="ml-2 rounded bg-slate-800 px-1.5 py-0.5 text-xs font-medium text-white">red-eye</span> : null}
      </p>
      <dl className="mt-1.5 flex flex-wrap gap-x-4 gap-y-0.5 text-sm text-slate-700">
        <div className="flex gap-1">
          <dt className="text-slate-500">Report</dt>
          <dd className="font-mono">{trip.report}</dd>
        </div>
        <div className="flex gap-1">
          <dt className="text-slate-500">Release</dt>
          <dd className="font-mono">{trip.release}</dd>
        </div>
        <div className="flex gap-1">
          <dt className="text-slate-500">Layovers</dt>
          <dd>{trip.layovers.length ? trip.layovers.join(", ") : "none"}</dd>
        </div>
        <div className="flex gap-1">
          <dt className="text-slate-500">Legs</dt>
          <dd>
            {trip.legs}
            {trip.deadheads ? ` (${trip.deadheads} deadhead)` : ""}
          </dd>
        </div>
      </dl>
    </li>
  );
}
