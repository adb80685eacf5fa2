import { noticesForCrew } from "@/lib/db/period-lifecycle";
import { zonedDateTime } from "@/app/ui/format";

/** The latest in-app notices for the crew member's base (bidding opened, deadline extended, closed early, award published or corrected). */
export async function CrewNotices({ crewMemberId }: { crewMemberId: string | null }) {
  if (!crewMemberId) return null;
  const notices = await noticesForCrew(crewMemberId, 3);
  if (notices.length === 0) return null;
  return (
    <section aria-label="Notices" className="mb-4 space-y-2">
      {notices.map((n) => (
        <p key={n.id} className="rounded-md border border-sky-200 bg-sky-50 px-3 py-2 text-sm text-sky-950">
          {n.text} <span className="text-xs text-sky-800">{zonedDateTime(n.createdAt, n.zone)}</span>
        </p>
      ))}
    </section>
  );
}
