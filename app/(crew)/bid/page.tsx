import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/session";
import { loadBid, periodTripCodes, previousBid } from "@/lib/db/bids";
import { now } from "@/lib/clock";
import { isAppError, localDateTimeLabel } from "@/lib/domain/index";
import { BidEditor } from "./bid-editor";
import { Countdown } from "./countdown";
import { PreviewVerdict } from "./preview-verdict";
import { previewVerdict } from "@/lib/db/award-runs";

export const metadata: Metadata = { title: "My bid" };

export default async function BidPage({ searchParams }: { searchParams: Promise<{ added?: string; wish?: string }> }) {
  const user = await requireRole("crew");
  const view = await loadBid(user).catch((error: unknown) => {
    if (isAppError(error, "not_found")) return null;
    throw error;
  });
  if (!view) {
    return (
      <section>
        <h1 className="text-xl font-semibold">My bid</h1>
        <p className="mt-3 text-slate-700">Bidding is not open at your base right now.</p>
      </section>
    );
  }
  const { scope, draft, versions } = view;
  const at = now();
  const deadline = scope.period.deadline.toISOString();
  const closed = scope.period.state !== "open" || at.getTime() >= scope.period.deadline.getTime();
  const [previous, tripCodes, verdict] = await Promise.all([
    previousBid(scope),
    periodTripCodes(scope),
    user.crewMemberId ? previewVerdict(user.crewMemberId, scope.period.id) : Promise.resolve(null),
  ]);
  const { added, wish } = await searchParams;
  // ?wish=N: wish N was just made from the trip list's filters.
  const madeRank = Number(wish);
  const made = Number.isInteger(madeRank) && madeRank >= 1 && madeRank <= draft.wishes.length ? madeRank : null;
  return (
    <section>
      <h1 className="text-xl font-semibold">My bid · {scope.period.name}</h1>
      <div className="mt-2">
        <Countdown deadline={deadline} serverNow={at.toISOString()} label={localDateTimeLabel(deadline, scope.period.zone)} />
      </div>
      {verdict ? <PreviewVerdict verdict={verdict} zone={scope.period.zone} /> : null}
      <p className="mt-2 text-sm text-slate-700">Most wanted first. Changes save by themselves; only Submit makes a version the award reads.</p>
      <BidEditor
        periodId={scope.period.id}
        crewId={scope.crewId}
        zone={scope.period.zone}
        draft={draft}
        versions={versions}
        closed={closed}
        previousPeriod={previous?.periodName ?? null}
        added={typeof added === "string" ? added : null}
        madeFromFilters={made}
        period={{ name: scope.period.name, startDate: scope.period.startDate, endDate: scope.period.endDate, tripCodes }}
      />
    </section>
  );
}
