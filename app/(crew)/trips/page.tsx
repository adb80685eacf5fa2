import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/session";
import { openPeriodForCrew } from "@/lib/db/periods";
import { zonedDateTime } from "@/app/ui/format";
import { TripBrowser } from "./trip-browser";
import { CrewNotices } from "@/app/ui/crew-notices";

export const metadata: Metadata = { title: "Trips" };

export default async function TripsPage() {
  const user = await requireRole("crew");
  const period = await openPeriodForCrew(user);
  if (!period) {
    return (
      <section>
        <CrewNotices crewMemberId={user.crewMemberId} />
        <h1 className="text-xl font-semibold">Trips</h1>
        <p className="mt-3 text-slate-600">Bidding is not open at your base right now.</p>
      </section>
    );
  }
  return (
    <section>
      <CrewNotices crewMemberId={user.crewMemberId} />
      <h1 className="text-xl font-semibold">
        {period.name} <span className="font-normal text-slate-500">· {period.baseName} ({period.baseCode})</span>
      </h1>
      <p className="mt-1 text-sm text-slate-600">
        {period.trips.length} trips for your position · bids close {zonedDateTime(period.deadline, period.zone)}
      </p>
      <p className="mt-1 text-xs text-slate-500">Times are local to {period.baseCode} ({period.zone}).</p>
      <TripBrowser trips={period.trips} />
    </section>
  );
}
