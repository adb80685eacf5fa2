import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/session";
import { tripDetail } from "@/lib/db/trip-detail";
import { now } from "@/lib/clock";
import { isAppError, localDate, localTime, minutesBetween, type Leg } from "@/lib/domain/index";
import { hhmm, shortDate } from "@/app/ui/format";
import { MonthStrip } from "@/app/ui/month-strip";
import { AddToBid } from "../add-to-bid";

export async function generateMetadata({ params }: { params: Promise<{ code: string }> }): Promise<Metadata> {
  return { title: `Trip ${(await params).code}` };
}

export default async function TripPage({ params }: { params: Promise<{ code: string }> }) {
  const user = await requireRole("crew");
  const { code } = await params;
  const trip = await tripDetail(user, decodeURIComponent(code), now()).catch((error: unknown) => {
    if (isAppError(error, "not_found")) notFound();
    throw error;
  });
  const { pairing: p, zone, baseCode } = trip;
  const open = trip.biddingOpen;
  const time = (instant: string, station: string) => {
    const base = localTime(instant, zone);
    const there = trip.zones[station];
    const local = there && there !== zone ? localTime(instant, there) : base;
    return local === base ? base : `${base} (${local} ${station})`;
  };
  const leg = (l: Leg, k: number) => (
    <li key={k} className="flex flex-wrap items-baseline gap-x-3 py-2">
      <span className="font-mono text-sm text-slate-700">{l.flightNumber}</span>
      <span className="font-medium">
        {l.from} {time(l.departure, l.from)} → {l.to} {time(l.arrival, l.to)}
      </span>
      <span className="text-sm text-slate-700">
        block {hhmm(l.blockMinutes)}
        {l.deadhead ? <span className="ml-2 rounded border border-slate-500 px-1.5 text-xs font-medium">deadhead</span> : null}
      </span>
    </li>
  );
  return (
    <article className="pb-2">
      <p>
        <Link href="/trips" className="inline-flex min-h-11 items-center text-base text-sky-900 underline">
          ← All trips
        </Link>
      </p>
      <h1 className="text-2xl font-semibold">
        Trip <span className="font-mono">{p.id}</span>
      </h1>
      <p className="mt-1 text-base">
        {trip.dates.length === 1 ? shortDate(trip.dates[0]!) : `${shortDate(trip.dates[0]!)} – ${shortDate(trip.dates.at(-1)!)}`} ·{" "}
        {trip.dates.length === 1 ? "1 day" : `${trip.dates.length} days`}
        {trip.redEye ? " · red-eye" : ""}
      </p>
      <dl className="mt-3 grid grid-cols-3 gap-2 text-center">
        {[
          ["Credit", hhmm(p.creditMinutes)],
          ["Block", hhmm(p.blockMinutes)],
          ["Away from base", hhmm(p.tafbMinutes)],
        ].map(([k, v]) => (
          <div key={k} className="rounded-lg border border-slate-300 bg-white px-2 py-2">
            <dt className="text-xs text-slate-700">{k}</dt>
            <dd className="font-mono text-lg font-semibold">{v}</dd>
          </div>
        ))}
      </dl>
      <MonthStrip start={trip.periodStart} end={trip.periodEnd} marked={trip.dates} label={`Days of ${trip.periodName} this trip touches`} />
      <p className="mt-3 text-sm text-slate-700">
        Times are local to {baseCode} ({zone}); a station&apos;s own local time is in brackets where it differs.
      </p>
      <ol className="mt-3 space-y-3" aria-label="Duty periods">
        {p.dutyPeriods.map((d, k) => {
          const layover = trip.layovers[k];
          return (
            <li key={k}>
              <section className="rounded-lg border border-slate-300 bg-white px-4 py-3" aria-label={`Duty period ${k + 1}`}>
                <h2 className="text-base font-semibold">
                  Duty {k + 1} · {shortDate(localDate(d.report, zone))}
                </h2>
                <p className="text-sm text-slate-800">
                  Report <span className="font-mono">{localTime(d.report, zone)}</span> · release <span className="font-mono">{localTime(d.release, zone)}</span> · on duty{" "}
                  {hhmm(Math.round(minutesBetween(d.report, d.release)))}
                </p>
                <ul className="divide-y divide-slate-200">{d.legs.map(leg)}</ul>
              </section>
              {layover ? (
                <p className="mx-4 mt-3 rounded-md bg-slate-200 px-3 py-2 text-sm font-medium text-slate-900">
                  Layover at {layover.station} · {hhmm(layover.minutes)}
                </p>
              ) : null}
            </li>
          );
        })}
      </ol>
      <AddToBid code={p.id} inBid={trip.inBid} open={open} />
    </article>
  );
}
