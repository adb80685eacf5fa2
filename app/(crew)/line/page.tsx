import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/session";
import { publishedLine } from "@/lib/db/publish";
import { hhmm, zonedDateTime } from "@/app/ui/format";
import { LegalityCaution } from "@/app/ui/legality-caution";

export const metadata: Metadata = { title: "My line" };

/** The crew member's line in the latest published award (a plain view; explanations come with the award view). */
export default async function LinePage() {
  const user = await requireRole("crew");
  const line = user.crewMemberId ? await publishedLine(user.crewMemberId) : null;
  if (!line) {
    return (
      <section>
        <h1 className="text-xl font-semibold">My line</h1>
        <p className="mt-3 text-slate-600">No award has been published for you yet.</p>
      </section>
    );
  }
  return (
    <section className="space-y-4">
      <div>
        <h1 className="text-xl font-semibold">My line · {line.period.name}</h1>
        <p className="text-sm text-slate-600">Published {zonedDateTime(line.period.publishedAt, line.period.zone)} · times in {line.period.zone}</p>
      </div>
      {line.kind === "reserve" ? (
        <p className="rounded-lg border border-slate-200 bg-white p-4">
          You hold a <strong>reserve line</strong> with {line.reserveDays.length} reserve days: {line.reserveDays.join(", ")}.
        </p>
      ) : (
        <>
          <p className="text-base">
            {line.trips.length} trips · {hhmm(line.creditMinutes)} credit
          </p>
          <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white">
            {line.trips.map((t) => (
              <li key={t.code} className="flex flex-wrap items-baseline justify-between gap-2 px-4 py-3">
                <span className="font-mono font-semibold">{t.code}</span>
                <span className="text-sm text-slate-700">
                  {zonedDateTime(t.startsAt, line.period.zone)} – {zonedDateTime(t.endsAt, line.period.zone)}
                </span>
                <span className="text-sm tabular-nums text-slate-600">{hhmm(t.creditMinutes)} credit</span>
              </li>
            ))}
          </ul>
        </>
      )}
      <LegalityCaution />
    </section>
  );
}
